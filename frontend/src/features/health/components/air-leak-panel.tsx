import { daysBetween } from '@shared/domain/calendar/plant-date';
import { formatDay, formatNumber } from '@frontend/lib/format';
import { CHART_COLOURS } from '@frontend/lib/chart-palette';
import type { AirLeakEvidence, UnitHealth } from '../api/get-health';

const EVIDENCE_WORDS: Record<AirLeakEvidence, string> = {
  'cleanliness-drop': 'cleanliness fell within days, faster than fouling grows',
  subcooling: 'the condensate ran colder than the steam (subcooling rose)',
  'dissolved-oxygen': 'dissolved oxygen in the condensate rose',
  'air-removal': 'the air-removal equipment pulled more air',
};

/** Days in a period, both ends counted. */
const days = (from: string, to: string) => daysBetween(from, to) + 1;

/** Periods that look like air getting into the condenser, with the witnesses that say so. */
export function AirLeakPanel({ periods }: { periods: UnitHealth['airLeakPeriods'] }) {
  const [firstPeriod] = periods;
  return (
    <section aria-labelledby="air-heading" className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-3" data-testid="air-leak-panel">
      <h2 id="air-heading" className="flex items-center gap-2 text-base">
        <span className="inline-block h-3 w-3 rounded-sm" style={{ background: CHART_COLOURS.airLeak }} aria-hidden />
        Suspected air in-leakage
      </h2>
      {!firstPeriod ? (
        <p className="text-sm text-ink-soft">
          None in this period. Sudden cleanliness drops with rising subcooling, dissolved oxygen or air-removal flow would be listed here.
        </p>
      ) : (
        <>
          <ul className="flex flex-col gap-2">
            {periods.map((p) => (
              <li key={p.from} className="border-l-4 pl-3 text-sm" style={{ borderColor: CHART_COLOURS.airLeak }} data-testid="air-leak-period">
                <p className="font-medium">
                  {formatDay(p.from)} – {formatDay(p.to)}{' '}
                  <span className="font-normal text-ink-soft">
                    ({formatNumber(days(p.from, p.to))} days; cleanliness down up to {formatNumber(p.maxDrop * 100, 1)} % points)
                  </span>
                </p>
                <ul className="ml-4 list-disc text-ink-soft">
                  {p.evidence.map((e) => (
                    <li key={e}>{EVIDENCE_WORDS[e] ?? e}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
          <p className="text-xs text-ink">{firstPeriod.note}</p>
        </>
      )}
    </section>
  );
}
