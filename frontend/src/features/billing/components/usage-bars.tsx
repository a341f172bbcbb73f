import type { BillingOverview } from '@shared/schemas/billing';

/** Each limit as a bar: how much of the plan is used. */
export function UsageBars({ usage }: { usage: BillingOverview['usage'] }) {
  return (
    <ul className="flex flex-col gap-3">
      {usage.map((u) => {
        const fraction = u.allowed === 0 ? (u.used > 0 ? 1 : 0) : Math.min(1, u.used / u.allowed);
        const full = u.used >= u.allowed;
        return (
          <li key={u.limit} className="flex flex-col gap-1">
            <div className="flex justify-between gap-4 text-sm">
              <span className="text-ink-soft first-letter:uppercase">{u.label}</span>
              <span className="tabular-nums" data-testid={`usage-${u.limit}`}>
                {u.allowed === 0 ? `${u.used} (none on this plan)` : `${u.used} of ${u.allowed}`}
              </span>
            </div>
            <div
              role="meter"
              aria-label={`${u.label} used`}
              aria-valuemin={0}
              aria-valuemax={u.allowed}
              aria-valuenow={Math.min(u.used, u.allowed)}
              className="h-2 overflow-hidden rounded bg-paper-sunk"
            >
              <div className={`h-full ${full ? 'bg-ledger-600' : 'bg-tube-500'}`} style={{ width: `${Math.round(fraction * 100)}%` }} />
            </div>
          </li>
        );
      })}
    </ul>
  );
}
