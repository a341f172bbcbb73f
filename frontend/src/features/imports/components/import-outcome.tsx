import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { Notice } from '@frontend/components/ui/notice';
import { ProgressBar } from '@frontend/components/ui/progress-bar';
import { linkClass } from '@frontend/components/ui/public-page';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { formatNumber, formatPlantTime } from '@frontend/lib/format';
import { importIsRunning, useImport, type ImportView } from '../api/get-import';
import { reasonLabel, STATUS_LABELS } from './import-words';

/** Step 3: progress while the server checks and stores, then what happened. */
export function ImportOutcome({ organisationId, importId, plantTimeZone }: { organisationId: string; importId: string; plantTimeZone: string }) {
  const query = useImport(organisationId, importId);
  if (query.isPending) return <LoadingState what="the import" />;
  if (query.isError) return <ErrorState what="the import" error={query.error} onRetry={() => query.refetch()} />;
  const view = query.data;
  return (
    <section aria-label="Import result" className="flex flex-col gap-4 rounded border border-rule bg-paper-raised p-4" data-testid="import-outcome">
      <div>
        <h2>3. {importIsRunning(view.status) ? 'Importing' : 'Result'}</h2>
        <p className="text-sm text-ink-soft">
          {view.fileName} — {STATUS_LABELS[view.status]}
        </p>
      </div>
      {importIsRunning(view.status) && <ProgressBar fraction={view.progress} label="Import progress" message={view.message ?? 'Waiting to start'} />}
      {view.status === 'complete' && <ImportSummary view={view} plantTimeZone={plantTimeZone} />}
      {view.status === 'rejected' && <RejectedImport view={view} />}
      {view.status === 'failed' && <Notice tone="fault">{view.message ?? 'The import stopped and stored nothing.'}</Notice>}
      {view.status === 'undone' && <Notice>This import was undone: its rows were removed and the unit recomputed.</Notice>}
    </section>
  );
}

function Count({ label, value, tone }: { label: string; value: number | undefined; tone?: 'warn' }) {
  return (
    <div className="rounded border border-rule px-3 py-2">
      <dt className="text-xs text-ink-soft">{label}</dt>
      <dd className={`text-lg font-semibold tabular-nums ${tone === 'warn' && value ? 'text-warn' : ''}`}>{formatNumber(value ?? 0)}</dd>
    </div>
  );
}

function ImportSummary({ view, plantTimeZone }: { view: ImportView; plantTimeZone: string }) {
  const c = view.counts ?? {};
  const reasons = Object.entries(c.rowsByReason ?? {})
    .filter(([, n]) => (n ?? 0) > 0)
    .sort(([, a], [, b]) => (b ?? 0) - (a ?? 0));
  const leftOut = reasons.reduce((s, [, n]) => s + (n ?? 0), 0);
  return (
    <div className="flex flex-col gap-4" data-testid="import-summary">
      <Notice tone="ok">
        Imported {formatNumber(c.stored ?? 0)} rows from {formatPlantTime(view.firstTimestamp, plantTimeZone)} to{' '}
        {formatPlantTime(view.lastTimestamp, plantTimeZone)} (plant time). The unit’s derived data has been recomputed.
      </Notice>
      <dl className="grid gap-2 sm:grid-cols-3 lg:grid-cols-6">
        <Count label="Rows read" value={c.rowsRead} />
        <Count label="Stored" value={c.stored} />
        <Count label="Used in calculations" value={c.rowsOk} />
        <Count label="Left out (stored with reason)" value={leftOut} tone="warn" />
        <Count label="Skipped: identical to stored" value={c.skippedIdentical} />
        <Count label="Conflicting: not stored" value={c.conflicting} tone="warn" />
      </dl>
      <div className="flex flex-col gap-2">
        <h3 className="text-sm font-semibold">Left out of the calculations, by reason</h3>
        {reasons.length === 0 ? (
          <p className="text-sm text-ink-soft">None: every stored row is steady and physical.</p>
        ) : (
          <>
            <p className="text-xs text-ink-soft">
              These rows are stored with their reason and can be seen in the data, but the cleanliness and cost figures do not use them.
            </p>
            <DataTable
              caption="Rows left out by reason"
              head={
                <>
                  <th className={th}>Reason</th>
                  <th className={`${th} text-right`}>Rows</th>
                </>
              }
            >
              {reasons.map(([code, n]) => (
                <tr key={code} className={tr} data-testid="reason-row">
                  <td className={td}>{reasonLabel(code)}</td>
                  <td className={`${td} text-right tabular-nums`}>{formatNumber(n ?? 0)}</td>
                </tr>
              ))}
            </DataTable>
            {Object.keys(c.rowsByMarker ?? {}).length > 0 && (
              <p className="text-sm" data-testid="marker-counts">
                <span className="text-ink-soft">Instrument status, by the historian’s word: </span>
                {Object.entries(c.rowsByMarker ?? {})
                  .sort(([, a], [, b]) => b - a)
                  .map(([word, n]) => `${word} ${formatNumber(n)}`)
                  .join(', ')}
              </p>
            )}
          </>
        )}
      </div>
      {(c.conflicts?.length ?? 0) > 0 && (
        <p className="text-sm text-warn">
          Conflicting times (already stored with other values; the stored rows were kept):{' '}
          {c
            .conflicts!.slice(0, 5)
            .map((x) => formatPlantTime(x.timestampUtc, plantTimeZone))
            .join(', ')}
          {c.conflicts!.length > 5 ? ` and ${c.conflicts!.length - 5} more` : ''}. Undo the earlier import first to replace them.
        </p>
      )}
      <NotesList view={view} />
    </div>
  );
}

