import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { useNotifications } from '@frontend/features/notifications/api/get-notifications';
import { NotificationsForm } from '@frontend/features/notifications/components/notifications-form';
import { useSession } from '@frontend/features/session/api/get-session';

export function NotificationsSettingsPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId;
  if (!session?.user || !organisationId) return <NoOrganisation />;
  return <Notifications organisationId={organisationId} />;
}

function Notifications({ organisationId }: { organisationId: string }) {
  const settings = useNotifications(organisationId);
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1>Notifications</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Choose which conditions of your units reach you by e-mail, unit by unit, and whether you want a weekly digest. These are your own choices; nobody else
          in the organisation sees them.
        </p>
      </div>
      {settings.isPending ? (
        <LoadingState what="your notifications" />
      ) : settings.isError ? (
        <ErrorState what="your notifications" error={settings.error} onRetry={() => void settings.refetch()} />
      ) : (
        <NotificationsForm key={organisationId} organisationId={organisationId} settings={settings.data} />
      )}
    </section>
  );
}
