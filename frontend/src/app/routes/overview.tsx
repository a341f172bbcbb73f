import { Link } from 'react-router-dom';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { usePlants } from '@frontend/features/plants/api/get-plants';
import { useSession } from '@frontend/features/session/api/get-session';
import { StartOrganisation } from '@frontend/features/session/components/start-organisation';
import { useUnitCondition } from '../components/unit-condition';

/** Cleanliness, fouling cost per day and data age: what the overview shows of each unit until the portfolio view. */
function UnitConditionFigures({ organisationId, unitId }: { organisationId: string; unitId: string }) {
  const c = useUnitCondition(organisationId, unitId);
  if (c.state !== 'ready')
    return <p className="mt-2 text-xs text-ink-faint">{c.state === 'loading' ? 'Reading the latest figures…' : 'The latest figures could not be read.'}</p>;
  return (
    <dl className="mt-3 grid grid-cols-3 gap-2 border-t border-rule pt-2 text-sm">
      <div>
        <dt className="text-xs text-ink-soft">Cleanliness</dt>
        <dd className="tabular-nums" data-testid="unit-cleanliness">
          {c.cleanliness}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-soft">Fouling cost</dt>
        <dd className="tabular-nums" data-testid="unit-cost-per-day">
          {c.costPerDay}
          {c.costNote && <span className="block text-xs text-ink-faint">{c.costNote}</span>}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-soft">Data</dt>
        <dd className={c.stale ? 'text-warn' : ''} data-testid="unit-data-age">
          {c.dataAge}
        </dd>
      </div>
    </dl>
  );
}

function UnitsOfOrganisation({ organisationId }: { organisationId: string }) {
  const plants = usePlants(organisationId);
  if (plants.isPending) return <LoadingState what="plants and units" />;
  if (plants.isError) return <ErrorState what="plants and units" error={plants.error} onRetry={() => plants.refetch()} />;
  const units = plants.data.flatMap((p) => p.units.map((u) => ({ ...u, plant: p.name, plantId: p.id })));
  if (units.length === 0) {
    return (
      <EmptyState title="No generating units to show yet" next="Add a plant and its units, describe the condenser, then import performance data.">
        <Link className="text-sm text-tube-700 underline" to="/plants">
          Go to plants
        </Link>
      </EmptyState>
    );
  }
  return (
    <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
      {units.map((u) => (
        <li key={u.id} className="flex flex-col rounded border border-rule bg-paper-raised p-4" data-testid="overview-unit">
          <Link to={`/plants/${u.plantId}`} className="text-xs text-ink-faint hover:text-ink hover:underline">
            {u.plant}
          </Link>
          <Link to={`/units/${u.id}`} className="text-base font-semibold text-tube-700 hover:underline">
            {u.name}
          </Link>
          <p className="mt-1 text-sm text-ink-soft">
            {u.ratingMw !== null ? `${u.ratingMw.toLocaleString('en-US')} MW` : 'Rating not set'}
            {' · '}
            {u.setupComplete ? 'set up' : 'setup incomplete'}
          </p>
          <UnitConditionFigures organisationId={organisationId} unitId={u.id} />
        </li>
      ))}
    </ul>
  );
}

export function OverviewPage() {
  const { data: session } = useSession();
  const active = session?.memberships.find((m) => m.organisationId === session.activeOrganisationId);
  return (
    <section className="flex flex-col gap-4">
      <h1>Overview{active ? ` — ${active.organisationName}` : ''}</h1>
      {active ? <UnitsOfOrganisation organisationId={active.organisationId} /> : <StartOrganisation />}
    </section>
  );
}
