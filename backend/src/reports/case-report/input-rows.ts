/**
 * Every input of a case as a row: its group, name, value, unit and where it came from (measured, prefilled or
 * entered, with the sentence that says how). The PDF shows `text`; the spreadsheet writes `value` (a number as a
 * number, a day as a date) and, for an input made of several numbers (12 monthly values, an outage's two days),
 * one row per `parts` entry.
 */
import type { CalcScheduleInput } from '@shared/schemas/calc-schedule.js';
import type { CaseView, InputSource } from '@shared/schemas/cases.js';
import { formatDay, formatPlain, formatPercent } from '@shared/text/display-format.js';
import { caseMethods, methodName } from './case-methods.js';
import { baselineText } from './recommendation.js';
import { UNCERTAIN_INPUT_LABELS } from './report-labels.js';

export type CellValue = number | string | { day: string };

export interface InputRow {
  group: string;
  name: string;
  value: CellValue;
  text: string;
  unit: string;
  /** spreadsheet number format for a numeric value */
  numFmt?: string;
  parts?: { name: string; value: CellValue; numFmt?: string }[];
  /** the `inputSources` key the source was found under (rows of one input share it) */
  sourceKey: string | null;
  source: InputSource | null;
  detail: string;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const MONEY_FMT = '#,##0.00';
const PLAIN_FMT = 'General';

type Driver = number | { monthly: number[] } | { daily: number[] };

/** The most specific `inputSources` entry for a dotted key ("unit.condenser.surfaceM2" → "unit.condenser" → "unit"). */
function sourceFor(view: CaseView, key: string): Pick<InputRow, 'sourceKey' | 'source' | 'detail'> {
  const parts = key.split('.');
  for (let n = parts.length; n > 0; n--) {
    const k = parts.slice(0, n).join('.');
    const entry = view.inputSources[k];
    if (entry) return { sourceKey: k, source: entry.source, detail: entry.detail };
  }
  return { sourceKey: null, source: null, detail: '' };
}

class RowList {
  readonly rows: InputRow[] = [];
  constructor(private readonly view: CaseView) {}

  add(group: string, key: string, name: string, value: CellValue, unit: string, extra: Partial<InputRow> = {}): void {
    const text = extra.text ?? (typeof value === 'number' ? formatPlain(value) : typeof value === 'string' ? value : formatDay(value.day));
    const numFmt = typeof value === 'number' ? (extra.numFmt ?? PLAIN_FMT) : undefined;
    this.rows.push({ group, name, value, unit, ...sourceFor(this.view, key), ...extra, text, ...(numFmt ? { numFmt } : {}) });
  }

  driver(key: string, name: string, d: Driver, unit: string, numFmt = PLAIN_FMT): void {
    const group = 'Drivers';
    if (typeof d === 'number') return this.add(group, key, name, d, unit, { numFmt });
    if ('monthly' in d) {
      const text = d.monthly.map((v, i) => `${MONTHS[i]} ${formatPlain(v)}`).join(' · ');
      return this.add(group, key, `${name} (monthly)`, text, unit, {
        text,
        parts: d.monthly.map((v, i) => ({ name: `${name}, ${MONTHS[i]}`, value: v, numFmt })),
      });
    }
    const values = d.daily;
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const text = `${values.length} daily values from ${formatPlain(Math.min(...values))} to ${formatPlain(Math.max(...values))}, mean ${formatPlain(mean, 3)}`;
    this.add(group, key, `${name} (daily)`, text, unit, { text });
  }

