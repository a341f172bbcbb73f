import { useParams } from 'react-router-dom';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { useCase } from '@frontend/features/cases/api/get-case';
import { CaseHeader } from '@frontend/features/cases/components/case-header';
import { CaseReportLinks } from '@frontend/features/cases/components/case-report-links';
import { CaseWorkspace } from '@frontend/features/cases/components/case-workspace';
import { CommentsThread } from '@frontend/features/cases/components/comments-thread';
import { useNarrow } from '@frontend/features/cases/components/use-narrow';
import { useSession } from '@frontend/features/session/api/get-session';

/** One cleaning case: its inputs and figures, the approval path, the report and the comments. */
export function CasePage() {
  const { caseId = '' } = useParams();
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const view = useCase(organisationId, caseId);
  const narrow = useNarrow();
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (view.isPending) return <LoadingState what="the case" />;
  if (view.isError) return <ErrorState what="the case" error={view.error} onRetry={() => view.refetch()} />;
  const me = { id: session.user.id, permissions: session.permissions };
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <CaseHeader view={view.data} />
        <CaseReportLinks caseId={view.data.id} />
      </div>
      {/* a new key per case: the copy of a case opens with no leftover edits */}
      <CaseWorkspace key={view.data.id} organisationId={organisationId} view={view.data} system={session.user.unitPreference} me={me} narrow={narrow} />
      <CommentsThread organisationId={organisationId} caseId={view.data.id} canComment={view.data.actions.comment} />
    </div>
  );
}
