import { lazy, Suspense, useId, useState } from 'react';
import { GENERIC_CORRECTION_CURVE } from '@shared/domain/turbine/generic-curve';
import type { DisplayUnit } from '@shared/units';
import { Button } from '@frontend/components/ui/button';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { Notice } from '@frontend/components/ui/notice';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import { chartSeries, curveFromDraft, GENERIC_LABEL, pointsFromCsv, type CurveDraft, type CurvePointText } from './correction-curve-draft';

const CorrectionCurveChart = lazy(() => import('./correction-curve-chart'));

interface Props {
  draft: CurveDraft;
  onChange: (draft: CurveDraft) => void;
  pressure: DisplayUnit;
  error?: string;
  disabled?: boolean;
}

const cellInput = 'w-24 rounded border border-rule bg-paper-raised px-2 py-1 text-right text-sm tabular-nums';

/** The turbine maker's exhaust-pressure correction, point by point, with a live chart; or the generic curve, labelled as such. */
export function CorrectionCurveEditor({ draft, onChange, pressure, error, disabled }: Props) {
  const id = useId();
  const [paste, setPaste] = useState('');
  const [readNote, setReadNote] = useState<string | null>(null);
  const curve = draft.mode === 'generic' ? GENERIC_CORRECTION_CURVE : curveFromDraft(draft, pressure);
  const series = curve ? chartSeries(curve, pressure) : [];
  const basisLabel = curve?.basis === 'output' ? 'Output change' : 'Heat-rate change';

  const setRow = (i: number, patch: Partial<CurvePointText>) => onChange({ ...draft, rows: draft.rows.map((r, k) => (k === i ? { ...r, ...patch } : r)) });
  const readRows = (text: string, source: string) => {
    const { rows, skipped } = pointsFromCsv(text);
    if (rows.length === 0)
      return setReadNote(`No points found in the ${source}: each line needs load fraction, backpressure (${pressure.label}) and change %.`);
    onChange({ ...draft, mode: 'maker', rows });
    setReadNote(
      `Read ${rows.length} points from the ${source}${skipped ? `; ${skipped} line${skipped === 1 ? '' : 's'} without three numbers skipped (a header, say)` : ''}.`,
    );
  };

  return (
    <div className="flex flex-col gap-3" aria-describedby={error ? `${id}-error` : undefined}>
      <div className="flex flex-col gap-1.5" role="radiogroup" aria-label="Correction curve source">
        <label className="flex items-center gap-2 text-sm">
          <input
            type="radio"
            name={`${id}-mode`}
            checked={draft.mode === 'generic'}
            disabled={disabled}
            onChange={() => onChange({ ...draft, mode: 'generic' })}
          />
          Use the generic curve <span className="rounded bg-ledger-50 px-1.5 py-0.5 text-xs text-warn">{GENERIC_LABEL}</span>
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="radio"
            name={`${id}-mode`}
            checked={draft.mode === 'maker'}
            disabled={disabled}
            onChange={() => onChange({ ...draft, mode: 'maker', rows: draft.rows.length ? draft.rows : [{ loadPct: '100', backpressure: '', changePct: '' }] })}
          />
          Enter the turbine maker’s curve
        </label>
      </div>

      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
        <div className="flex flex-col gap-3">
          {draft.mode === 'generic' ? (
            <p className="text-sm text-ink-soft">
              The generic curve is a typical shape (zero at 2.0 inHgA, steeper at part load), not this turbine’s. Costs built on it are rough: replace it with
              the maker’s curve from the heat balance or the acceptance test when you have it.
            </p>
          ) : (
            <>
              <div className="grid gap-3 sm:grid-cols-2">
                <SelectField
                  label="Curve gives"
                  value={draft.basis}
                  disabled={disabled}
                  onChange={(e) => onChange({ ...draft, basis: e.target.value as CurveDraft['basis'] })}
                >
                  <option value="heat-rate">% change of heat rate</option>
                  <option value="output">% change of output</option>
                </SelectField>
                <TextField
                  label="Curve name"
                  value={draft.label}
                  disabled={disabled}
                  placeholder="e.g. maker’s heat balance 2019"
                  onChange={(e) => onChange({ ...draft, label: e.target.value })}
                />
              </div>
              <DataTable
                caption="Correction curve points"
                head={
                  <>
                    <th className={`${th} text-right`}>Load (% of rating)</th>
                    <th className={`${th} text-right`}>
                      Backpressure <span className="normal-case">({pressure.label})</span>
                    </th>
                    <th className={`${th} text-right`}>Change (%)</th>
                    <th className={th}>
                      <span className="sr-only">Remove</span>
                    </th>
                  </>
                }
              >
                {draft.rows.map((r, i) => (
                  <tr key={i} className={tr} data-testid="curve-point">
                    <td className={`${td} text-right`}>
                      <input
                        aria-label={`Load of point ${i + 1}`}
                        className={cellInput}
                        inputMode="decimal"
                        value={r.loadPct}
                        disabled={disabled}
                        onChange={(e) => setRow(i, { loadPct: e.target.value })}
                      />
                    </td>
                    <td className={`${td} text-right`}>
                      <input
                        aria-label={`Backpressure of point ${i + 1}`}
                        className={cellInput}
                        inputMode="decimal"
                        value={r.backpressure}
                        disabled={disabled}
                        onChange={(e) => setRow(i, { backpressure: e.target.value })}
                      />
                    </td>
                    <td className={`${td} text-right`}>
                      <input
                        aria-label={`Change of point ${i + 1}`}
                        className={cellInput}
                        inputMode="decimal"
                        value={r.changePct}
                        disabled={disabled}
                        onChange={(e) => setRow(i, { changePct: e.target.value })}
                      />
                    </td>
                    <td className={`${td} text-right`}>
                      <Button
                        variant="quiet"
                        disabled={disabled}
                        aria-label={`Remove point ${i + 1}`}
                        onClick={() => onChange({ ...draft, rows: draft.rows.filter((_, k) => k !== i) })}
                      >
                        Remove
                      </Button>
                    </td>
                  </tr>
                ))}
              </DataTable>
              <div>
                <Button
                  variant="quiet"
                  disabled={disabled}
                  onClick={() =>
                    onChange({ ...draft, rows: [...draft.rows, { loadPct: draft.rows.at(-1)?.loadPct ?? '100', backpressure: '', changePct: '' }] })
                  }
                >
                  Add point
                </Button>
              </div>
            </>
          )}
          {!disabled && (
            <details className="rounded border border-rule bg-paper px-3 py-2 text-sm">
              <summary className="cursor-pointer font-medium">Paste or upload points (CSV)</summary>
              <div className="mt-2 flex flex-col gap-2">
                <p className="text-xs text-ink-soft">
                  Three columns per line: load fraction (e.g. 0.75), backpressure in {pressure.label}, change in %. Commas, semicolons or tabs between them; a
                  header line is skipped. The points replace the table.
                </p>
                <textarea
                  aria-label="Pasted curve points"
                  rows={4}
                  value={paste}
                  onChange={(e) => setPaste(e.target.value)}
                  className="rounded border border-rule bg-paper-raised px-2 py-1 font-mono text-xs"
                  placeholder={`1.0, ${pressure.label === 'inHgA' ? '2.5, 0.7' : '8.5, 0.7'}`}
                />
                <div className="flex flex-wrap items-center gap-3">
                  <Button variant="quiet" onClick={() => readRows(paste, 'pasted text')} disabled={!paste.trim()}>
                    Read pasted points
                  </Button>
                  <label className="text-xs text-ink-soft">
                    or a file:{' '}
                    <input
                      type="file"
                      accept=".csv,.txt,text/csv,text/plain"
                      className="text-xs"
                      onChange={(e) => {
                        const file = e.target.files?.[0];
                        if (file) void file.text().then((t) => readRows(t, `file ${file.name}`));
                        e.target.value = '';
                      }}
                    />
                  </label>
                </div>
                {readNote && (
                  <p className="text-xs text-ink-soft" role="status">
                    {readNote}
                  </p>
                )}
              </div>
            </details>
          )}
          {error && (
            <p id={`${id}-error`} className="text-xs text-fault">
              {error}
            </p>
          )}
        </div>
        <div className="rounded border border-rule bg-paper-raised p-2">
          <p className="px-1 text-xs font-medium text-ink-soft">
            {basisLabel} against backpressure{draft.mode === 'generic' ? ` — ${GENERIC_LABEL}` : ''}
          </p>
          {series.length === 0 ? (
            <Notice className="m-2">Enter at least two points at a load to see the curve.</Notice>
          ) : (
            <Suspense fallback={<div className="h-72 animate-pulse rounded bg-paper-sunk" aria-label="Loading the chart" />}>
              <CorrectionCurveChart series={series} pressureLabel={pressure.label} basisLabel={basisLabel} />
            </Suspense>
          )}
        </div>
      </div>
    </div>
  );
}
