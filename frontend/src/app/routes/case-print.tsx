import { Link, useParams } from 'react-router-dom';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { Button } from '@frontend/components/ui/button';
import { useCase } from '@frontend/features/cases/api/get-case';
import { CasePrint } from '@frontend/features/cases/components/case-print';
import { useSession } from '@frontend/features/session/api/get-session';

/** The case report as a page to print (or save as PDF from the browser); the server's PDF is the same report. */
export function CasePrintPage() {
  const { caseId = '' } = useParams();
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const view = useCase(organisationId, caseId);
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (view.isPending) return <LoadingState what="the case" />;
  if (view.isError) return <ErrorState what="the case" error={view.error} onRetry={() => view.refetch()} />;
  return (
    <main className="case-print mx-auto flex max-w-4xl flex-col gap-4 px-gutter py-6 print:max-w-none print:p-0">
      <div className="flex items-center gap-3 print:hidden">
        <Link to={`/cases/${caseId}`} className="text-sm text-tube-700 hover:underline">
          ‹ Back to the case
        </Link>
        <Button className="ml-auto" onClick={() => window.print()}>
          Print
        </Button>
      </div>
      <CasePrint view={view.data} system={session.user.unitPreference} />
    </main>
  );
}
