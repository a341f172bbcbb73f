import { Link } from 'react-router-dom';
import { linkClass } from '@frontend/components/ui/public-page';
import { formatCurrency, formatDay, formatPercent } from '@frontend/lib/format';
import type { HealthEvent } from '../api/get-health';

const KIND_WORDS: Record<HealthEvent['kind'], string> = {
  cleaning: 'Cleaning',
  'tube-plugging': 'Tube plugging',
  'air-leak-repair': 'Air in-leakage repair',
  outage: 'Outage',
  other: 'Other',
};

const SHOWN = 6;

/** The period's latest events in a few lines, with the way to the full timeline. */
export function EventsStrip({ events, unitId, currency }: { events: HealthEvent[]; unitId: string; currency: string }) {
  const latest = [...events].sort((a, b) => b.startDate.localeCompare(a.startDate)).slice(0, SHOWN);
  return (
    <div className="flex flex-col gap-2" data-testid="events-strip">
      {latest.length === 0 ? (
        <p className="text-sm text-ink-soft">No events in this period.</p>
      ) : (
        <ol className="flex flex-col text-sm">
          {latest.map((e) => (
            <li key={e.id} className="grid grid-cols-[7.5rem_1fr_auto] gap-x-3 border-b border-rule/60 py-1 last:border-0" data-testid="health-event">
              <span className="whitespace-nowrap tabular-nums text-ink-soft">
                {formatDay(e.startDate)}
                {e.endDate && e.endDate !== e.startDate && <span className="block text-2xs">to {formatDay(e.endDate)}</span>}
              </span>
              <span className="min-w-0">
                <span className={e.kind === 'cleaning' ? 'font-medium' : ''}>{KIND_WORDS[e.kind] ?? e.kind}</span>
                {e.kind === 'cleaning' && e.cleanlinessAfter !== null && <span className="text-ink-soft"> → CF {formatPercent(e.cleanlinessAfter, 0)}</span>}
                {e.notes && <span className="block truncate text-xs text-ink-soft">{e.notes}</span>}
              </span>
              <span className="text-right tabular-nums text-ledger-700">{e.cost !== null ? formatCurrency(e.cost, currency) : ''}</span>
            </li>
          ))}
        </ol>
      )}
      <Link className={`${linkClass} text-sm`} to={`/units/${unitId}/events`}>
        All events{events.length > SHOWN ? ` (${events.length} in this period)` : ''}
      </Link>
    </div>
  );
}
