import { td } from '@frontend/components/ui/data-table';
import { useUnitCondition } from './unit-condition';

/** Cleanliness, fouling cost per day and data age of one unit, as three table cells. */
export function UnitConditionCells({ organisationId, unitId }: { organisationId: string; unitId: string }) {
  const c = useUnitCondition(organisationId, unitId);
  if (c.state !== 'ready') {
    return (
      <td className={`${td} text-ink-faint`} colSpan={3}>
        {c.state === 'loading' ? 'Reading the latest figures…' : 'The latest figures could not be read.'}
      </td>
    );
  }
  return (
    <>
      <td className={`${td} text-right tabular-nums whitespace-nowrap`} data-testid="unit-cleanliness">
        {c.cleanliness}
        {c.reference && <span className="block text-xs text-ink-faint">reference {c.reference}</span>}
      </td>
      <td className={`${td} text-right tabular-nums whitespace-nowrap`} data-testid="unit-cost-per-day">
        {c.costPerDay}
        {c.costNote && <span className="block text-xs text-ink-faint">{c.costNote}</span>}
        {c.physical.length > 0 && (
          <span className="block text-xs text-ink-faint" data-testid="unit-physical">
            {c.physical.map((part) => (
              <span key={part} className="block">
                {part}
              </span>
            ))}
          </span>
        )}
      </td>
      <td className={`${td} whitespace-nowrap`} data-testid="unit-data-age">
        <span className={c.stale ? 'text-warn' : ''}>{c.dataAge}</span>
        {c.lastDay && <span className="block text-xs text-ink-faint">last day {c.lastDay}</span>}
      </td>
    </>
  );
}
