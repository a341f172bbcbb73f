import { whyNot } from '@shared/permissions';
import { NoOrganisation, NotPermitted } from '@frontend/components/ui/not-permitted';
import { useClientGroups } from '@frontend/features/client-groups/api/get-client-groups';
import { InviteForm } from '@frontend/features/members/components/invite-form';
import { MembersTable } from '@frontend/features/members/components/members-table';
import { PendingInvitations } from '@frontend/features/members/components/pending-invitations';
import { limitedToClientGroups, useSession } from '@frontend/features/session/api/get-session';

export function MembersSettingsPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId;
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (!session.permissions.includes('members.manage')) return <NotPermitted what="People and roles" reason={whyNot('members.manage')} />;
  return <MembersSections organisationId={organisationId} currentUserId={session.user.id} mayGrantAll={!limitedToClientGroups(session)} />;
}

function MembersSections({ organisationId, currentUserId, mayGrantAll }: { organisationId: string; currentUserId: string; mayGrantAll: boolean }) {
  // The group names label the limits; if they fail to load, ids stay hidden and "removed group" is not claimed.
  const groups = useClientGroups(organisationId);
  const options = groups.data ?? [];
  return (
    <section className="flex flex-col gap-6">
      <div>
        <h1>People and roles</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Who belongs to this organisation, what their role lets them do, and which plants they see. At least one administrator must keep access to all plants.
        </p>
      </div>
      {groups.isError && <p className="text-sm text-fault">Client group names could not be loaded: {groups.error.message}</p>}
      <MembersTable organisationId={organisationId} groups={options} currentUserId={currentUserId} mayGrantAll={mayGrantAll} />
      <InviteForm organisationId={organisationId} groups={options} mayGrantAll={mayGrantAll} />
      <div className="flex flex-col gap-2">
        <h2>Waiting for an answer</h2>
        <PendingInvitations organisationId={organisationId} groups={options} />
      </div>
    </section>
  );
}
