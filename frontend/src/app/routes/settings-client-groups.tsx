import { whyNot } from '@shared/permissions';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ClientGroupsList } from '@frontend/features/client-groups/components/client-groups-list';
import { useSession } from '@frontend/features/session/api/get-session';

export function ClientGroupsSettingsPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId;
  if (!session?.user || !organisationId) return <NoOrganisation />;
  const active = session.memberships.find((m) => m.organisationId === organisationId);
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1>Client groups</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Plants are sorted into client groups, typically one per owner or client. A member limited to some groups sees only those plants.
          {active?.limitedToClientGroups ? ' You are limited to some groups, so only those are listed.' : ''}
        </p>
      </div>
      <ClientGroupsList
        organisationId={organisationId}
        cannotManage={session.permissions.includes('client-groups.manage') ? null : whyNot('client-groups.manage')}
      />
    </section>
  );
}
