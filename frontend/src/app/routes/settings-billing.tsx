import { whyNot } from '@shared/permissions';
import { NoOrganisation, NotPermitted } from '@frontend/components/ui/not-permitted';
import { BillingPage } from '@frontend/features/billing/components/billing-page';
import { limitedToClientGroups, useSession } from '@frontend/features/session/api/get-session';

export function BillingSettingsPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId;
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (!session.permissions.includes('billing.manage')) return <NotPermitted what="Billing" reason={whyNot('billing.manage')} />;
  if (limitedToClientGroups(session)) return <NotPermitted what="Billing" reason="Only administrators who see every client group manage billing" />;
  return <BillingPage organisationId={organisationId} />;
}
