import { useRef, useState, type FormEvent } from 'react';
import { whyNot } from '@shared/permissions';
import { MAX_SAVED_SCOPES, scopeSave, type OutageView } from '@shared/schemas/outages';
import { Button } from '@frontend/components/ui/button';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { Notice } from '@frontend/components/ui/notice';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { TextField } from '@frontend/components/ui/text-field';
import { formatCurrency } from '@frontend/lib/format';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useApproveOutage, useRemoveScope, useSaveScope } from '../api/outage-scope';
import { daysText } from './outage-words';

const cell = 'px-3 py-1.5 text-right tabular-nums whitespace-nowrap';
const rowHead = 'px-3 py-1.5 text-left text-xs font-medium text-ink-soft';

/** Saves the latest proposal under a name (up to three per outage). */
function SaveScopeForm({ organisationId, outage }: { organisationId: string; outage: OutageView }) {
  const save = useSaveScope(organisationId, outage.id);
  const [name, setName] = useState('');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const full = outage.scopes.length >= MAX_SAVED_SCOPES;
  const why = full
    ? `${MAX_SAVED_SCOPES} scopes are saved, the most kept side by side: remove one to save another.`
    : !outage.proposal
      ? 'Propose a scope first: the proposal is what gets saved.'
      : outage.proposalStale
        ? 'The proposal is out of date: propose again, then save it.'
        : null;
  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const parsed = scopeSave.safeParse({ name });
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    save.mutate(parsed.data, { onSuccess: () => setName(''), onError: (err) => setFieldErrors(serverFieldErrors(err)) });
  };
  const message = formMessage(save.error);
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-label="Save the proposal as a scope" className="flex flex-col gap-2">
      <FormProblems errors={fieldErrors} />
      <div className="flex flex-wrap items-end gap-2">
        <div className="min-w-56 flex-1">
          <TextField
            label="Name for this scope"
            value={name}
            maxLength={80}
            disabled={why !== null}
            onChange={(e) => setName(e.target.value)}
            error={fieldErrors.name}
            placeholder="e.g. Cleaning and plugging only"
          />
        </div>
        <Button type="submit" disabled={why !== null || save.isPending}>
          {save.isPending ? 'Saving…' : 'Save the proposal'}
        </Button>
      </div>
      {why && <p className="text-xs text-ink-soft">{why}</p>}
      {message && <Notice tone="fault">{message}</Notice>}
    </form>
  );
}