function NotesList({ view }: { view: ImportView }) {
  const assumptions = view.notes?.assumptions ?? [];
  const warnings = view.notes?.warnings ?? [];
  if (!assumptions.length && !warnings.length) return null;
  return (
    <div className="grid gap-3 md:grid-cols-2">
      {assumptions.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold">Assumptions</h3>
          <ul className="ml-5 list-disc text-sm text-ink-soft">
            {assumptions.map((a) => (
              <li key={a}>{a}</li>
            ))}
          </ul>
        </div>
      )}
      {warnings.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-warn">Warnings</h3>
          <ul className="ml-5 list-disc text-sm text-warn">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

function RejectedImport({ view }: { view: ImportView }) {
  // a file-level error (unreadable, no header…) comes as one error without a column
  const fileLevel = view.errors.length === 1 && !view.errors[0]?.column;
  return (
    <div className="flex flex-col gap-3" data-testid="import-rejected">
      <Notice tone="fault">
        Nothing was imported:{' '}
        {fileLevel
          ? `${(view.message ?? 'the file could not be read').replace(/\.$/, '')}.`
          : `the file has ${formatNumber(view.errorCount)} problem${view.errorCount === 1 ? '' : 's'} to fix.`}{' '}
        Fix the file (or the column mapping) and upload it again.
      </Notice>
      <p className="text-sm">
        {formatNumber(view.errorCount)} problem{view.errorCount === 1 ? '' : 's'}
        {view.errorCount > view.errors.length ? `; the first ${view.errors.length} are listed here` : ''}.{' '}
        <a className={linkClass} href={`/api/imports/${view.id}/errors.csv`} download>
          Download all errors (CSV)
        </a>
      </p>
      <DataTable
        caption="File errors by row and column"
        head={
          <>
            <th className={`${th} text-right`}>Row</th>
            <th className={th}>Column</th>
            <th className={th}>Value</th>
            <th className={th}>Problem</th>
          </>
        }
      >
        {view.errors.map((e, i) => (
          <tr key={i} className={tr} data-testid="error-row">
            <td className={`${td} text-right tabular-nums`}>{e.row || '—'}</td>
            <td className={td}>{e.column || '—'}</td>
            <td className={`${td} font-mono text-xs`}>{e.value || '—'}</td>
            <td className={td}>{e.message}</td>
          </tr>
        ))}
      </DataTable>
      <NotesList view={view} />
    </div>
  );
}
