import { Link, useParams } from 'react-router-dom';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { Button } from '@frontend/components/ui/button';
import { useOutage } from '@frontend/features/outages/api/get-outage';
import { OutagePrint } from '@frontend/features/outages/components/outage-print';
import { useSession } from '@frontend/features/session/api/get-session';

/** The outage-scope report as a page to print (or save as PDF from the browser); the server's PDF is the same report. */
export function OutagePrintPage() {
  const { outageId = '' } = useParams();
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const view = useOutage(organisationId, outageId);
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (view.isPending) return <LoadingState what="the outage" />;
  if (view.isError) return <ErrorState what="the outage" error={view.error} onRetry={() => view.refetch()} />;
  return (
    <main className="mx-auto flex max-w-4xl flex-col gap-4 px-gutter py-6 print:max-w-none print:p-0">
      <div className="flex items-center gap-3 print:hidden">
        <Link to={`/outages/${outageId}`} className="text-sm text-tube-700 hover:underline">
          ‹ Back to the outage
        </Link>
        <Button className="ml-auto" onClick={() => window.print()}>
          Print
        </Button>
      </div>
      <OutagePrint outage={view.data} />
    </main>
  );
}
