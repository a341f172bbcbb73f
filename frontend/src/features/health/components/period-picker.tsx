import { useState, type FormEvent } from 'react';
import { DayField } from '@frontend/components/ui/day-field';
import { Button } from '@frontend/components/ui/button';
import { formatDay } from '@frontend/lib/format';
import { PERIOD_CHOICES, type PeriodSelection } from './health-period';

interface Props {
  selection: PeriodSelection;
  /** the period the server answered for, shown in words */
  shown: { from: string | null; to: string | null } | null;
  onChange: (next: PeriodSelection) => void;
}

const segment = (on: boolean) =>
  `px-2.5 py-1 text-sm border-r border-rule last:border-r-0 ${on ? 'bg-tube-600 font-medium text-white' : 'bg-paper-raised text-ink hover:bg-paper-sunk'}`;

/** Which days the page covers and how the breakdown is bucketed; both live in the address. */
export function PeriodPicker({ selection, shown, onChange }: Props) {
  const [from, setFrom] = useState(selection.from ?? shown?.from ?? '');
  const [to, setTo] = useState(selection.to ?? shown?.to ?? '');
  const [error, setError] = useState<string | null>(null);
  const custom = selection.choice === 'custom';

  const apply = (e: FormEvent) => {
    e.preventDefault();
    if (!from || !to) return setError('Give both days');
    if (from > to) return setError('The period ends before it starts');
    setError(null);
    onChange({ ...selection, choice: 'custom', from, to });
  };

  return (
    <div className="flex flex-col gap-2 rounded border border-rule bg-paper-raised px-3 py-2" data-testid="period-picker">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <div className="flex items-center gap-2">
          <span className="text-sm font-medium text-ink-soft" id="period-label">
            Days of data
          </span>
          <span className="hidden text-sm print:inline">{PERIOD_CHOICES.find((c) => c.value === selection.choice)?.label}</span>
          <div role="group" aria-labelledby="period-label" className="no-print inline-flex overflow-hidden rounded border border-rule">
            {PERIOD_CHOICES.map((c) => (
              <button
                key={c.value}
                type="button"
                aria-pressed={selection.choice === c.value}
                className={segment(selection.choice === c.value)}
                onClick={() => {
                  if (c.value === 'custom') onChange({ ...selection, choice: 'custom', from: from || shown?.from || null, to: to || shown?.to || null });
                  else onChange({ ...selection, choice: c.value, from: null, to: null });
                }}
              >
                {c.label}
              </button>
            ))}
          </div>
        </div>
        <div className="flex items-center gap-2">
          <span className="text-sm font-medium text-ink-soft" id="breakdown-label">
            Breakdown by
          </span>
          <span className="hidden text-sm print:inline">{selection.breakdownBy === 'week' ? 'Week' : 'Month'}</span>
          <div role="group" aria-labelledby="breakdown-label" className="no-print inline-flex overflow-hidden rounded border border-rule">
            {(['week', 'month'] as const).map((b) => (
              <button
                key={b}
                type="button"
                aria-pressed={selection.breakdownBy === b}
                className={segment(selection.breakdownBy === b)}
                onClick={() => onChange({ ...selection, breakdownBy: b })}
              >
                {b === 'week' ? 'Week' : 'Month'}
              </button>
            ))}
          </div>
        </div>
        <p className="text-sm text-ink" data-testid="period-span" aria-live="polite">
          {shown?.from && shown.to ? (
            <>
              {formatDay(shown.from)} – {formatDay(shown.to)}
            </>
          ) : (
            '—'
          )}
        </p>
      </div>
      {custom && (
        <form onSubmit={apply} className="no-print flex flex-wrap items-end gap-3" aria-label="Custom period">
          <DayField label="From" value={from} onChange={setFrom} />
          <DayField label="To" value={to} onChange={setTo} error={error ?? undefined} />
          <Button type="submit" variant="quiet">
            Show period
          </Button>
        </form>
      )}
    </div>
  );
}
