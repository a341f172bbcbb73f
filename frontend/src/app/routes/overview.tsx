import { Link } from 'react-router-dom';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { usePlants } from '@frontend/features/plants/api/get-plants';
import { useSession } from '@frontend/features/session/api/get-session';
import { StartOrganisation } from '@frontend/features/session/components/start-organisation';

function UnitsOfOrganisation({ organisationId }: { organisationId: string }) {
  const plants = usePlants(organisationId);
  if (plants.isPending) return <LoadingState what="plants and units" />;
  if (plants.isError) return <ErrorState what="plants and units" error={plants.error} onRetry={() => plants.refetch()} />;
  const units = plants.data.flatMap((p) => p.units.map((u) => ({ ...u, plant: p.name })));
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
        <li key={u.id} className="rounded border border-rule bg-paper-raised p-4">
          <p className="text-xs text-ink-faint">{u.plant}</p>
          <Link to={`/units/${u.id}`} className="text-base font-semibold text-tube-700 hover:underline">
            {u.name}
          </Link>
          <p className="mt-1 text-sm text-ink-soft">
            {u.ratingMw !== null ? `${u.ratingMw.toLocaleString('en-US')} MW` : 'Rating not set'}
            {' · '}
            {u.setupComplete ? 'set up' : 'setup incomplete'}
          </p>
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
