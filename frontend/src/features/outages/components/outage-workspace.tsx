import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { whyNot } from '@shared/permissions';
import type { OutageView } from '@shared/schemas/outages';
import { Button } from '@frontend/components/ui/button';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { Notice } from '@frontend/components/ui/notice';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { useDeleteOutage } from '../api/delete-outage';
import { ItemForm, type ApprovedCaseChoice } from './item-form';
import { ItemsTable } from './items-table';
import { OutageApproval } from './outage-approval';
import { OutageCautions } from './outage-cautions';
import { OutageForm, type UnitChoice } from './outage-form';
import { OutageHeader } from './outage-header';
import { OutageReportLinks } from './outage-report-links';
import { SavedScopes } from './saved-scopes';
import { ScopePanel } from './scope-panel';

interface Props {
  organisationId: string;
  outage: OutageView;
  /** units the person may see, for changing the outage's units */
  units: UnitChoice[];
  /** the organisation's approved cases, for a case's cleaning (undefined while they load) */
  approvedCases?: ApprovedCaseChoice[];
}

/** One outage: the candidate work, the proposed scope with its reasons and lanes, saved scopes side by side, the approval. */
export function OutageWorkspace({ organisationId, outage, units, approvedCases }: Props) {
  const [changing, setChanging] = useState(false);
  const [adding, setAdding] = useState(false);
  const navigate = useNavigate();
  const remove = useDeleteOutage(organisationId, outage.id);
  const a = outage.actions;
  const shown = outage.approved ?? outage.proposal;
  const chosen = shown ? new Set(shown.selectedItemIds) : null;
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <OutageHeader outage={outage} />
        <div className="flex flex-col items-end gap-2">
          <OutageReportLinks outageId={outage.id} />
          <div className="flex flex-wrap justify-end gap-2 print:hidden">
            {a.edit && !changing && (
              <Button variant="quiet" onClick={() => setChanging(true)}>
                Change name, units, window or budget
              </Button>
            )}
            {a.delete && (
              <ConfirmAction
                label="Delete outage"
                question="The outage, its items and saved scopes are deleted; the audit log keeps the record."
                confirmLabel="Delete the outage"
                pending={remove.isPending}
                onConfirm={() => remove.mutate(undefined, { onSuccess: () => navigate('/outages') })}
              />
            )}
          </div>
        </div>
      </div>
      {remove.isError && <Notice tone="fault">Not deleted: {remove.error.message}</Notice>}
      {changing && a.edit && (
        <OutageForm
          organisationId={organisationId}
          units={units}
          currency={outage.currency}
          currencyNote={`In ${outage.currency}, as when the outage was created`}
          outage={outage}
          onDone={() => setChanging(false)}
          onCancel={() => setChanging(false)}
        />
      )}
      <OutageApproval organisationId={organisationId} outage={outage} />
      <OutageCautions outage={outage} />
      <section aria-labelledby="outage-items-title" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <div>
            <h2 id="outage-items-title">{outage.approved ? 'Work considered' : 'Candidate work'}</h2>
            <p className="text-xs text-ink-soft">
              A case’s cleaning takes its benefit from the case; other work carries the benefit entered, or a cleanliness recovered priced with the unit’s
              model.
            </p>
          </div>
          {a.edit && !adding && <Button onClick={() => setAdding(true)}>Add work</Button>}
        </div>
        {!a.edit && outage.status === 'draft' && <ReadOnlyReason reason={whyNot('outages.plan')} action="add or change the work" />}
        {adding && a.edit && <ItemForm organisationId={organisationId} outage={outage} approvedCases={approvedCases} onDone={() => setAdding(false)} />}
        {outage.items.length === 0 && !outage.approved ? (
          <EmptyState
            title="No candidate work yet"
            next={
              a.edit ? 'Add an approved case’s cleaning or other condenser work with its cost, days, crew lane and benefit.' : 'Planners add the work here.'
            }
          />
        ) : (
          <ItemsTable organisationId={organisationId} outage={outage} approvedCases={approvedCases} chosen={chosen} />
        )}
      </section>
      <ScopePanel organisationId={organisationId} outage={outage} />
      {(outage.status === 'draft' || outage.scopes.length > 0) && <SavedScopes organisationId={organisationId} outage={outage} />}
    </div>
  );
}
