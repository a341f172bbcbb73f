import { daysBetween } from '@shared/domain/calendar/plant-date';
import { formatDay, formatNumber, formatPercent } from '@frontend/lib/format';
import type { HealthHeadline } from '../api/get-health';
// a plan built on data older than this is flagged: the fouling since then is extrapolated, not measured
import { STALE_PLAN_DAYS } from './health-sentence';

type Outlook = NonNullable<HealthHeadline['nextCleaning']>;
type Option = NonNullable<Outlook['options']>[number];

/** Dates listed in the tile; the rest are counted. */
const LISTED_DATES = 4;

const KIND_LABEL: Record<Option['kind'], string> = { 'while-running': 'While running', 'in-an-outage': 'In an outage' };

function OptionLine({ option, money }: { option: Option; money: (v: number | null) => string }) {
  const label = KIND_LABEL[option.kind];
  if (option.status === 'no-method') return <li>{label}: no method of this kind in the library</li>;
  if (option.status === 'none-needed' || !option.first) return <li>{label}: none pays for itself this coming year</li>;
  return (
    <li>
      {label}: <span className="text-ink">{option.first.methodName}</span> from {formatDay(option.first.date)}, {money(option.savingsVersusNoCleaning)} less
      than not cleaning
    </li>
  );
}

/** Under the next-cleaning figure: whether its date has passed, what data it rests on, the plan's dates and both kinds of method. */
export function NextCleaningDetail({ outlook, today, money }: { outlook: Outlook | null; today: string; money: (v: number | null) => string }) {
  if (!outlook || outlook.status === 'not-available') return <p>{outlook?.reason ?? 'The outlook is made after the next recompute.'}</p>;
  const next = outlook.next;
  const overdue = next !== undefined && next.date < today;
  const dataAge = outlook.dataTo ? daysBetween(outlook.dataTo, today) : null;
  const plan = outlook.plan ?? [];
  return (
    <>
      {overdue && (
        <p className="font-medium text-warn" role="note" data-testid="next-cleaning-overdue">
          ⚠ This date has passed: the plan was made on {formatDay(outlook.planFrom)}. Import recent data for a current plan.
        </p>
      )}
      {!overdue && dataAge !== null && dataAge > STALE_PLAN_DAYS && (
        <p className="font-medium text-warn" role="note" data-testid="next-cleaning-stale">
          Built on data to {formatDay(outlook.dataTo)} ({formatNumber(dataAge)} days ago): fouling since then is extrapolated.
        </p>
      )}
      {next ? (
        <>
          <p className="text-ink">
            {next.methodName}
            {next.typicalValues && (
              <span
                className="ml-1 inline-block rounded border border-warn/50 bg-ledger-50 px-1 text-2xs font-medium text-warn"
                title="The method still has typical values, not your own"
              >
                typical values
              </span>
            )}
          </p>
          <p>
            CF {formatPercent(next.cleanlinessBefore, 0)} → {formatPercent(next.cleanlinessAfter, 0)}; cost {money(next.cleaningCost + next.downtimeCost)}
          </p>
        </>
      ) : (
        <p>{outlook.reason}</p>
      )}
      {plan.length > 0 && (
        <p data-testid="next-cleaning-plan">
          Plan from {formatDay(outlook.planFrom)}:{' '}
          {plan
            .slice(0, LISTED_DATES)
            .map((c) => formatDay(c.date))
            .join(', ')}
          {plan.length > LISTED_DATES && ` and ${formatNumber(plan.length - LISTED_DATES)} more`}
          {outlook.savingsVersusNoCleaning !== undefined && <>; {money(outlook.savingsVersusNoCleaning)} less than not cleaning</>}
        </p>
      )}
      {outlook.options && outlook.options.length > 0 && (
        <ul className="mt-0.5" aria-label="Best plan by kind of method" data-testid="next-cleaning-options">
          {outlook.options.map((o) => (
            <OptionLine key={o.kind} option={o} money={money} />
          ))}
        </ul>
      )}
    </>
  );
}
