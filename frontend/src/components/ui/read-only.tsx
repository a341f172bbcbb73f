import type { ReactNode } from 'react';

/**
 * The one line that stands where an action would be for someone whose role may not take it, e.g. "Only
 * administrators and analysts record events." `reason` is the shared permission text ("Only … can do this");
 * another reason is kept whole, with the action after it.
 */
export function readOnlyLine(reason: string, action: string): string {
  const who = /^Only (.+) can do this\.?$/.exec(reason.trim())?.[1];
  return who ? `Only ${who} ${action}.` : `${reason.replace(/\.$/, '')}: ${action}.`;
}

export function ReadOnlyReason({ reason, action, className = '' }: { reason: string; action: string; className?: string }) {
  return (
    <p className={`text-sm text-ink-soft ${className}`} data-testid="read-only-reason">
      {readOnlyLine(reason, action)}
    </p>
  );
}

export interface ShownValue {
  label: string;
  /** the value with its unit, already formatted; blank shows a dash */
  value: ReactNode;
  note?: string;
}

/** Saved values as text, label above value, for people who read a setup but may not change it. */
export function ValueList({ items, label, className = '' }: { items: ShownValue[]; label?: string; className?: string }) {
  return (
    <dl aria-label={label} className={`grid gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-4 ${className}`} data-testid="value-list">
      {items.map((item) => (
        <div key={item.label} className="flex flex-col">
          <dt className="text-xs text-ink-soft">{item.label}</dt>
          <dd className="text-sm font-medium tabular-nums text-ink">
            {item.value === '' || item.value === null || item.value === undefined ? '—' : item.value}
          </dd>
          {item.note && <dd className="text-xs text-ink-faint">{item.note}</dd>}
        </div>
      ))}
    </dl>
  );
}
