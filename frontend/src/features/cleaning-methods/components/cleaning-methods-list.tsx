import { Fragment, useState } from 'react';
import { GENERAL_CAUTION } from '@shared/schemas/cleaning-method';
import { Button } from '@frontend/components/ui/button';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { SafetyCautions } from '@frontend/components/ui/safety-cautions';
import { formatNumber, formatPercent } from '@frontend/lib/format';
import { useDeleteCleaningMethod } from '../api/delete-cleaning-method';
import { useCleaningMethods, type CleaningMethodView } from '../api/get-cleaning-methods';
import { CleaningMethodForm } from './cleaning-method-form';
import { TYPICAL_VALUES_TITLE, unitDuringCleaningText } from './method-labels';

interface Props {
  organisationId: string;
  /** null when the person may edit the library; otherwise the reason shown beside the disabled actions. */
  cannotWrite: string | null;
}

const columnsFor = (cannotWrite: string | null) => (cannotWrite ? 7 : 8);
const money = (v: number) => formatNumber(v, v % 1 === 0 ? 0 : 2);

/**
 * The organisation's cleaning methods, the library cleaning work is planned from: the general caution stands
 * above it, and each row opens to show the method's own cautions.
 */
export function CleaningMethodsList({ organisationId, cannotWrite }: Props) {
  const methods = useCleaningMethods(organisationId);
  const remove = useDeleteCleaningMethod(organisationId);
  const [open, setOpen] = useState<string | null>(null);
  const [editing, setEditing] = useState<string | null>(null);
  const columns = columnsFor(cannotWrite);
  const takenKeys = methods.data?.map((m) => m.id) ?? [];

  return (
    <div className="flex flex-col gap-4">
      <SafetyCautions texts={[GENERAL_CAUTION]} testId="library-caution" />
      {cannotWrite ? (
        <ReadOnlyReason reason={cannotWrite} action="add, change and delete cleaning methods" />
      ) : (
        <CleaningMethodForm organisationId={organisationId} takenKeys={takenKeys} />
      )}
      {remove.isError && <Notice tone="fault">{remove.error.message}</Notice>}
      {methods.isPending ? (
        <LoadingState what="cleaning methods" />
      ) : methods.isError ? (
        <ErrorState what="cleaning methods" error={methods.error} onRetry={() => methods.refetch()} />
      ) : methods.data.length === 0 ? (
        <EmptyState
          title="No cleaning methods"
          next={
            cannotWrite
              ? 'An administrator or analyst can add the methods your plants use.'
              : 'Add the methods your plants use, with your own quotes, durations and results.'
          }
        />
      ) : (
        <DataTable
          caption="Cleaning methods"
          head={
            <>
              <th className={th}>Method</th>
              <th className={th}>Unit meanwhile</th>
              <th className={`${th} text-right`}>Days</th>
              <th className={`${th} text-right`}>Fixed cost</th>
              <th className={`${th} text-right`}>Cost per tube</th>
              <th className={`${th} text-right`}>Cleanliness recovered</th>
              <th className={`${th} text-right`}>Fouling-rate multiplier</th>
              {!cannotWrite && (
                <th className={th}>
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </>
          }
        >
          {methods.data.map((m) =>
            editing === m.recordId ? (
              <tr key={m.recordId} className={`${tr} bg-tube-50/40`}>
                <td className={td} colSpan={columns}>
                  <CleaningMethodForm organisationId={organisationId} method={m} onDone={() => setEditing(null)} />
                </td>
              </tr>
            ) : (
              <Fragment key={m.recordId}>
                <MethodRow
                  method={m}
                  expanded={open === m.recordId}
                  onToggle={() => setOpen(open === m.recordId ? null : m.recordId)}
                  cannotWrite={cannotWrite}
                  onEdit={() => setEditing(m.recordId)}
                  deleting={remove.isPending && remove.variables === m.recordId}
                  onDelete={() => remove.mutate(m.recordId)}
                />
                {open === m.recordId && (
                  <tr className={tr} id={`method-${m.recordId}-details`}>
                    <td className={`${td} bg-paper-sunk/40`} colSpan={columns}>
                      <SafetyCautions texts={m.cautionTexts} testId="method-cautions" />
                      {m.note && <p className="mt-2 text-xs text-ink-soft">{m.note}</p>}
                    </td>
                  </tr>
                )}
              </Fragment>
            ),
          )}
        </DataTable>
      )}
      <p className="text-xs text-ink-soft">Costs are in the plant’s currency. Cleanliness recovered is the cleanliness factor right after the cleaning.</p>
    </div>
  );
}

interface RowProps {
  method: CleaningMethodView;
  expanded: boolean;
  onToggle: () => void;
  cannotWrite: string | null;
  onEdit: () => void;
  deleting: boolean;
  onDelete: () => void;
}

function MethodRow({ method: m, expanded, onToggle, cannotWrite, onEdit, deleting, onDelete }: RowProps) {
  return (
    <tr className={tr} data-testid="cleaning-method-row">
      <td className={td}>
        <button
          type="button"
          className="text-left font-medium text-tube-700 hover:underline"
          aria-expanded={expanded}
          aria-controls={`method-${m.recordId}-details`}
          onClick={onToggle}
        >
          <span aria-hidden className="mr-1 inline-block w-3 text-ink-faint">
            {expanded ? '▾' : '▸'}
          </span>
          {m.name}
        </button>
        <span className="ml-4 block font-mono text-2xs text-ink-faint">{m.id}</span>
        {m.typical && (
          <span
            title={TYPICAL_VALUES_TITLE}
            data-testid="typical-tag"
            className="mt-1 ml-4 inline-block rounded border border-rule bg-paper-sunk px-1.5 py-0.5 text-2xs text-ink-soft"
          >
            Typical values
          </span>
        )}
      </td>
      <td className={`${td} whitespace-nowrap`}>{unitDuringCleaningText(m)}</td>
      <td className={`${td} text-right tabular-nums`}>{formatNumber(m.durationDays)}</td>
      <td className={`${td} text-right tabular-nums whitespace-nowrap text-ledger-700`}>{money(m.fixedCost)}</td>
      <td className={`${td} text-right tabular-nums whitespace-nowrap text-ledger-700`}>{money(m.costPerTube)}</td>
      <td className={`${td} text-right tabular-nums`}>{formatPercent(m.recoveredCleanliness, 0)}</td>
      <td className={`${td} text-right tabular-nums`}>{formatNumber(m.foulingRateMultiplier, 2)}</td>
      {!cannotWrite && (
        <td className={`${td} text-right`}>
          <div className="flex items-start justify-end gap-2">
            <Button variant="quiet" onClick={onEdit} aria-label={`Change ${m.name}`}>
              Change
            </Button>
            <ConfirmAction
              label="Delete"
              question={`Delete “${m.name}” from the library? Events already recorded keep its key; new cleaning cases can no longer pick it.`}
              confirmLabel="Delete method"
              pending={deleting}
              onConfirm={onDelete}
            />
          </div>
        </td>
      )}
    </tr>
  );
}
