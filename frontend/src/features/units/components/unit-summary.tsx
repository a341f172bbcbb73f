import { Link } from 'react-router-dom';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { linkClass } from '@frontend/components/ui/public-page';
import { readOnlyLine } from '@frontend/components/ui/read-only';
import { formatStored, type FieldUnits } from '@frontend/lib/field-units';
import { formatDateTime, formatNumber, formatPercent, formatPlantTime } from '@frontend/lib/format';
import type { UnitDetail } from '../api/get-unit';
import { RecomputeStatus } from './recompute-status';

const JOB_STATUS_WORDS = { queued: 'Waiting', running: 'Running', done: 'Done', failed: 'Failed' } as const;

/** A short page about the unit: what its setup still lacks, what data it holds, what ran lately. */
export function UnitSummary({
  unit,
  units,
  showStatus = true,
  cannotWrite = null,
}: {
  unit: UnitDetail;
  units: FieldUnits;
  /** off where the page shows the progress itself */
  showStatus?: boolean;
  /** null when the person may change the unit: only then are the links to set up or import offered */
  cannotWrite?: string | null;
}) {
  const missing = [
    !unit.condenser && 'the condenser (geometry and design point)',
    !unit.turbine && 'the turbine (rating, heat rate, heat-balance duty)',
    !unit.economics && 'the economics (fuel, prices, discount rate)',
  ].filter(Boolean) as string[];
  return (
    <div className="flex flex-col gap-5">
      <section aria-labelledby="setup-heading" className="flex flex-col gap-2">
        <h2 id="setup-heading">Setup</h2>
        {missing.length === 0 ? (
          <div className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2 lg:grid-cols-4" data-testid="setup-summary">
            <p>
              <span className="text-ink-soft">Surface (HEI): </span>
              {formatStored(unit.condenser!.surfaceM2, units.areaM2)}
            </p>
            <p>
              <span className="text-ink-soft">Design backpressure: </span>
              {formatStored(unit.condenser!.designBackpressureKpa, units.pressureKpa)}
            </p>
            <p>
              <span className="text-ink-soft">Design cleanliness: </span>
              {formatPercent(unit.condenser!.designCleanliness, 0)}
            </p>
            <p>
              <span className="text-ink-soft">Rating: </span>
              {formatNumber(unit.turbine!.ratingMw, 0)} MW
              {(!unit.turbine!.correctionCurve || unit.turbine!.correctionCurve.isGeneric) && (
                <span className="ml-1 text-xs text-warn">(generic correction curve)</span>
              )}
            </p>
          </div>
        ) : (
          <div className="rounded border border-warn/40 bg-ledger-50 px-3 py-2 text-sm" data-testid="setup-missing">
            <p className="font-medium text-warn">Setup is not complete. Still missing:</p>
            <ul className="ml-5 list-disc">
              {missing.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
            {cannotWrite ? (
              <p className="mt-1 text-ink-soft">{readOnlyLine(cannotWrite, 'set up a unit')}</p>
            ) : (
              <Link className={`${linkClass} mt-1 inline-block`} to={`/units/${unit.id}/setup`}>
                Set up the unit
              </Link>
            )}
          </div>
        )}
      </section>

      <section aria-labelledby="data-heading" className="flex flex-col gap-2">
        <h2 id="data-heading">Performance data</h2>
        {unit.samples.count === 0 ? (
          <EmptyState
            title="No performance data yet"
            next={
              cannotWrite
                ? readOnlyLine(cannotWrite, 'import the plant historian’s data')
                : 'Import a CSV or XLSX export from the plant historian: hourly rows of load, backpressure and CW temperatures and flow.'
            }
          >
            {!cannotWrite && (
              <Link className={linkClass} to={`/units/${unit.id}/data`}>
                Import data
              </Link>
            )}
          </EmptyState>
        ) : (
          <p className="text-sm" data-testid="data-span">
            {formatNumber(unit.samples.count)} rows from {formatPlantTime(unit.samples.first, unit.plant.timeZone)} to{' '}
            {formatPlantTime(unit.samples.last, unit.plant.timeZone)} (plant time).
            {!cannotWrite && (
              <>
                {' '}
                <Link className={linkClass} to={`/units/${unit.id}/data`}>
                  Import more
                </Link>
              </>
            )}
          </p>
        )}
      </section>

      <section aria-labelledby="jobs-heading" className="flex flex-col gap-2">
        <h2 id="jobs-heading">Recent background work</h2>
        {showStatus && <RecomputeStatus jobs={unit.jobs} />}
        {unit.jobs.length === 0 ? (
          <p className="text-sm text-ink-soft">Nothing has run for this unit yet.</p>
        ) : (
          <DataTable
            caption="Recent background work"
            head={
              <>
                <th className={th}>Work</th>
                <th className={th}>Status</th>
                <th className={th}>Started</th>
                <th className={th}>Finished</th>
                <th className={th}>Note</th>
              </>
            }
          >
            {unit.jobs.map((j) => (
              <tr key={j.id} className={tr}>
                <td className={td}>{j.kind === 'recompute' ? 'Recompute derived data' : j.kind === 'import' ? 'Import' : j.kind}</td>
                <td className={`${td} ${j.status === 'failed' ? 'text-fault' : ''}`}>{JOB_STATUS_WORDS[j.status] ?? j.status}</td>
                <td className={`${td} whitespace-nowrap`}>{formatDateTime(j.createdAt)}</td>
                <td className={`${td} whitespace-nowrap`}>{formatDateTime(j.finishedAt)}</td>
                <td className={`${td} text-ink-soft`}>{j.message ?? ''}</td>
              </tr>
            ))}
          </DataTable>
        )}
      </section>
    </div>
  );
}
