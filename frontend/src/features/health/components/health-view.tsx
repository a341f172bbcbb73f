import { lazy, Suspense, useEffect, useState, type ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import type { FieldUnits } from '@frontend/lib/field-units';
import { formatDateTime } from '@frontend/lib/format';
import { useHealth } from '../api/get-health';
import { AirLeakPanel } from './air-leak-panel';
import { DataQualityPanel } from './data-quality-panel';
import { EventsStrip } from './events-strip';
import { ExportButtons } from './export-buttons';
import { HealthHeadlineStrip } from './health-headline';
import { healthQueryFor, periodFromSearch, plantDay, searchFromPeriod, type PeriodSelection } from './health-period';
import { PeriodPicker } from './period-picker';

const loadHealthCharts = () => import('./health-charts');
const HealthCharts = lazy(loadHealthCharts);
// The chart code (most of the page's bytes) is fetched as soon as this page's code runs, alongside the health
// figures, instead of once they have arrived.
void loadHealthCharts();

interface Props {
  organisationId: string;
  unit: { id: string; timeZone: string; firstSampleUtc: string | null; lastSampleUtc: string | null; currency: string };
  units: FieldUnits;
  cannotWrite: string | null;
  /** the background-work progress, shown above the figures while a recompute runs */
  progress: ReactNode;
  /** The form that records a cleaning (from the events feature), offered to those who may write. */
  addCleaning: (props: { lastDay: string | null; onAdded: () => void }) => ReactNode;
}

function useNarrow(): boolean {
  const query = '(max-width: 639px)';
  const [narrow, setNarrow] = useState(() => typeof window !== 'undefined' && window.matchMedia(query).matches);
  useEffect(() => {
    const m = window.matchMedia(query);
    const on = () => setNarrow(m.matches);
    m.addEventListener('change', on);
    return () => m.removeEventListener('change', on);
  }, []);
  return narrow;
}

export function ChartsSkeleton() {
  return (
    <div className="grid gap-3 xl:grid-cols-2" role="status" aria-label="Loading charts">
      {[0, 1, 2, 3].map((i) => (
        <div key={i} className="flex h-80 flex-col gap-3 rounded border border-rule bg-paper-raised p-3">
          <div className="h-4 w-1/2 animate-pulse rounded bg-paper-sunk" />
          <div className="h-3 w-3/4 animate-pulse rounded bg-paper-sunk" />
          <div className="flex-1 animate-pulse rounded bg-paper-sunk" />
        </div>
      ))}
    </div>
  );
}

/** The condenser health page: headline, period, charts, air in-leakage, events, data quality, downloads. */
export function HealthView({ organisationId, unit, units, cannotWrite, progress, addCleaning }: Props) {
  const [search, setSearch] = useSearchParams();
  const selection = periodFromSearch(search);
  const lastDay = unit.lastSampleUtc ? plantDay(unit.lastSampleUtc, unit.timeZone) : null;
  const query = healthQueryFor(search, unit);
  const health = useHealth(organisationId, unit.id, query);
  const narrow = useNarrow();
  const [justAdded, setJustAdded] = useState(false);

  const choose = (next: PeriodSelection) => setSearch(searchFromPeriod(next));

  if (health.isPending) return <LoadingState what="the condenser’s health" />;
  if (health.isError) return <ErrorState what="the condenser’s health" error={health.error} onRetry={() => health.refetch()} />;
  const h = health.data;

  return (
    <div className="flex flex-col gap-4" data-testid="health-view" aria-busy={health.isFetching}>
      {progress}
      {justAdded && !progress && (
        <p className="text-sm text-ok" role="status">
          Cleaning recorded; the figures below include it.
        </p>
      )}
      <HealthHeadlineStrip headline={h.headline} units={units} currency={unit.currency} timeZone={unit.timeZone} now={health.dataUpdatedAt} />
      {h.warnings.length > 0 && (
        <Notice tone="warn">
          <ul className="flex flex-col gap-1" data-testid="health-warnings">
            {h.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Notice>
      )}

      <div className="flex flex-col gap-2">
        <PeriodPicker selection={selection} shown={h.period} onChange={choose} />
        <div className="flex flex-wrap items-center justify-between gap-2">
          <ExportButtons unitId={unit.id} from={h.period.from} to={h.period.to} />
          {h.analysedAt && (
            <p className="text-2xs text-ink-faint" data-testid="figures-computed">
              Figures computed {formatDateTime(h.analysedAt)}
            </p>
          )}
        </div>
      </div>

      {h.series.length === 0 ? (
        <p className="rounded border border-dashed border-rule bg-paper-raised p-4 text-sm text-ink-soft">
          No days with data in this period: choose a longer period or “All data”.
        </p>
      ) : (
        <Suspense fallback={<ChartsSkeleton />}>
          <div className={health.isPlaceholderData ? 'opacity-60 transition-opacity' : ''}>
            <HealthCharts health={h} units={units} currency={unit.currency} narrow={narrow} />
          </div>
        </Suspense>
      )}

      <div className="grid gap-3 lg:grid-cols-2">
        <div className="flex flex-col gap-3">
          <AirLeakPanel periods={h.airLeakPeriods} />
          <section aria-labelledby="events-heading" className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-3">
            <h2 id="events-heading" className="text-base">
              Events in this period
            </h2>
            <EventsStrip events={h.events} unitId={unit.id} currency={unit.currency} />
            {cannotWrite ? (
              <p className="text-xs text-ink-soft">{cannotWrite}: recording cleanings.</p>
            ) : (
              addCleaning({ lastDay, onAdded: () => setJustAdded(true) })
            )}
          </section>
        </div>
        <DataQualityPanel quality={h.dataQuality} period={h.period} />
      </div>
    </div>
  );
}
