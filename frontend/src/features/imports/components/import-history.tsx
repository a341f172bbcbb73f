import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass } from '@frontend/components/ui/public-page';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { formatBytes, formatDateTime, formatNumber, formatPlantDate } from '@frontend/lib/format';
import { IMPORT_LEFT_OUT_NOTE } from '@frontend/lib/left-out-words';
import { importIsRunning, type ImportView } from '../api/get-import';
import { useUnitImports } from '../api/get-imports';
import { useUndoImport } from '../api/undo-import';
import { STATUS_LABELS } from './import-words';

const leftOut = (i: ImportView) => Object.values(i.counts?.rowsByReason ?? {}).reduce((s: number, n) => s + (n ?? 0), 0);
const canUndo = (i: ImportView) => i.status === 'complete' || i.status === 'rejected' || i.status === 'failed' || i.status === 'mapping';

export function ImportHistory({
  organisationId,
  unitId,
  plantTimeZone,
  cannotWrite,
}: {
  organisationId: string;
  unitId: string;
  plantTimeZone: string;
  cannotWrite: string | null;
}) {
  const imports = useUnitImports(organisationId, unitId);
  const undo = useUndoImport(organisationId, unitId);
  if (imports.isPending) return <LoadingState what="the import history" />;
  if (imports.isError) return <ErrorState what="the import history" error={imports.error} onRetry={() => imports.refetch()} />;
  if (imports.data.length === 0) {
    return (
      <EmptyState
        title="No imports yet"
        next={
          cannotWrite
            ? 'Historian files appear here once an analyst or administrator imports them.'
            : 'Choose a historian export (CSV or XLSX) above to bring in this unit’s performance data.'
        }
      />
    );
  }
  return (
    <div className="flex flex-col gap-2">
      {cannotWrite && <ReadOnlyReason reason={cannotWrite} action="import files and undo imports" />}
      {undo.isError && <Notice tone="fault">{undo.error.message}</Notice>}
      <DataTable
        caption="Import history"
        head={
          <>
            <th className={th}>File</th>
            <th className={th}>Uploaded</th>
            <th className={th}>Status</th>
            <th className={`${th} text-right`}>Rows stored</th>
            <th className={`${th} text-right`}>Left out</th>
            <th className={th}>Data from – to (plant days)</th>
            {!cannotWrite && (
              <th className={th}>
                <span className="sr-only">Actions</span>
              </th>
            )}
          </>
        }
      >
        {imports.data.map((i) => (
          <tr key={i.id} className={tr} data-testid="import-row">
            <td className={td}>
              <span className="font-medium">{i.fileName}</span>
              <span className="block text-xs text-ink-faint">{formatBytes(i.fileBytes)}</span>
            </td>
            <td className={`${td} whitespace-nowrap`}>{formatDateTime(i.createdAt)}</td>
            <td className={`${td} ${i.status === 'rejected' || i.status === 'failed' ? 'text-fault' : i.status === 'undone' ? 'text-ink-faint' : ''}`}>
              {STATUS_LABELS[i.status]}
              {importIsRunning(i.status) && <span className="block text-xs text-ink-soft">{Math.round(i.progress * 100)} %</span>}
              {i.status === 'rejected' && (
                <a className={`${linkClass} block text-xs`} href={`/api/imports/${i.id}/errors.csv`} download>
                  {formatNumber(i.errorCount)} errors (CSV)
                </a>
              )}
            </td>
            <td className={`${td} text-right tabular-nums`}>{i.status === 'complete' ? formatNumber(i.counts?.stored ?? 0) : '—'}</td>
            <td className={`${td} text-right tabular-nums`}>{i.status === 'complete' ? formatNumber(leftOut(i)) : '—'}</td>
            <td className={`${td} whitespace-nowrap`}>
              {i.firstTimestamp ? `${formatPlantDate(i.firstTimestamp, plantTimeZone)} – ${formatPlantDate(i.lastTimestamp, plantTimeZone)}` : '—'}
            </td>
            {!cannotWrite && (
              <td className={`${td} text-right`}>
                {canUndo(i) && (
                  <ConfirmAction
                    label="Undo"
                    question={`Undo “${i.fileName}”? This removes the rows this import brought and recomputes the unit’s derived data.`}
                    confirmLabel="Undo import"
                    pending={undo.isPending && undo.variables === i.id}
                    onConfirm={() => undo.mutate(i.id)}
                  />
                )}
              </td>
            )}
          </tr>
        ))}
      </DataTable>
      <p className="text-xs text-ink-soft" data-testid="left-out-note">
        {IMPORT_LEFT_OUT_NOTE}
      </p>
    </div>
  );
}
