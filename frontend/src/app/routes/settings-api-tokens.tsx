import { Link } from 'react-router-dom';
import { whyNot } from '@shared/permissions';
import { NoOrganisation, NotPermitted } from '@frontend/components/ui/not-permitted';
import { linkClass } from '@frontend/components/ui/public-page';
import { ApiTokensPanel } from '@frontend/features/api-tokens/components/api-tokens-panel';
import { useSession } from '@frontend/features/session/api/get-session';

export function ApiTokensSettingsPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId;
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (!session.permissions.includes('calc.use')) return <NotPermitted what="API tokens" reason={whyNot('calc.use')} />;
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1>API tokens</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Personal keys for the calculation API, for scripts and spreadsheets. Each token belongs to you and this organisation; it cannot read or change plant
          data.
        </p>
        <p className="mt-1 text-sm">
          <Link className={linkClass} to="/api-reference">
            API reference
          </Link>
          <span className="text-ink-soft">: every endpoint, who may call it, what it takes and what it answers.</span>
        </p>
      </div>
      <ApiTokensPanel organisationId={organisationId} origin={window.location.origin} />
    </section>
  );
}
