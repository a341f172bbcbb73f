import { whyNot } from '@shared/permissions';
import type { OutageView } from '@shared/schemas/outages';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { formatDateTime } from '@frontend/lib/format';
import { useApproveOutage } from '../api/outage-scope';

/**
 * Approving the proposed scope freezes the outage as a snapshot (a saved scope is approved from the comparison).
 * Someone whose role may not approve reads the one line saying who does, not a greyed button.
 */
export function OutageApproval({ organisationId, outage }: { organisationId: string; outage: OutageView }) {
  const approve = useApproveOutage(organisationId, outage.id);
  if (outage.status === 'approved') {
    return (
      <Notice tone="ok">
        Scope approved{outage.approvedBy ? ` by ${outage.approvedBy.name}` : ''} {formatDateTime(outage.approvedAt)}. It is kept as decided; its report is in
        the links above.
      </Notice>
    );
  }
  if (!outage.actions.approve) return <ReadOnlyReason reason={whyNot('cases.approve')} action="approve an outage’s scope" />;
  const p = outage.proposal;
  const why = !p
    ? 'Propose a scope first; then approve it.'
    : outage.proposalStale
      ? 'The proposal is out of date: propose again before approving.'
      : !p.feasible
        ? 'The proposal breaks a limit with what is forced: change the forced items first.'
        : null;
  return (
    <section aria-label="Approval" className="flex flex-col gap-2 print:hidden" data-testid="outage-approval">
      <div className="flex flex-wrap items-center gap-3">
        <Button disabled={why !== null || approve.isPending} onClick={() => approve.mutate({ seenUpdatedAt: outage.updatedAt })}>
          {approve.isPending ? 'Approving…' : 'Approve the proposed scope'}
        </Button>
        <span className="text-xs text-ink-soft">{why ?? 'The outage is then kept as decided: its items, window and scope no longer change.'}</span>
      </div>
      {approve.isError && <Notice tone="fault">Not approved: {approve.error.message}</Notice>}
    </section>
  );
}
