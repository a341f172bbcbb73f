import { Link, useParams } from 'react-router-dom';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { linkClass } from '@frontend/components/ui/public-page';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { usePlants } from '@frontend/features/plants/api/get-plants';
import { useSession } from '@frontend/features/session/api/get-session';
import { formatNumber, formatPlantTime } from '@frontend/lib/format';
import { UnitConditionCells } from '../components/unit-condition-cells';
import { usePageTitle } from '../page-title';

/** One plant: its local clock and each unit's condition, between the plant list and a unit. */
export function PlantPage() {
  const { plantId = '' } = useParams();
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const plants = usePlants(organisationId);
  const plant = plants.data?.find((p) => p.id === plantId);
  usePageTitle(plant?.name ?? 'Plant');
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (plants.isPending) return <LoadingState what="the plant" />;
  if (plants.isError) return <ErrorState what="the plant" error={plants.error} onRetry={() => plants.refetch()} />;
  if (!plant) return <EmptyState title="No such plant" next="It may have been deleted, or it belongs to a client group you do not see." />;
  const canWrite = session.permissions.includes('data.write');
  return (
    <section className="flex flex-col gap-4" aria-label={plant.name}>
      <div>
        <p className="text-xs text-ink-soft">
          <Link to="/plants" className="hover:text-ink hover:underline">
            Plants
          </Link>{' '}
          › {plant.name}
        </p>
        <h1>{plant.name}</h1>
        <p className="mt-1 text-sm text-ink-soft" data-testid="plant-time-zone">
          Local time zone {plant.timeZone.replace(/_/g, ' ')} (now {formatPlantTime(new Date().toISOString(), plant.timeZone)}): days, daily figures and
          schedules of its units follow this clock.
        </p>
      </div>
      {plant.units.length === 0 ? (
        <EmptyState title="No units yet" next={canWrite ? 'Add the first generating unit on the plant list.' : 'An analyst or administrator adds the units.'}>
          {canWrite && (
            <Link className={linkClass} to="/plants">
              Go to the plant list
            </Link>
          )}
        </EmptyState>
      ) : (
        <DataTable
          caption={`Units of ${plant.name} and their condition`}
          head={
            <>
              <th className={th}>Unit</th>
              <th className={`${th} text-right`}>Rating</th>
              <th className={`${th} text-right`}>Cleanliness</th>
              <th className={`${th} text-right`}>Fouling cost</th>
              <th className={th}>Data</th>
              <th className={th}>Setup</th>
            </>
          }
        >
          {plant.units.map((u) => (
            <tr key={u.id} className={tr} data-testid="plant-unit-row">
              <td className={`${td} font-medium`}>
                <Link className={linkClass} to={`/units/${u.id}`}>
                  {u.name}
                </Link>
              </td>
              <td className={`${td} text-right tabular-nums whitespace-nowrap`}>{u.ratingMw === null ? '—' : `${formatNumber(u.ratingMw, 0)} MW`}</td>
              <UnitConditionCells organisationId={organisationId} unitId={u.id} />
              <td className={td}>
                {u.setupComplete ? (
                  <span className="text-ok">Complete</span>
                ) : canWrite ? (
                  <Link className={linkClass} to={`/units/${u.id}/setup`}>
                    Needs setup
                  </Link>
                ) : (
                  <span className="text-warn">Not complete</span>
                )}
              </td>
            </tr>
          ))}
        </DataTable>
      )}
      <p className="text-xs text-ink-faint">Cleanliness is each unit’s last day’s median; the fouling cost is the mean of its last 7 days with valid data.</p>
    </section>
  );
}
