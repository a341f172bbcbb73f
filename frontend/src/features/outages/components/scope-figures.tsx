import type { OutageItemView } from '@shared/schemas/outages';
import { formatCurrency } from '@frontend/lib/format';
import { criticalDays, daysText } from './outage-words';

/** A scope's totals against the outage's limits: cost against budget, the longest lane against the window. */
export function ScopeTotals({
  totalBenefit,
  totalCost,
  laneDays,
  budget,
  windowDays,
  currency,
}: {
  totalBenefit: number;
  totalCost: number;
  laneDays: Record<string, number>;
  budget: number;
  windowDays: number;
  currency: string;
}) {
  const longest = criticalDays(laneDays);
  const share = budget > 0 ? Math.min(1, totalCost / budget) : totalCost > 0 ? 1 : 0;
  const overBudget = totalCost > budget;
  const overWindow = longest > windowDays;
  return (
    <dl className="grid gap-3 sm:grid-cols-3" data-testid="outage-totals">
      <div className="flex flex-col rounded border border-rule bg-paper-raised p-3">
        <dt className="text-xs text-ink-soft">Benefit of the chosen work</dt>
        <dd className="text-lg font-semibold tabular-nums text-ledger-700" data-testid="outage-total-benefit">
          {formatCurrency(totalBenefit, currency)}
        </dd>
      </div>
      <div className="flex flex-col rounded border border-rule bg-paper-raised p-3">
        <dt className="text-xs text-ink-soft">Cost against the budget</dt>
        <dd className={`text-lg font-semibold tabular-nums ${overBudget ? 'text-fault' : ''}`} data-testid="outage-total-cost">
          {formatCurrency(totalCost, currency)} <span className="text-sm font-normal text-ink-soft">of {formatCurrency(budget, currency)}</span>
        </dd>
        <dd aria-hidden className="mt-1 h-1.5 rounded bg-paper-sunk">
          <div className={`h-1.5 rounded ${overBudget ? 'bg-fault' : 'bg-ledger-500'}`} style={{ width: `${share * 100}%` }} />
        </dd>
        <dd className="mt-1 text-xs text-ink-soft">
          {overBudget ? `${formatCurrency(totalCost - budget, currency)} over the budget` : `${formatCurrency(budget - totalCost, currency)} left`}
        </dd>
      </div>
      <div className="flex flex-col rounded border border-rule bg-paper-raised p-3">
        <dt className="text-xs text-ink-soft">Longest lane against the window</dt>
        <dd className={`text-lg font-semibold tabular-nums ${overWindow ? 'text-fault' : ''}`} data-testid="outage-critical-lane">
          {daysText(longest)} <span className="text-sm font-normal text-ink-soft">of {daysText(windowDays)}</span>
        </dd>
        <dd className="mt-1 text-xs text-ink-soft">{overWindow ? 'The work does not fit the window' : `${daysText(windowDays - longest)} to spare`}</dd>
      </div>
    </dl>
  );
}

/** Every item's reason, the chosen ones first: the optimiser explains each decision in a sentence. */
export function ScopeReasons({
  items,
  selected,
  reasons,
  currency,
}: {
  items: readonly OutageItemView[];
  selected: ReadonlySet<string>;
  reasons: Record<string, string>;
  currency: string;
}) {
  const chosen = items.filter((i) => selected.has(i.id));
  const left = items.filter((i) => !selected.has(i.id));
  const list = (title: string, these: OutageItemView[], testId: string) => (
    <section className="flex flex-col gap-1" aria-label={title}>
      <h4 className="text-sm font-semibold">
        {title} ({these.length})
      </h4>
      {these.length === 0 ? (
        <p className="text-sm text-ink-soft">None.</p>
      ) : (
        <ul className="flex flex-col divide-y divide-rule rounded border border-rule bg-paper-raised" data-testid={testId}>
          {these.map((i) => (
            <li key={i.id} className="flex flex-col gap-0.5 px-3 py-2 text-sm" data-testid="outage-reason">
              <span className="flex flex-wrap items-baseline justify-between gap-x-3">
                <span className="font-medium">{i.title}</span>
                <span className="text-xs tabular-nums text-ink-soft">
                  {formatCurrency(i.cost, currency)} · {daysText(i.durationDays)} · {i.lane} · benefit {formatCurrency(i.benefit, currency)}
                </span>
              </span>
              <span className="text-ink-soft">{reasons[i.id] ?? 'No reason was given for this item: propose again.'}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
  return (
    <div className="grid gap-3 lg:grid-cols-2">
      {list('In the scope', chosen, 'outage-chosen')}
      {list('Left out', left, 'outage-left-out')}
    </div>
  );
}
