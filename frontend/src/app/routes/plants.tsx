import { useQuery } from '@tanstack/react-query';
import { whyNot } from '@shared/permissions';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { clientGroupsQueryOptions } from '@frontend/features/client-groups/api/get-client-groups';
import { PlantsList } from '@frontend/features/plants/components/plants-list';
import { useSession } from '@frontend/features/session/api/get-session';
import { StartOrganisation } from '@frontend/features/session/components/start-organisation';

export function PlantsPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? null;
  // group names label the sections; without them the plants still show, ungrouped. Without an
  // organisation nothing is asked of the server: it could only refuse.
  const groups = useQuery({ ...clientGroupsQueryOptions(organisationId ?? ''), enabled: organisationId !== null });
  if (!session?.user) return <NoOrganisation />;
  if (!organisationId) return session.memberships.length === 0 ? <StartOrganisation /> : <NoOrganisation />;
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1>Plants and units</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Each plant keeps its own local time zone; each generating unit has its condenser, turbine and economics set up, then its historian data imported.
        </p>
      </div>
      {groups.isError && <p className="text-sm text-fault">Client group names could not be loaded: {groups.error.message}</p>}
      <PlantsList
        organisationId={organisationId}
        groups={groups.data ?? []}
        cannotWrite={session.permissions.includes('data.write') ? null : whyNot('data.write')}
      />
    </section>
  );
}
