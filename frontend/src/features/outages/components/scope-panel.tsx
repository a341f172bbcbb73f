import { whyNot } from '@shared/permissions';
import type { OutageView } from '@shared/schemas/outages';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { formatDateTime } from '@frontend/lib/format';
import { useOptimiseOutage } from '../api/outage-scope';
import { LaneChart } from './lane-chart';
import { ScopeReasons, ScopeTotals } from './scope-figures';

/**
 * The scope: for a draft, the latest proposal of the optimiser (and the button that asks for one); for an approved
 * outage, the frozen scope as approved. Either way its totals against the limits, every item's reason, and the lanes.
 */
export function ScopePanel({ organisationId, outage }: { organisationId: string; outage: OutageView }) {
  const optimise = useOptimiseOutage(organisationId, outage.id);
  const snapshot = outage.approved;
  const shown = snapshot ?? outage.proposal;
  const items = snapshot ? snapshot.items : outage.items;
  const selected = new Set(shown?.selectedItemIds ?? []);
  const chosenItems = items.filter((i) => selected.has(i.id));
  return (
    <section aria-labelledby="outage-scope-title" className="flex flex-col gap-3" data-testid="outage-scope">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="outage-scope-title">{snapshot ? `Approved scope: ${snapshot.scopeName}` : 'Proposed scope'}</h2>
        {!snapshot && outage.actions.optimise && (
          <Button
            disabled={optimise.isPending || outage.items.length === 0}
            onClick={() => optimise.mutate()}
            title={outage.items.length === 0 ? 'Add work first' : undefined}
          >
            {optimise.isPending ? 'Proposing…' : outage.proposal ? 'Propose again' : 'Propose a scope'}
          </Button>
        )}
      </div>
      {!snapshot && !outage.actions.optimise && <ReadOnlyReason reason={whyNot('outages.plan')} action="propose a scope" />}
      {optimise.isError && <Notice tone="fault">No proposal: {optimise.error.message}</Notice>}
      {!shown && (
        <p className="text-sm text-ink-soft">
          {outage.items.length === 0
            ? 'Add the candidate work first; then the optimiser picks the set worth most that fits the budget and, lane by lane, the window.'
            : 'No proposal yet. The optimiser picks the set of work worth most within the budget, with every lane’s work fitting the window, and says why for each item.'}
        </p>
      )}
      {shown && (
        <>
          <p className="text-xs text-ink-soft">
            {snapshot
              ? `As approved${outage.approvedBy ? ` by ${outage.approvedBy.name}` : ''}, ${formatDateTime(outage.approvedAt)}; the figures and reasons are as they were then.`
              : `Proposed ${formatDateTime(outage.proposal?.computedAt)}: the most value (benefit less cost) with the cost within the budget and each lane’s work inside the window, honouring what you forced in or out and what each item needs.`}
          </p>
          {!snapshot && outage.proposalStale && (
            <Notice tone="warn">The work, the window or the budget changed since this proposal: propose again before saving or approving it.</Notice>
          )}
          {!snapshot && outage.proposal && !outage.proposal.feasible && (
            <Notice tone="fault">
              No scope meets every limit with what is forced:
              <ul className="mt-1 list-disc pl-5">
                {outage.proposal.problems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            </Notice>
          )}
          <ScopeTotals
            totalBenefit={shown.totalBenefit}
            totalCost={shown.totalCost}
            laneDays={shown.laneDays}
            budget={snapshot?.budget ?? outage.budget}
            windowDays={snapshot?.windowDays ?? outage.windowDays}
            currency={outage.currency}
          />
          <ScopeReasons items={items} selected={selected} reasons={shown.reasons} currency={outage.currency} />
          <figure className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-3">
            <figcaption>
              <h3 className="text-sm font-semibold">Lanes across the window</h3>
              <p className="text-xs text-ink-soft">Each crew lane’s chosen work end to end from the first day; lanes work side by side.</p>
            </figcaption>
            <LaneChart items={chosenItems} startDate={snapshot?.startDate ?? outage.startDate} windowDays={snapshot?.windowDays ?? outage.windowDays} />
          </figure>
        </>
      )}
    </section>
  );
}