/** Up to three saved scopes side by side: benefit, cost, longest lane, and the items where they differ. */
export function SavedScopes({ organisationId, outage }: { organisationId: string; outage: OutageView }) {
  const approve = useApproveOutage(organisationId, outage.id);
  const remove = useRemoveScope(organisationId, outage.id);
  const scopes = outage.scopes;
  const titleOf = new Map(outage.items.map((i) => [i.id, i.title]));
  const draft = outage.status === 'draft';
  return (
    <section aria-labelledby="outage-scopes-title" className="flex flex-col gap-3" data-testid="outage-saved-scopes">
      <div>
        <h2 id="outage-scopes-title">Saved scopes</h2>
        {draft && (
          <p className="text-xs text-ink-soft">
            Keep up to {MAX_SAVED_SCOPES} alternatives (force items in or out, propose again, save) and compare them here.
          </p>
        )}
      </div>
      {scopes.length === 0 && <p className="text-sm text-ink-soft">None saved yet.</p>}
      {scopes.length > 0 && (
        <div className="overflow-x-auto rounded border border-rule bg-paper-raised">
          <table className="w-full text-sm" data-testid="outage-scope-comparison">
            <caption className="sr-only">Saved scopes side by side</caption>
            <thead className="border-b border-rule bg-paper-sunk">
              <tr>
                <th className="px-3 py-2 text-left text-xs font-medium uppercase tracking-wide text-ink-soft">
                  <span className="sr-only">Figure</span>
                </th>
                {scopes.map((s) => (
                  <th key={s.id} scope="col" className="px-3 py-2 text-right text-sm font-semibold">
                    {s.name}
                    <span className="block text-2xs font-normal text-ink-faint">by {s.createdBy.name}</span>
                  </th>
                ))}
              </tr>
            </thead>
            <tbody className="divide-y divide-rule">
              <tr>
                <th scope="row" className={rowHead}>
                  Benefit
                </th>
                {scopes.map((s) => (
                  <td key={s.id} className={`${cell} text-ledger-700`}>
                    {formatCurrency(s.totalBenefit, outage.currency)}
                  </td>
                ))}
              </tr>
              <tr>
                <th scope="row" className={rowHead}>
                  Cost (budget {formatCurrency(outage.budget, outage.currency)})
                </th>
                {scopes.map((s) => (
                  <td key={s.id} className={`${cell} ${s.totalCost > outage.budget ? 'text-fault' : ''}`}>
                    {formatCurrency(s.totalCost, outage.currency)}
                  </td>
                ))}
              </tr>
              <tr>
                <th scope="row" className={rowHead}>
                  Longest lane (window {daysText(outage.windowDays)})
                </th>
                {scopes.map((s) => (
                  <td key={s.id} className={`${cell} ${s.criticalLaneDays > outage.windowDays ? 'text-fault' : ''}`}>
                    {daysText(s.criticalLaneDays)}
                  </td>
                ))}
              </tr>
              <tr>
                <th scope="row" className={rowHead}>
                  Meets the limits
                </th>
                {scopes.map((s) => (
                  <td key={s.id} className={`${cell} text-xs`} title={s.problems.join(' ')}>
                    {s.feasible ? 'Yes' : <span className="text-fault">No: {s.problems.join(' ')}</span>}
                  </td>
                ))}
              </tr>
              <tr>
                <th scope="row" className={rowHead}>
                  Items
                </th>
                {scopes.map((s) => (
                  <td key={s.id} className={cell}>
                    {s.itemIds.length}
                    {s.missingItemIds.length > 0 && <span className="block text-2xs text-warn">{s.missingItemIds.length} removed since</span>}
                  </td>
                ))}
              </tr>
              <tr className="bg-paper-sunk">
                <th scope="row" colSpan={scopes.length + 1} className="px-3 py-1.5 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
                  What differs{' '}
                  <span className="font-normal normal-case">
                    ({outage.comparison.inAll.length} {outage.comparison.inAll.length === 1 ? 'item is' : 'items are'} in every scope)
                  </span>
                </th>
              </tr>
              {outage.comparison.differences.length === 0 && (
                <tr>
                  <td colSpan={scopes.length + 1} className="px-3 py-1.5 text-xs text-ink-soft">
                    {scopes.length > 1 ? 'The saved scopes hold the same items.' : draft ? 'Save another scope to compare.' : 'Only one scope was saved.'}
                  </td>
                </tr>
              )}
              {outage.comparison.differences.map((d) => (
                <tr key={d.itemId} data-testid="outage-scope-difference">
                  <th scope="row" className="px-3 py-1.5 text-left text-sm font-normal">
                    {titleOf.get(d.itemId) ?? d.title}
                  </th>
                  {scopes.map((s) => (
                    <td key={s.id} className={`${cell} text-xs`}>
                      {d.inScopeIds.includes(s.id) ? <span className="font-medium text-ok">In</span> : <span className="text-ink-faint">Out</span>}
                    </td>
                  ))}
                </tr>
              ))}
              {draft && (outage.actions.approve || outage.actions.saveScope) && (
                <tr>
                  <td />
                  {scopes.map((s) => (
                    <td key={s.id} className="px-3 py-2 text-right">
                      <div className="flex flex-col items-end gap-1">
                        {outage.actions.approve && (
                          <Button
                            variant="quiet"
                            className="text-xs"
                            disabled={approve.isPending || !s.feasible}
                            title={s.feasible ? undefined : 'This scope breaks a limit'}
                            onClick={() => approve.mutate({ scopeId: s.id, seenUpdatedAt: outage.updatedAt })}
                          >
                            Approve “{s.name}”
                          </Button>
                        )}
                        {outage.actions.saveScope && (
                          <Button
                            variant="quiet"
                            className="text-xs"
                            disabled={remove.isPending}
                            onClick={() => {
                              if (window.confirm(`Remove the saved scope “${s.name}”? Its items stay on the outage.`)) remove.mutate(s.id);
                            }}
                          >
                            Remove “{s.name}”
                          </Button>
                        )}
                      </div>
                    </td>
                  ))}
                </tr>
              )}
            </tbody>
          </table>
        </div>
      )}
      {approve.isError && <Notice tone="fault">Not approved: {approve.error.message}</Notice>}
      {remove.isError && <Notice tone="fault">Not removed: {remove.error.message}</Notice>}
      {draft &&
        (outage.actions.saveScope ? (
          <SaveScopeForm organisationId={organisationId} outage={outage} />
        ) : (
          <ReadOnlyReason reason={whyNot('outages.plan')} action="save scopes" />
        ))}
    </section>
  );
}
