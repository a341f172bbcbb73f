import { EmptyState } from '@frontend/components/ui/empty-state';
import { useSession } from '@frontend/features/session/api/get-session';

export function OverviewPage() {
  const { data: session } = useSession();
  const active = session?.memberships.find((m) => m.organisationId === session.activeOrganisationId);
  return (
    <section className="flex flex-col gap-4">
      <h1>Overview{active ? ` — ${active.organisationName}` : ''}</h1>
      {active ? (
        <EmptyState
          title="No generating units to show yet"
          next="Units appear here once a plant and its condenser are set up and performance data is imported."
        />
      ) : (
        <EmptyState title="You belong to no organisation yet" next="Ask an administrator for an invitation, or sign up to start your own trial." />
      )}
    </section>
  );
}
