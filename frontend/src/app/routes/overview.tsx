import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@frontend/components/ui/button';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { TextField } from '@frontend/components/ui/text-field';
import { usePlants } from '@frontend/features/plants/api/get-plants';
import { useCreateOrganisation } from '@frontend/features/session/api/create-organisation';
import { useSession } from '@frontend/features/session/api/get-session';

/** Someone signed in (e.g. with Google) who belongs to no organisation yet can start one here. */
function StartOrganisation() {
  const create = useCreateOrganisation();
  const [name, setName] = useState('');
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    if (name.trim().length >= 2) create.mutate({ name: name.trim() });
  };
  return (
    <EmptyState title="You belong to no organisation yet" next="Ask an administrator to invite you, or start your own organisation on a 30-day trial.">
      <form onSubmit={onSubmit} className="flex items-end gap-2 text-left">
        <TextField label="Organisation name" value={name} onChange={(e) => setName(e.target.value)} error={create.error?.message} />
        <Button type="submit" disabled={create.isPending || name.trim().length < 2}>
          Start organisation
        </Button>
      </form>
    </EmptyState>
  );
}

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