  range(group: string, key: string, name: string, r: { from: string; to: string }): void {
    this.add(group, key, name, `${r.from} – ${r.to}`, 'days', {
      text: `${formatDay(r.from)} – ${formatDay(r.to)}`,
      parts: [
        { name: `${name}, first day`, value: { day: r.from } },
        { name: `${name}, last day`, value: { day: r.to } },
      ],
    });
  }
}

function horizonAndDrivers(list: RowList, v: CalcScheduleInput, currency: string): void {
  list.add('Horizon', 'startDate', 'First day of the horizon', { day: v.startDate }, 'day');
  list.add('Horizon', 'horizonDays', 'Horizon', v.horizonDays, 'days');
  const d = v.drivers;
  list.driver('drivers.cwInletC', 'Cooling-water inlet temperature', d.cwInletC, '°C');
  list.driver('drivers.loadFraction', 'Load', d.loadFraction, 'fraction of rating');
  list.driver('drivers.fuelPricePerMmbtu', 'Fuel price', d.fuelPricePerMmbtu, `${currency}/MMBtu`, MONEY_FMT);
  list.driver('drivers.replacementPricePerMwh', 'Replacement power price', d.replacementPricePerMwh, `${currency}/MWh`, MONEY_FMT);
  list.driver('drivers.co2PricePerTonne', 'CO₂ price', d.co2PricePerTonne, `${currency}/t`, MONEY_FMT);
  const interpolation = d.interpolation === 'step' ? 'each month’s value all month' : 'straight lines between mid-months';
  list.add('Drivers', 'drivers.interpolation', 'Monthly values applied as', interpolation, '');
}

function unitRows(list: RowList, v: CalcScheduleInput): void {
  const g = 'Unit and condenser';
  const u = v.unit;
  list.add(g, 'unit.ratingMw', 'Rating', u.ratingMw, 'MW');
  list.add(g, 'unit.heatRateBtuKwh', 'Heat rate', u.heatRateBtuKwh, 'Btu/kWh');
  list.add(g, 'unit.co2KgPerMmbtu', 'CO₂ emission factor', u.co2KgPerMmbtu, 'kg/MMBtu');
  list.add(g, 'unit.capacityLimitedShare', 'Share of hours the unit is capacity-limited', u.capacityLimitedShare, 'fraction');
  if (u.activeTubes !== undefined) list.add(g, 'unit.activeTubes', 'Tubes in service', u.activeTubes, 'tubes');
  const c = u.condenser;
  if (c) {
    list.add(g, 'unit.condenser.surfaceM2', 'Condenser surface', c.surfaceM2, 'm²');
    list.add(g, 'unit.condenser.tubeCount', 'Tubes', c.tubeCount, 'tubes');
    list.add(g, 'unit.condenser.pluggedTubes', 'Plugged tubes', c.pluggedTubes, 'tubes');
    list.add(g, 'unit.condenser.passes', 'Passes', c.passes, '');
    list.add(g, 'unit.condenser.tubeOdMm', 'Tube outside diameter', c.tubeOdMm, 'mm');
    list.add(g, 'unit.condenser.tubeBwg', 'Tube gauge', c.tubeBwg, 'BWG');
    list.add(g, 'unit.condenser.tubeMaterial', 'Tube material', c.tubeMaterial, '');
    list.add(g, 'unit.condenser.cwFlowM3s', 'Cooling-water flow', c.cwFlowM3s, 'm³/s');
    list.add(g, 'unit.condenser.designDutyMw', 'Design duty', c.designDutyMw, 'MW');
  }
  if (u.curve) {
    const points = u.curve.curves.reduce((n, k) => n + k.points.length, 0);
    const text = `${u.curve.label}${u.curve.isGeneric ? ' (generic)' : ''}: ${u.curve.curves.length} load curves, ${points} points, on ${u.curve.basis}`;
    list.add(g, 'unit.curve', 'Exhaust-pressure correction curve', text, '');
  } else if (c) {
    list.add(g, 'unit.curve', 'Exhaust-pressure correction curve', 'the generic curve of the engine', '');
  }
  if (v.directPenalty) {
    const text = v.directPenalty.points.map((p) => `${formatPlain(p.cleanliness)}: ${formatPlain(p.costPerDay, 2)}`).join(' · ');
    list.add(g, 'directPenalty', 'Cost of fouling per day by cleanliness', text, 'cleanliness: money/day');
    if (v.directPenalty.monthlyFactors) {
      const mf = v.directPenalty.monthlyFactors;
      list.add(g, 'directPenalty', 'Monthly factors on that cost', mf.map((f, i) => `${MONTHS[i]} ${formatPlain(f)}`).join(' · '), '×', {
        parts: mf.map((f, i) => ({ name: `Monthly factor, ${MONTHS[i]}`, value: f })),
      });
    }
  }
}

function foulingRows(list: RowList, v: CalcScheduleInput): void {
  const g = 'Fouling';
  const f = v.fouling;
  // fouling index y = 1/CF − 1/CF0 (shared/domain/decision/fouling/fouling-models.ts)
  if (f.model === 'linear') {
    list.add(g, 'fouling', 'Fouling model', 'linear growth of the fouling index (1/CF − 1/CF₀)', '');
    list.add(g, 'fouling', 'Fouling index growth', f.ratePerDay, 'per day');
  } else if (f.model === 'asymptotic') {
    list.add(g, 'fouling', 'Fouling model', 'fouling index rising to a limit', '');
    list.add(g, 'fouling', 'Limit of the fouling index', f.maxIndex, '');
    list.add(g, 'fouling', 'Time constant', f.timeConstantDays, 'days');
  } else {
    list.add(g, 'fouling', 'Fouling model', 'fouling index growing ever more slowly (coefficient × days^exponent)', '');
    list.add(g, 'fouling', 'Coefficient', f.coefficient, '');
    list.add(g, 'fouling', 'Exponent', f.exponent, '');
  }
  list.add(g, 'initial.daysSinceCleaning', 'Days since the last cleaning at the start', v.initial.daysSinceCleaning, 'days');
  list.add(g, 'initial.cleanlinessAfterCleaning', 'Cleanliness after the last cleaning', v.initial.cleanlinessAfterCleaning, 'cleanliness factor');
  list.add(g, 'initial.foulingRateMultiplier', 'Fouling rate in the current cycle', v.initial.foulingRateMultiplier, '× model rate');
}

const UNIT_DURING = { outage: 'off line', derate: 'derated', online: 'on line' } as const;

function methodRows(list: RowList, view: CaseView, currency: string): void {
  const g = 'Cleaning methods';
  for (const m of caseMethods(view)) {
    const key = `methods.${m.id}`;
    const during = m.unitDuringCleaning === 'derate' ? `derated by ${formatPlain(m.deratePct)} %` : UNIT_DURING[m.unitDuringCleaning];
    list.add(g, key, `${m.name}: fixed cost`, m.fixedCost, currency, { numFmt: MONEY_FMT });
    list.add(g, key, `${m.name}: cost per tube`, m.costPerTube, `${currency}/tube`, { numFmt: MONEY_FMT });
    list.add(g, key, `${m.name}: duration`, m.durationDays, 'days');
    list.add(g, key, `${m.name}: unit during the cleaning`, during, '');
    list.add(g, key, `${m.name}: cleanliness after`, m.recoveredCleanliness, 'cleanliness factor');
    list.add(g, key, `${m.name}: fouling rate after`, m.foulingRateMultiplier, '× model rate');
    if (m.typical) list.add(g, key, `${m.name}: values`, 'typical values, not plant data', '');
  }
}

function outageRows(list: RowList, view: CaseView): void {
  const g = 'Outages and windows';
  const v = view.inputs;
  (v.plannedOutages ?? []).forEach((r, i) => list.range(g, 'plannedOutages', `Planned outage ${i + 1}`, r));
  if (!v.plannedOutages?.length) list.add(g, 'plannedOutages', 'Planned outages', 'none', '');
  (v.windows ?? []).forEach((r, i) => list.range(g, 'windows', `Window for cleaning ${i + 1}`, r));
  for (const [id, ranges] of Object.entries(v.methodWindows ?? {})) {
    ranges.forEach((r, i) => list.range(g, 'methodWindows', `Window for ${methodName(view, id)} ${i + 1}`, r));
  }
  list.add(g, 'minSpacingDays', 'Least days between cleanings', v.minSpacingDays, 'days');
}

function economicsRows(list: RowList, view: CaseView, currency: string): void {
  const g = 'Economics';
  const v = view.inputs;
  list.add(g, 'discountRate', 'Discount rate', v.discountRate, 'per year', { numFmt: '0.0%', text: formatPercent(v.discountRate) });
  list.add(g, 'referenceCleanliness', 'Reference cleanliness', view.results.referenceCleanliness, 'cleanliness factor', {
    text: v.referenceCleanliness === undefined ? `${formatPlain(view.results.referenceCleanliness)} (best of the methods)` : undefined,
  });
  list.add(g, 'baseline', 'Baseline compared against', baselineText(view), '');
  if (v.baseline.kind === 'fixed') {
    v.baseline.cleanings.forEach((b, i) => list.add(g, 'baseline', `Baseline cleaning ${i + 1} (${methodName(view, b.methodId)})`, { day: b.date }, 'day'));
  }
  list.add(g, 'upfrontCost', 'Upfront cost', v.upfrontCost, currency, { numFmt: MONEY_FMT });
}

function uncertaintyRows(list: RowList, v: CalcScheduleInput): void {
  const g = 'Uncertainty';
  const u = v.uncertainty;
  if (!u) return list.add(g, 'uncertainty', 'Uncertainty analysis', 'not run for this case', '');
  list.add(g, 'uncertainty', 'Monte Carlo trials', u.trials, 'trials');
  list.add(g, 'uncertainty', 'Random seed', u.seed, '');
  for (const [input, r] of Object.entries(u.ranges ?? {})) {
    if (!r) continue;
    const label = UNCERTAIN_INPUT_LABELS[input as keyof typeof UNCERTAIN_INPUT_LABELS];
    list.add(
      g,
      `uncertainty.${input}`,
      `${label.name}: low / base / high`,
      `${formatPlain(r.low)} / ${formatPlain(r.base)} / ${formatPlain(r.high)}`,
      label.unit,
      {
        parts: [
          { name: `${label.name}: low`, value: r.low },
          { name: `${label.name}: base`, value: r.base },
          { name: `${label.name}: high`, value: r.high },
        ],
      },
    );
  }
  if (!u.ranges || Object.keys(u.ranges).length === 0) list.add(g, 'uncertainty', 'Ranges', 'the engine’s typical ranges', '');
}

export function inputRows(view: CaseView): InputRow[] {
  const list = new RowList(view);
  const v = view.inputs;
  horizonAndDrivers(list, v, view.currency);
  unitRows(list, v);
  foulingRows(list, v);
  methodRows(list, view, view.currency);
  outageRows(list, view);
  economicsRows(list, view, view.currency);
  uncertaintyRows(list, v);
  return list.rows;
}
