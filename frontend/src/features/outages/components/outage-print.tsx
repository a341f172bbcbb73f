import { OUTAGE_ITEM_KIND_WORDS, type OutageView } from '@shared/schemas/outages';
import { SafetyCautions } from '@frontend/components/ui/safety-cautions';
import { formatCurrency, formatDateTime } from '@frontend/lib/format';
import { LaneChart } from './lane-chart';
import { OUTAGE_STATUS_WORDS } from './outage-status-badge';
import { cautionsGeneralFirst, criticalDays, daysText, unitsText, windowText } from './outage-words';

const th = 'border-b border-rule px-2 py-1 text-left text-xs font-medium text-ink-soft';
const td = 'border-b border-rule px-2 py-1 align-top';

/**
 * The outage-scope report for paper: window and budget, the chosen work with cost, days, lane and benefit, what
 * was left out and why, the lanes, the approver, and the cautions for the work chosen.
 */
export function OutagePrint({ outage }: { outage: OutageView }) {
  const snapshot = outage.approved;
  const shown = snapshot ?? outage.proposal;
  const items = snapshot ? snapshot.items : outage.items;
  const selected = new Set(shown?.selectedItemIds ?? []);
  const chosen = items.filter((i) => selected.has(i.id));
  const left = items.filter((i) => !selected.has(i.id));
  const money = (v: number) => formatCurrency(v, outage.currency);
  const windowDays = snapshot?.windowDays ?? outage.windowDays;
  return (
    <article className="flex flex-col gap-4 text-sm" data-testid="outage-print">
      <style>{'@page { size: A4; margin: 14mm } @media print { body { background: #fff } figure, table { break-inside: avoid } }'}</style>
      <header className="flex flex-col gap-1 border-b border-rule pb-3">
        <p className="text-xs text-ink-soft">Outage scope · {unitsText(outage.units)}</p>
        <h1>{outage.name}</h1>
        <dl className="grid grid-cols-2 gap-x-6 gap-y-0.5 text-xs sm:grid-cols-4">
          <dt className="text-ink-soft">Status</dt>
          <dd>
            {OUTAGE_STATUS_WORDS[outage.status]}
            {outage.status !== 'approved' && ' — not approved'}
          </dd>
          <dt className="text-ink-soft">Approved by</dt>
          <dd>{outage.approvedBy ? `${outage.approvedBy.name}, ${formatDateTime(outage.approvedAt)}` : '—'}</dd>
          <dt className="text-ink-soft">Window</dt>
          <dd>{windowText(snapshot?.startDate ?? outage.startDate, snapshot?.endDate ?? outage.endDate, windowDays)}</dd>
          <dt className="text-ink-soft">Budget</dt>
          <dd>{money(snapshot?.budget ?? outage.budget)}</dd>
          <dt className="text-ink-soft">Scope</dt>
          <dd>{snapshot ? snapshot.scopeName : shown ? `Latest proposal, ${formatDateTime(outage.proposal?.computedAt)}` : 'None proposed yet'}</dd>
          <dt className="text-ink-soft">Planned by</dt>
          <dd>{outage.createdBy.name}</dd>
        </dl>
      </header>
      <SafetyCautions texts={cautionsGeneralFirst(outage)} testId="outage-print-cautions" />
      {!shown ? (
        <p>No scope has been proposed for this outage yet.</p>
      ) : (
        <>
          <section>
            <h2 className="text-base font-semibold">Summary</h2>
            <p data-testid="outage-print-summary">
              {chosen.length} of {items.length} items chosen, worth {money(shown.totalBenefit)} for {money(shown.totalCost)} of the{' '}
              {money(snapshot?.budget ?? outage.budget)} budget; the longest lane takes {daysText(criticalDays(shown.laneDays))} of the {daysText(windowDays)}{' '}
              window.
              {!snapshot && outage.proposalStale && ' The work changed since this proposal: it is out of date.'}
            </p>
          </section>
          <section className="flex flex-col gap-1">
            <h2 className="text-base font-semibold">Chosen work</h2>
            <table className="w-full">
              <thead>
                <tr>
                  <th className={th}>Work</th>
                  <th className={th}>Lane</th>
                  <th className={`${th} text-right`}>Cost</th>
                  <th className={`${th} text-right`}>Days</th>
                  <th className={`${th} text-right`}>Benefit</th>
                  <th className={th}>Why</th>
                </tr>
              </thead>
              <tbody>
                {chosen.map((i) => (
                  <tr key={i.id}>
                    <td className={td}>
                      {i.title}
                      <span className="block text-2xs text-ink-faint">
                        {OUTAGE_ITEM_KIND_WORDS[i.kind]} · {i.unitName} · {i.pricing.text}
                      </span>
                    </td>
                    <td className={td}>{i.lane}</td>
                    <td className={`${td} text-right tabular-nums whitespace-nowrap`}>{money(i.cost)}</td>
                    <td className={`${td} text-right tabular-nums`}>{i.durationDays}</td>
                    <td className={`${td} text-right tabular-nums whitespace-nowrap`}>{money(i.benefit)}</td>
                    <td className={`${td} text-xs`}>{shown.reasons[i.id] ?? ''}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
          <section className="flex flex-col gap-1">
            <h2 className="text-base font-semibold">Left out, and why</h2>
            {left.length === 0 ? (
              <p>Nothing was left out.</p>
            ) : (
              <ul className="list-disc pl-5">
                {left.map((i) => (
                  <li key={i.id}>
                    <span className="font-medium">{i.title}</span> ({money(i.cost)}, {daysText(i.durationDays)}, benefit {money(i.benefit)}):{' '}
                    {shown.reasons[i.id] ?? ''}
                  </li>
                ))}
              </ul>
            )}
          </section>
          <figure className="flex flex-col gap-1">
            <figcaption className="text-base font-semibold">Lanes across the window</figcaption>
            <LaneChart items={chosen} startDate={snapshot?.startDate ?? outage.startDate} windowDays={windowDays} />
          </figure>
        </>
      )}
    </article>
  );
}
