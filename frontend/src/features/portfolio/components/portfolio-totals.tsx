import type { PortfolioGroup, PortfolioTotals } from '@shared/schemas/portfolio';
import { formatCurrency } from '@frontend/lib/format';
import { CASE_WORDS } from './portfolio-words';

/** One block of totals: counts, open cases by status, and money per currency (never added across currencies). */
function TotalsBlock({ title, totals, testId }: { title: string; totals: PortfolioTotals; testId: string }) {
  const cases = Object.entries(totals.openCases).filter(([, n]) => n > 0);
  return (
    <section className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-3" aria-label={`Totals: ${title}`} data-testid={testId}>
      <h3 className="text-sm font-semibold">{title}</h3>
      <dl className="grid grid-cols-3 gap-2 text-sm">
        <div>
          <dt className="text-xs text-ink-soft">Units</dt>
          <dd className="tabular-nums">{totals.units}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Need attention</dt>
          <dd className={`tabular-nums ${totals.unitsWithAlerts ? 'text-warn' : ''}`}>{totals.unitsWithAlerts}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Stale data</dt>
          <dd className={`tabular-nums ${totals.staleUnits ? 'text-warn' : ''}`}>{totals.staleUnits}</dd>
        </div>
      </dl>
      {totals.money.length === 0 ? (
        <p className="text-xs text-ink-faint">No money figures yet (no unit with economics and data).</p>
      ) : (
        <table className="text-sm">
          <caption className="sr-only">Money by currency</caption>
          <thead>
            <tr className="text-xs text-ink-soft">
              <th scope="col" className="pr-2 text-left font-normal">
                Currency
              </th>
              <th scope="col" className="px-2 text-right font-normal">
                Fouling per day
              </th>
              <th scope="col" className="px-2 text-right font-normal">
                Since cleaning
              </th>
              <th scope="col" className="pl-2 text-right font-normal">
                Plans save in a year
              </th>
            </tr>
          </thead>
          <tbody>
            {totals.money.map((m) => (
              <tr key={m.currency}>
                <th scope="row" className="pr-2 text-left font-normal">
                  {m.currency} <span className="text-xs text-ink-faint">({m.units})</span>
                </th>
                <td className="px-2 text-right tabular-nums">{formatCurrency(m.foulingCostPerDay, m.currency)}</td>
                <td className="px-2 text-right tabular-nums">{formatCurrency(m.foulingCostSinceCleaning, m.currency)}</td>
                <td className="pl-2 text-right tabular-nums text-ledger-700">{formatCurrency(m.nextCleaningSavings, m.currency)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <p className="text-xs text-ink-soft">
        Open cases: {cases.length === 0 ? 'none' : cases.map(([status, n]) => `${n} ${CASE_WORDS[status as keyof typeof CASE_WORDS]}`).join(', ')}
      </p>
    </section>
  );
}

export function PortfolioTotalsPanel({ organisationName, totals, groups }: { organisationName: string; totals: PortfolioTotals; groups: PortfolioGroup[] }) {
  return (
    <div className="grid gap-3 md:grid-cols-2 xl:grid-cols-3">
      <TotalsBlock title={`${organisationName} (all units you see)`} totals={totals} testId="portfolio-totals-organisation" />
      {groups.map((g) => (
        <TotalsBlock key={g.id ?? 'none'} title={g.name} totals={g.totals} testId="portfolio-totals-group" />
      ))}
    </div>
  );
}
