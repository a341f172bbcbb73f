import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { whyNot, type Permission } from '@shared/permissions';
import { caseReturn, type CaseView } from '@shared/schemas/cases';
import { Button } from '@frontend/components/ui/button';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { Notice } from '@frontend/components/ui/notice';
import { useChangeCaseStatus, type CaseStep } from '../api/change-case-status';

interface Props {
  organisationId: string;
  view: CaseView;
  me: { id: string; permissions: readonly Permission[] };
  /** unsaved what-if changes: the case must be saved (or the changes discarded) before it moves on */
  unsaved: boolean;
}

/** Why a step the case is waiting for is not this person's to take, in one line. */
function whyNotNow(view: CaseView, me: Props['me']): string | null {
  const open = view.status === 'draft' || view.status === 'returned';
  if (open && !view.actions.submit)
    return me.permissions.includes('data.write') ? 'Only the author, analysts and administrators submit a case.' : whyNot('data.write');
  if (view.status === 'submitted' && !view.actions.approve) {
    if (view.author.id === me.id) return 'The case waits for an approver: nobody approves their own case.';
    return me.permissions.includes('cases.approve') ? 'This case is outside what you may decide.' : `${whyNot('cases.approve')}: approve or send back.`;
  }
  return null;
}

/** The approval path: submit, approve, send back with a reason, archive, copy as a new draft. */
export function ApprovalBar({ organisationId, view, me, unsaved }: Props) {
  const change = useChangeCaseStatus(organisationId, view.id);
  const navigate = useNavigate();
  const [returning, setReturning] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const a = view.actions;
  // A decision names the version the approver read: if the case changed since, the server refuses it (409).
  const run = (step: CaseStep, body?: { reason: string }) =>
    change.mutate(
      { step, body: step === 'approve' || step === 'return' ? { ...body, seenUpdatedAt: view.updatedAt } : body },
      {
        onSuccess: (answered) => {
          setReturning(false);
          if (step === 'copy') navigate(`/cases/${answered.id}`);
        },
      },
    );
  const why = whyNotNow(view, me);
  const savedFirst = unsaved ? 'Save or discard the changes first' : undefined;
  return (
    <section aria-label="Approval" className="flex flex-col gap-2 print:hidden" data-testid="case-approval">
      {view.status === 'returned' && view.returnReason && (
        <Notice tone="warn">
          Sent back{view.decidedBy ? ` by ${view.decidedBy.name}` : ''}: {view.returnReason}
        </Notice>
      )}
      <div className="flex flex-wrap items-start gap-2">
        {a.submit && (
          <Button disabled={change.isPending || unsaved} title={savedFirst} onClick={() => run('submit')}>
            Submit for approval
          </Button>
        )}
        {a.approve && (
          <Button disabled={change.isPending} onClick={() => run('approve')}>
            Approve
          </Button>
        )}
        {a.return && !returning && (
          <Button variant="quiet" disabled={change.isPending} onClick={() => setReturning(true)}>
            Send back…
          </Button>
        )}
        {a.copy && (
          <Button variant="quiet" disabled={change.isPending} onClick={() => run('copy')}>
            Copy as new draft
          </Button>
        )}
        {a.archive && (
          <ConfirmAction
            label="Archive"
            question="The case leaves the working lists; it stays readable and in the audit log."
            confirmLabel="Archive the case"
            pending={change.isPending}
            onConfirm={() => run('archive')}
          />
        )}
      </div>
      {returning && (
        <form
          aria-label="Send the case back"
          className="flex max-w-xl flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            const checked = caseReturn.safeParse({ reason });
            if (!checked.success) return setReasonError(checked.error.issues[0]?.message);
            setReasonError(undefined);
            run('return', checked.data);
          }}
        >
          <label htmlFor="return-reason" className="text-sm font-medium">
            Why does the case go back?
          </label>
          <textarea
            id="return-reason"
            rows={3}
            value={reason}
            aria-invalid={reasonError ? true : undefined}
            onChange={(e) => setReason(e.target.value)}
            className={`rounded border bg-paper-raised px-2.5 py-1.5 text-sm ${reasonError ? 'border-fault' : 'border-rule'}`}
          />
          {reasonError && <p className="text-xs text-fault">{reasonError}</p>}
          <div className="flex gap-2">
            <Button variant="quiet" onClick={() => setReturning(false)}>
              Cancel
            </Button>
            <Button type="submit" disabled={change.isPending}>
              Send back to the author
            </Button>
          </div>
        </form>
      )}
      {why && <p className="text-xs text-ink-soft">{why}</p>}
      {change.isError && <Notice tone="fault">{change.error.message}</Notice>}
    </section>
  );
}
