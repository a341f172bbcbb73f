import { useMemo, useState } from 'react';
import {
  DATE_ORDERS,
  IMPORT_QUANTITIES,
  IMPORT_QUANTITY_UNITS,
  importMappingSchema,
  REPEATED_HOUR_RULES,
  TIMESTAMP_FORMATS,
  ALIGNMENT_RULES,
  GRID_MINUTES,
  type AlignmentRule,
  type ImportMappingInput,
  type ImportQuantity,
} from '@shared/schemas/import-mapping';
import { Button } from '@frontend/components/ui/button';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { Notice } from '@frontend/components/ui/notice';
import { SelectField } from '@frontend/components/ui/select-field';
import { TimeZonePicker } from '@frontend/components/ui/time-zone-picker';
import { ApiError } from '@frontend/lib/api-client';
import { formatStored, parseNumberText, type FieldUnits } from '@frontend/lib/field-units';
import { useChooseSheet } from '../api/choose-sheet';
import { useStartImport } from '../api/start-import';
import type { ImportView } from '../api/get-import';
import type { UploadResponse } from '../api/upload-historian-file';
import { DATE_ORDER_LABELS, QUANTITY_LABELS, REPEATED_HOUR_LABELS, TIMESTAMP_FORMAT_LABELS, unitLabel } from './import-words';
import { StatusWordsPanel } from './status-words-panel';

type Role = ImportQuantity | 'timestamp' | 'quality' | '';
interface Assignment {
  role: Role;
  unit: string;
}

interface Props {
  organisationId: string;
  upload: UploadResponse;
  plantTimeZone: string;
  /** The condenser's design CW flow, m³/s; null when the condenser is not set up. */
  designCwFlowM3s: number | null;
  units: FieldUnits;
  onStarted: (view: ImportView) => void;
  onCancel: () => void;
}

const UNASSIGNED: Assignment = { role: '', unit: '' };

const selectClass = 'w-full rounded border border-rule bg-paper-raised px-2 py-1 text-sm';

/** Tags are mapped for a tall file and for files of one tag each. */
const mapsTags = (upload: UploadResponse): boolean => upload.shape === 'tall' || upload.shape === 'per-tag-files';
/** What the person maps: a wide file's columns, or the tags. */
const namesOf = (upload: UploadResponse): string[] => (mapsTags(upload) ? upload.tags.map((t) => t.name) : upload.headers);

const RULE_LABELS: Record<AlignmentRule, string> = {
  nearest: 'The sample nearest the grid time',
  interpolate: 'A straight line between the samples either side',
  'interval-mean': 'The mean over the interval ending at the grid time',
};

function initialAssignments(upload: UploadResponse): Record<string, Assignment> {
  const m = upload.proposedMapping;
  const out: Record<string, Assignment> = Object.fromEntries(namesOf(upload).map((h) => [h, { role: '' as Role, unit: '' }]));
  if (m.timestamp?.column && out[m.timestamp.column]) out[m.timestamp.column] = { role: 'timestamp', unit: '' };
  if (m.quality?.column && out[m.quality.column]) out[m.quality.column] = { role: 'quality', unit: '' };
  for (const q of IMPORT_QUANTITIES) {
    const ref = m.columns?.[q];
    if (ref && out[ref.column]) out[ref.column] = { role: q, unit: ref.unit };
  }
  return out;
}

const defaultUnit = (q: ImportQuantity, guessed: string | null | undefined): string => {
  const allowed: readonly [string, ...string[]] = IMPORT_QUANTITY_UNITS[q];
  return guessed && allowed.includes(guessed) ? guessed : allowed[0];
};

