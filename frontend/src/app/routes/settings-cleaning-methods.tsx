import { whyNot } from '@shared/permissions';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { CleaningMethodsList } from '@frontend/features/cleaning-methods/components/cleaning-methods-list';
import { useSession } from '@frontend/features/session/api/get-session';

export function CleaningMethodsSettingsPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId;
  if (!session?.user || !organisationId) return <NoOrganisation />;
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1>Cleaning methods</h1>
        <p className="mt-1 text-sm text-ink-soft">
          The ways your plants clean their condensers: what each costs, how long it takes, what the unit does meanwhile and how clean it leaves the tubes.
          Cleaning cases and the cleaning outlook pick from this list. Open a method to read its safety cautions.
        </p>
      </div>
      <CleaningMethodsList organisationId={organisationId} cannotWrite={session.permissions.includes('data.write') ? null : whyNot('data.write')} />
    </section>
  );
}
