import { Fragment, useState } from 'react';
import { OUTAGE_ITEM_KIND_WORDS, type OutageItemView, type OutageView } from '@shared/schemas/outages';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { formatCurrency, formatPercent } from '@frontend/lib/format';
import { useDeleteOutageItem, useUpdateOutageItem } from '../api/outage-items';
import { FORCED_WORDS, ItemForm, type ApprovedCaseChoice } from './item-form';
import { daysText } from './outage-words';

const PRICING_WORDS: Record<OutageItemView['pricing']['method'], string> = {
  entered: 'entered as money',
  cleanliness: 'priced from the cleanliness recovered',
  case: 'from the approved case',
};

function enteredText(item: OutageItemView): string | null {
  const e = item.benefitEntered;
  if (e === null || typeof e === 'number') return null;
  return `${formatPercent(e.cleanlinessRecovered, 1).replace(' %', '')} points of cleanliness over ${daysText(e.horizonDays)}`;
}

/** The in/out choice for the optimiser, changed on the spot by people who plan. */
function ForcedChoice({ organisationId, item, editable }: { organisationId: string; item: OutageItemView; editable: boolean }) {
  const update = useUpdateOutageItem(organisationId);
  const value = item.forced ?? '';
  if (!editable) return <span className="text-xs">{FORCED_WORDS[value]}</span>;
  return (
    <div className="flex flex-col gap-1">
      <select
        aria-label={`Optimiser choice for ${item.title}`}
        value={value}
        disabled={update.isPending}
        onChange={(e) => update.mutate({ id: item.id, patch: { forced: e.target.value === '' ? null : (e.target.value as 'in' | 'out') } })}
        className="rounded border border-rule bg-paper-raised px-1.5 py-1 text-xs"
      >
        {(['', 'in', 'out'] as const).map((f) => (
          <option key={f} value={f}>
            {FORCED_WORDS[f]}
          </option>
        ))}
      </select>
      {update.isError && <span className="text-2xs text-fault">{update.error.message}</span>}
    </div>
  );
}

interface Props {
  organisationId: string;
  outage: OutageView;
  approvedCases?: ApprovedCaseChoice[];
  /** the ids the scope shown on the page holds (the approved scope, else the latest proposal), if any */
  chosen: Set<string> | null;
}

/** The candidate work: what, where, cost, days, lane, benefit and how it was priced, what it needs, and the optimiser choice. */
export function ItemsTable({ organisationId, outage, approvedCases, chosen }: Props) {
  const [editing, setEditing] = useState<string | null>(null);
  const remove = useDeleteOutageItem(organisationId);
  const editable = outage.actions.edit;
  const titleOf = new Map(outage.items.map((i) => [i.id, i.title]));
  const items = outage.approved ? outage.approved.items : outage.items;
  const columns = 8 + (chosen ? 1 : 0) + (editable ? 1 : 0);
  return (
    <div className="flex flex-col gap-2">
      <DataTable
        caption="Candidate work for this outage"
        head={
          <>
            <th className={th}>Work</th>
            <th className={th}>Lane</th>
            <th className={`${th} text-right`}>Cost</th>
            <th className={`${th} text-right`}>Days</th>
            <th className={`${th} text-right`}>Benefit</th>
            <th className={th}>How priced</th>
            <th className={th}>Needs</th>
            <th className={th}>Optimiser</th>
            {chosen && <th className={th}>Scope</th>}
            {/* named by aria-label: a visually hidden span is positioned absolutely and, this far right, would widen the page past the table's scroll box */}
            {editable && <th className={th} aria-label="Change or remove" />}
          </>
        }
      >
        {items.map((item) =>
          editing === item.id ? (
            <tr key={item.id} className={tr}>
              <td className={td} colSpan={columns}>
                <ItemForm organisationId={organisationId} outage={outage} approvedCases={approvedCases} item={item} onDone={() => setEditing(null)} />
              </td>
            </tr>
          ) : (
            <Fragment key={item.id}>
              <tr className={tr} data-testid="outage-item-row">
                <td className={`${td} min-w-44`}>
                  <span className="font-medium">{item.title}</span>
                  <span className="block text-2xs text-ink-faint">
                    {OUTAGE_ITEM_KIND_WORDS[item.kind]} · {item.plantName ? `${item.plantName} — ` : ''}
                    {item.unitName}
                    {item.caseTitle && ` · case: ${item.caseTitle}`}
                  </span>
                </td>
                <td className={td}>{item.lane}</td>
                <td className={`${td} text-right tabular-nums whitespace-nowrap`}>{formatCurrency(item.cost, outage.currency)}</td>
                <td className={`${td} text-right tabular-nums`}>{item.durationDays}</td>
                <td className={`${td} text-right tabular-nums whitespace-nowrap text-ledger-700`}>{formatCurrency(item.benefit, outage.currency)}</td>
                <td className={`${td} min-w-48 text-xs text-ink-soft`}>
                  <span className="font-medium text-ink">{PRICING_WORDS[item.pricing.method]}</span>
                  {enteredText(item) && <span className="block">{enteredText(item)}</span>}
                  <span className="block">{item.pricing.text}</span>
                </td>
                <td className={`${td} text-xs`}>{item.needs.length === 0 ? '—' : item.needs.map((id) => titleOf.get(id) ?? 'a removed item').join(', ')}</td>
                <td className={td}>
                  <ForcedChoice organisationId={organisationId} item={item} editable={editable} />
                </td>
                {chosen && (
                  <td className={`${td} text-xs font-medium whitespace-nowrap`} data-testid="outage-item-chosen">
                    {chosen.has(item.id) ? <span className="text-ok">In</span> : <span className="text-ink-faint">Left out</span>}
                  </td>
                )}
                {editable && (
                  <td className={`${td} text-right`}>
                    <div className="flex flex-col items-end gap-1">
                      <Button variant="quiet" className="px-2 py-0.5 text-xs" onClick={() => setEditing(item.id)}>
                        Change
                      </Button>
                      <ConfirmAction
                        label="Remove"
                        question="The item leaves this outage; saved scopes that named it show it as missing."
                        confirmLabel="Remove the item"
                        pending={remove.isPending}
                        onConfirm={() => remove.mutate(item.id)}
                      />
                    </div>
                  </td>
                )}
              </tr>
            </Fragment>
          ),
        )}
      </DataTable>
      {remove.isError && <Notice tone="fault">Not removed: {remove.error.message}</Notice>}
    </div>
  );
}