/** Step 2, with the sheet of a workbook chosen first: a new sheet starts its mapping afresh. */
export function MappingStep(props: Props) {
  const [view, setView] = useState(props.upload);
  const choose = useChooseSheet();
  return (
    <div className="flex flex-col gap-2">
      {view.sheets.length > 1 && (
        <div className="max-w-xs">
          <SelectField
            label="Sheet of the workbook"
            value={view.sheet ?? ''}
            disabled={choose.isPending}
            onChange={(e) => choose.mutate({ importId: view.import.id, sheet: e.target.value }, { onSuccess: setView })}
          >
            {view.sheets.map((name) => (
              <option key={name} value={name}>
                {name}
              </option>
            ))}
          </SelectField>
        </div>
      )}
      {choose.isError && <Notice tone="fault">{choose.error.message}</Notice>}
      <MappingForm key={view.sheet ?? ''} {...props} upload={view} />
    </div>
  );
}

/** What each column is and in which unit, how to read the timestamps, and the assumptions for missing meters. */
function MappingForm({ organisationId, upload, plantTimeZone, designCwFlowM3s, units, onStarted, onCancel }: Props) {
  const start = useStartImport(organisationId);
  const proposed = upload.proposedMapping;
  const [assignments, setAssignments] = useState(() => initialAssignments(upload));
  const [format, setFormat] = useState<(typeof TIMESTAMP_FORMATS)[number]>(proposed.timestamp?.format ?? 'iso-8601-offset');
  const [timeZone, setTimeZone] = useState(proposed.timestamp?.timeZone ?? plantTimeZone);
  const [dateOrder, setDateOrder] = useState<(typeof DATE_ORDERS)[number]>(proposed.timestamp?.dateOrder ?? 'ymd');
  const [repeatedHour, setRepeatedHour] = useState<(typeof REPEATED_HOUR_RULES)[number]>(proposed.timestamp?.repeatedHour ?? 'by-file-order');
  const [decimalSeparator, setDecimalSeparator] = useState<'.' | ','>(proposed.decimalSeparator ?? '.');
  const [vacuum, setVacuum] = useState(!!proposed.columns?.condenserVacuum);
  const [barometerText, setBarometerText] = useState(proposed.fixedBarometer ? String(proposed.fixedBarometer.value) : '');
  const [barometerUnit, setBarometerUnit] = useState<string>(proposed.fixedBarometer?.unit ?? (units.pressureKpa.label === 'inHgA' ? 'inHg' : 'kPa'));
  const [flowNotMetered, setFlowNotMetered] = useState(proposed.designCwFlowM3s !== undefined && !proposed.columns?.cwFlow);
  const [goodText, setGoodText] = useState((proposed.quality?.goodValues ?? ['Good']).join(', '));
  const tallShape = mapsTags(upload) ? proposed.tall : undefined;
  const [averagingText, setAveragingText] = useState(proposed.averagingMinutes !== undefined ? String(proposed.averagingMinutes) : '');
  const [gridMinutes, setGridMinutes] = useState<(typeof GRID_MINUTES)[number]>(proposed.tall?.gridMinutes ?? 60);
  const [rule, setRule] = useState<AlignmentRule>(proposed.tall?.rule ?? 'nearest');
  const [toleranceText, setToleranceText] = useState(String(proposed.tall?.toleranceMinutes ?? 5));

  const guessByHeader = useMemo(() => new Map(upload.guess.columns.map((g) => [g.header, g])), [upload]);

  const assign = (header: string, role: Role) =>
    setAssignments((current) => {
      const next = { ...current };
      // one column per quantity: choosing it here takes it from another column
      if (role) for (const [h, other] of Object.entries(next)) if (h !== header && other.role === role) next[h] = UNASSIGNED;
      next[header] = { role, unit: role && role !== 'timestamp' && role !== 'quality' ? defaultUnit(role, guessByHeader.get(header)?.unit) : '' };
      return next;
    });

  const toggleVacuum = (on: boolean) => {
    setVacuum(on);
    setAssignments((current) => {
      const next = { ...current };
      for (const [h, a] of Object.entries(next)) {
        if (on && a.role === 'backpressure') next[h] = { ...a, role: 'condenserVacuum' };
        if (!on && a.role === 'condenserVacuum') next[h] = { ...a, role: 'backpressure' };
      }
      return next;
    });
  };

  const mapping: ImportMappingInput = useMemo(() => {
    const columns: ImportMappingInput['columns'] = {};
    let timestampColumn = tallShape ? (proposed.timestamp?.column ?? '') : '';
    let qualityColumn = tallShape ? (proposed.quality?.column ?? '') : '';
    for (const [header, a] of Object.entries(assignments)) {
      if (a.role === 'timestamp') timestampColumn = header;
      else if (a.role === 'quality') qualityColumn = header;
      else if (a.role && !(flowNotMetered && a.role === 'cwFlow'))
        (columns as Record<string, { column: string; unit: string }>)[a.role] = { column: header, unit: a.unit };
    }
    const barometer = parseNumberText(barometerText);
    const tolerance = parseNumberText(toleranceText);
    const averaging = averagingText.trim() === '' ? undefined : (parseNumberText(averagingText) ?? Number.NaN);
    return {
      ...(averaging !== undefined && { averagingMinutes: averaging }),
      ...(tallShape && {
        tall: { tagColumn: tallShape.tagColumn, valueColumn: tallShape.valueColumn, gridMinutes, rule, toleranceMinutes: tolerance ?? Number.NaN },
      }),
      ...(upload.sheet !== null && upload.sheets.length > 1 && { sheet: upload.sheet }),
      timestamp: {
        column: timestampColumn,
        format,
        ...(format !== 'iso-8601-offset' && { timeZone }),
        ...(format === 'local-text' && { dateOrder }),
        repeatedHour,
      },
      columns,
      decimalSeparator,
      ...(flowNotMetered && designCwFlowM3s !== null && { designCwFlowM3s }),
      ...(vacuum && !columns.barometer && barometer !== undefined && { fixedBarometer: { value: barometer, unit: barometerUnit as 'kPa' } }),
      ...(qualityColumn && {
        quality: {
          column: qualityColumn,
          goodValues: goodText
            .split(',')
            .map((v) => v.trim())
            .filter(Boolean),
        },
      }),
    };
  }, [
    upload.sheet,
    upload.sheets,
    tallShape,
    proposed.timestamp?.column,
    proposed.quality?.column,
    gridMinutes,
    rule,
    toleranceText,
    averagingText,
    assignments,
    format,
    timeZone,
    dateOrder,
    repeatedHour,
    decimalSeparator,
    flowNotMetered,
    designCwFlowM3s,
    vacuum,
    barometerText,
    barometerUnit,
    goodText,
  ]);

  const localProblems = useMemo(() => {
    const parsed = importMappingSchema.safeParse(mapping);
    const problems = parsed.success
      ? []
      : parsed.error.issues.map((i) => (i.path[0] === 'timestamp' && i.path[1] === 'column' ? 'choose the timestamp column' : i.message));
    if (flowNotMetered && designCwFlowM3s === null) problems.push('the design CW flow is not set: save the condenser setup first, or map a CW flow column');
    return [...new Set(problems)];
  }, [mapping, flowNotMetered, designCwFlowM3s]);
  const serverProblems = start.error instanceof ApiError ? (start.error.details?.fieldErrors ?? []).map((f) => `${f.path}: ${f.message}`) : [];

  const submit = () => {
    if (localProblems.length) return;
    start.mutate({ importId: upload.import.id, mapping }, { onSuccess: onStarted });
  };

  return (
    <section aria-label="Map the columns" className="flex flex-col gap-4 rounded border border-rule bg-paper-raised p-4">
      <div>
        <h2>{tallShape ? '2. Say what each tag is' : '2. Say what each column is'}</h2>
        <p className="text-sm text-ink-soft">
          {upload.shape === 'per-tag-files' && upload.files.length > 0 ? '' : `${upload.import.fileName}: `}
          {upload.shape === 'per-tag-files'
            ? `${upload.files.length} files of one tag each: say which tag is which quantity.`
            : tallShape
              ? `one row per tag per time; ${upload.tags.length} tags${upload.moreTags ? ' (the first 500)' : ''}: say which tag is which quantity.`
              : `${upload.headers.length} columns.`}{' '}
          {upload.mappingSource === 'saved'
            ? 'Filled in from this unit’s last import, which had the same columns.'
            : 'Filled in from the column names and values; check every row, then start the import.'}{' '}
          The mapping is kept for the next file.
          {upload.units.some(Boolean) && ' The units row under the names was read: the units it gives are proposed below.'}
        </p>
        {upload.titleLines.length > 0 && (
          <details className="mt-1 text-xs text-ink-soft">
            <summary className="cursor-pointer">Lines above the header ({upload.titleLines.length}), not imported</summary>
            <ul className="ml-5 list-disc font-mono">
              {upload.titleLines.map((line, k) => (
                <li key={k}>{line}</li>
              ))}
            </ul>
          </details>
        )}
      </div>

      {upload.shape === 'per-tag-files' && <TagFilesTable files={upload.files} />}

      <DataTable
        caption="Columns of the file"
        head={
          <>
            <th className={th}>{tallShape ? 'Tag in the file' : 'Column in the file'}</th>
            <th className={th}>First values</th>
            <th className={th}>Is</th>
            <th className={th}>Unit</th>
            <th className={th}>Guess</th>
          </>
        }
      >
        {namesOf(upload).map((header, index) => {
          // every header has an assignment from the start; one missing is simply not imported
          const a = assignments[header] ?? UNASSIGNED;
          const guess = guessByHeader.get(header);
          const samples = tallShape ? (upload.tags[index]?.samples ?? []).slice(0, 3) : upload.sampleRows.slice(0, 3).map((r) => r[index] ?? '');
          return (
            <tr key={header} className={tr} data-testid="mapping-row">
              <td className={`${td} font-medium`}>{header}</td>
              <td className={`${td} font-mono text-xs text-ink-soft`}>
                {samples.map((s, k) => (
                  <span key={k} className="block max-w-56 truncate" title={s}>
                    {s || '(blank)'}
                  </span>
                ))}
              </td>
              <td className={td}>
                <select aria-label={`What column ${header} is`} className={selectClass} value={a.role} onChange={(e) => assign(header, e.target.value as Role)}>
                  <option value="">Not imported</option>
                  {!tallShape && <option value="timestamp">Timestamp</option>}
                  {!tallShape && <option value="quality">Quality flag of the row</option>}
                  {IMPORT_QUANTITIES.map((q) => (
                    <option key={q} value={q}>
                      {QUANTITY_LABELS[q]}
                    </option>
                  ))}
                </select>
              </td>
              <td className={td}>
                {a.role === 'quality' ? (
                  <label className="flex flex-col gap-1 text-xs">
                    Values that mean good (comma between)
                    <input
                      aria-label={`Good values of column ${header}`}
                      value={goodText}
                      onChange={(e) => setGoodText(e.target.value)}
                      className={selectClass}
                    />
                  </label>
                ) : a.role && a.role !== 'timestamp' ? (
                  <select
                    aria-label={`Unit of column ${header}`}
                    className={selectClass}
                    value={a.unit}
                    onChange={(e) => setAssignments({ ...assignments, [header]: { ...a, unit: e.target.value } })}
                  >
                    {(IMPORT_QUANTITY_UNITS[a.role] as readonly string[]).map((u) => (
                      <option key={u} value={u}>
                        {unitLabel(u)}
                      </option>
                    ))}
                  </select>
                ) : (
                  <span className="text-xs text-ink-faint">{a.role === 'timestamp' ? 'format below' : '—'}</span>
                )}
              </td>
              <td className={`${td} text-xs whitespace-nowrap`}>
                {upload.mappingSource === 'saved' ? (
                  <span className="text-ink-soft">saved mapping</span>
                ) : guess?.quantity ? (
                  <span className={guess.confidence >= 0.8 ? 'text-ok' : guess.confidence >= 0.5 ? 'text-warn' : 'text-ink-faint'} title={guess.note}>
                    {Math.round(guess.confidence * 100)} % sure
                  </span>
                ) : (
                  <span className="text-ink-faint">no guess</span>
                )}
              </td>
            </tr>
          );
        })}
      </DataTable>

      {tallShape && (
        <fieldset className="flex flex-col gap-3" data-testid="time-grid">
          <legend className="mb-1 text-sm font-semibold">One time grid for every tag</legend>
          <p className="text-sm text-ink-soft">
            {upload.shape === 'per-tag-files' ? (
              <>
                Each file’s tag is read from the file (its value column’s name, a tag line above the header, or the file’s name)
                {proposed.quality ? `; quality where a file has it (good: ${goodText})` : ''}. The files’ times must overlap.
              </>
            ) : (
              <>
                Tags are read from “{tallShape.tagColumn}”, values from “{tallShape.valueColumn}”, times from “{proposed.timestamp?.column}”
                {proposed.quality ? `, quality from “${proposed.quality.column}” (good: ${goodText})` : ''}.
              </>
            )}{' '}
            A grid time without a value of every required tag is left out and counted under that tag.
          </p>
          <div className="grid gap-3 md:grid-cols-3">
            <SelectField label="Grid" value={String(gridMinutes)} onChange={(e) => setGridMinutes(Number(e.target.value) as typeof gridMinutes)}>
              {GRID_MINUTES.map((m) => (
                <option key={m} value={m}>
                  Every {m} min
                </option>
              ))}
            </SelectField>
            <SelectField label="Value at a grid time" value={rule} onChange={(e) => setRule(e.target.value as AlignmentRule)}>
              {ALIGNMENT_RULES.map((r) => (
                <option key={r} value={r}>
                  {RULE_LABELS[r]}
                </option>
              ))}
            </SelectField>
            {rule !== 'interval-mean' && (
              <label className="flex flex-col gap-1 text-sm">
                Samples at most this far from the grid time (min)
                <input
                  inputMode="decimal"
                  value={toleranceText}
                  onChange={(e) => setToleranceText(e.target.value)}
                  className="w-28 rounded border border-rule bg-paper-raised px-2 py-1 text-right text-sm"
                />
              </label>
            )}
            {proposed.quality && (
              <label className="flex flex-col gap-1 text-sm">
                Quality values that mean good (comma between)
                <input value={goodText} onChange={(e) => setGoodText(e.target.value)} className={selectClass} />
              </label>
            )}
          </div>
        </fieldset>
      )}

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold">Timestamps</legend>
        <div className="grid gap-3 md:grid-cols-2">
          <SelectField label="Timestamp format" value={format} onChange={(e) => setFormat(e.target.value as typeof format)}>
            {TIMESTAMP_FORMATS.map((f) => (
              <option key={f} value={f}>
                {TIMESTAMP_FORMAT_LABELS[f]}
              </option>
            ))}
          </SelectField>
          {format !== 'iso-8601-offset' && (
            <TimeZonePicker label="Clock of the file" value={timeZone} onChange={setTimeZone} hint={`The plant’s is ${plantTimeZone.replace(/_/g, ' ')}`} />
          )}
          {format === 'local-text' && (
            <SelectField label="Date order" value={dateOrder} onChange={(e) => setDateOrder(e.target.value as typeof dateOrder)}>
              {DATE_ORDERS.map((o) => (
                <option key={o} value={o}>
                  {DATE_ORDER_LABELS[o]}
                </option>
              ))}
            </SelectField>
          )}
          {format !== 'iso-8601-offset' && (
            <SelectField
              label="Repeated hour when clocks go back"
              value={repeatedHour}
              onChange={(e) => setRepeatedHour(e.target.value as typeof repeatedHour)}
            >
              {REPEATED_HOUR_RULES.map((r) => (
                <option key={r} value={r}>
                  {REPEATED_HOUR_LABELS[r]}
                </option>
              ))}
            </SelectField>
          )}
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold">Readings and assumptions</legend>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={vacuum} onChange={(e) => toggleVacuum(e.target.checked)} />
          The file gives condenser vacuum below the barometer, not absolute backpressure
        </label>
        {vacuum && !mapping.columns.barometer && (
          <div className="ml-6 flex flex-wrap items-end gap-2">
            <label className="flex flex-col gap-1 text-sm">
              Fixed barometer (no barometer column)
              <input
                inputMode="decimal"
                value={barometerText}
                onChange={(e) => setBarometerText(e.target.value)}
                className="w-28 rounded border border-rule bg-paper-raised px-2 py-1 text-right text-sm"
              />
            </label>
            <select
              aria-label="Unit of the fixed barometer"
              className="rounded border border-rule bg-paper-raised px-2 py-1 text-sm"
              value={barometerUnit}
              onChange={(e) => setBarometerUnit(e.target.value)}
            >
              {IMPORT_QUANTITY_UNITS.barometer.map((u) => (
                <option key={u} value={u}>
                  {unitLabel(u)}
                </option>
              ))}
            </select>
            <span className="text-xs text-ink-soft">Recorded as an assumption of this import.</span>
          </div>
        )}
        <label className="flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={flowNotMetered}
            disabled={designCwFlowM3s === null && !flowNotMetered}
            onChange={(e) => setFlowNotMetered(e.target.checked)}
          />
          CW flow is not metered: use the design flow
          <span className="text-xs text-ink-soft">
            {designCwFlowM3s === null ? '(set up the condenser first)' : `(${formatStored(designCwFlowM3s, units.flowM3s)}, recorded as an assumption)`}
          </span>
        </label>
        <label className="flex flex-wrap items-center gap-2 text-sm">
          The values are averages over
          <input
            aria-label="Averaging interval in minutes"
            inputMode="numeric"
            value={averagingText}
            onChange={(e) => setAveragingText(e.target.value)}
            placeholder="—"
            className="w-20 rounded border border-rule bg-paper-raised px-2 py-1 text-right text-sm"
          />
          min
          <span className="text-xs text-ink-soft">
            (leave empty for values read at their time; recorded with the import, and steadiness compares neighbouring intervals)
          </span>
        </label>
        <div className="max-w-xs">
          <SelectField label="Decimal separator in numbers" value={decimalSeparator} onChange={(e) => setDecimalSeparator(e.target.value as '.' | ',')}>
            <option value=".">Point (1234.5)</option>
            <option value=",">Comma (1234,5)</option>
          </SelectField>
        </div>
      </fieldset>

      <StatusWordsPanel organisationId={organisationId} />

      {(localProblems.length > 0 || serverProblems.length > 0) && (
        <div role="alert" className="rounded border border-warn/40 bg-ledger-50 px-3 py-2 text-sm text-warn" data-testid="mapping-problems">
          <p className="font-medium">Before the import can start:</p>
          <ul className="ml-5 list-disc">
            {[...localProblems, ...serverProblems].map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </div>
      )}
      {start.isError && serverProblems.length === 0 && <Notice tone="fault">{start.error.message}</Notice>}
      <div className="flex gap-2">
        <Button onClick={submit} disabled={localProblems.length > 0 || start.isPending}>
          {start.isPending ? 'Starting…' : 'Check and import'}
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Choose another file
        </Button>
      </div>
    </section>
  );
}

/** Files of one tag each: which tag each holds, its rows and the period it covers, as written in the file. */
function TagFilesTable({ files }: { files: UploadResponse['files'] }) {
  return (
    <DataTable
      caption="Files uploaded, one tag each"
      head={
        <>
          <th className={th}>File</th>
          <th className={th}>Tag</th>
          <th className={`${th} text-right`}>Rows</th>
          <th className={th}>First time, as written</th>
          <th className={th}>Last time, as written</th>
        </>
      }
    >
      {files.map((f) => (
        <tr key={f.name + f.tag} className={tr} data-testid="tag-file-row">
          <td className={`${td} break-all`}>{f.name}</td>
          <td className={`${td} font-medium break-all`}>{f.tag}</td>
          <td className={`${td} text-right tabular-nums`}>{f.rows.toLocaleString('en-US')}</td>
          <td className={`${td} font-mono text-xs whitespace-nowrap`}>{f.firstTime}</td>
          <td className={`${td} font-mono text-xs whitespace-nowrap`}>{f.lastTime}</td>
        </tr>
      ))}
    </DataTable>
  );
}
