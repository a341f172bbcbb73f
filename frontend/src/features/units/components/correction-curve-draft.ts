import { GENERIC_CORRECTION_CURVE } from '@shared/domain/turbine/generic-curve';
import type { TurbineSetup } from '@shared/schemas/unit-setup';
import type { DisplayUnit } from '@shared/units';
import { parseNumberText } from '@frontend/lib/field-units';
import { writeForInput } from '@frontend/lib/number-format';

type Curve = NonNullable<TurbineSetup['correctionCurve']>;

/** One editable point: load as % of rating, backpressure in the user's unit, change in %. */
export interface CurvePointText {
  loadPct: string;
  backpressure: string;
  changePct: string;
}

export interface CurveDraft {
  mode: 'generic' | 'maker';
  basis: Curve['basis'];
  label: string;
  rows: CurvePointText[];
}

export const GENERIC_LABEL = GENERIC_CORRECTION_CURVE.label;

const trim = (v: number, decimals: number) => writeForInput(Number(v.toFixed(decimals)));

export function draftFromCurve(curve: Curve | null, pressure: DisplayUnit): CurveDraft {
  if (!curve || curve.isGeneric) return { mode: 'generic', basis: 'heat-rate', label: '', rows: [] };
  return {
    mode: 'maker',
    basis: curve.basis,
    label: curve.label,
    rows: curve.curves.flatMap((c) =>
      c.points.map((p) => ({
        loadPct: trim(c.loadFraction * 100, 2),
        backpressure: trim(pressure.fromSi(p.backpressureKpa), pressure.decimals + 2),
        changePct: trim(p.changePct, 3),
      })),
    ),
  };
}

/** The draft as the schema's curve (null: the generic curve); values not numbers stay NaN for the schema to name. */
export function curveFromDraft(draft: CurveDraft, pressure: DisplayUnit): Curve | null {
  if (draft.mode === 'generic') return null;
  const byLoad = new Map<number, { backpressureKpa: number; changePct: number }[]>();
  for (const r of draft.rows) {
    if (!r.loadPct.trim() && !r.backpressure.trim() && !r.changePct.trim()) continue;
    const load = (parseNumberText(r.loadPct) ?? Number.NaN) / 100;
    const bp = parseNumberText(r.backpressure);
    const point = { backpressureKpa: bp === undefined ? Number.NaN : pressure.toSi(bp), changePct: parseNumberText(r.changePct) ?? Number.NaN };
    byLoad.set(load, [...(byLoad.get(load) ?? []), point]);
  }
  return {
    basis: draft.basis,
    label: draft.label.trim() || 'Turbine maker’s curve',
    isGeneric: false,
    curves: [...byLoad.entries()]
      .sort(([a], [b]) => a - b)
      .map(([loadFraction, points]) => ({ loadFraction, points: points.sort((a, b) => a.backpressureKpa - b.backpressureKpa) })),
  };
}

/**
 * Rows pasted from a spreadsheet or read from a CSV file: load fraction, backpressure (in the user's
 * pressure unit), change %; comma, semicolon or tab between them; a header row is skipped.
 */
export function pointsFromCsv(text: string): { rows: CurvePointText[]; skipped: number } {
  const rows: CurvePointText[] = [];
  let skipped = 0;
  for (const line of text.split(/\r?\n/)) {
    if (!line.trim()) continue;
    // a tab or semicolon between cells leaves the comma to decimals (1,5;6,8;0,4)
    const cells = line.split(/[\t;]/.test(line) ? /[\t;]/ : /,/).map((c) => c.trim().replace(/^"|"$/g, ''));
    const [load, bp, change] = cells.map((c) => parseNumberText(c));
    if (load === undefined || bp === undefined || change === undefined || [load, bp, change].some(Number.isNaN)) {
      skipped++;
      continue;
    }
    rows.push({ loadPct: trim(load * 100, 2), backpressure: writeForInput(bp), changePct: writeForInput(change) });
  }
  return { rows, skipped };
}

/** Lines for the chart, x in the user's pressure unit. */
export function chartSeries(curve: Curve, pressure: DisplayUnit) {
  return [...curve.curves]
    .sort((a, b) => b.loadFraction - a.loadFraction)
    .filter((c) => Number.isFinite(c.loadFraction))
    .map((c) => ({
      id: `${trim(c.loadFraction * 100, 1)} % load`,
      data: c.points
        .filter((p) => Number.isFinite(p.backpressureKpa) && Number.isFinite(p.changePct))
        .map((p) => ({ x: pressure.fromSi(p.backpressureKpa), y: p.changePct })),
    }))
    .filter((s) => s.data.length > 0);
}
