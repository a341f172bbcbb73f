/**
 * Deviation breakdown of ENGINEERING.md §3: why today's backpressure differs from the datasheet design.
 * Model P(t1, W, Q, Np, CF). States, in this fixed order (interaction effects land on later factors):
 *   S0 = (design t1, design W, heat-balance duty at today's load, design Np, design CF)
 *   S1 = S0 with today's t1;  S2 = + today's CW mass flow;  S3 = + the measured CW-side duty;
 *   S4 = + today's plugged tubes;  S5 = + the fouling-trend CF for the day (else the measured CF).
 * Lines: model offset = P(design at full load) − datasheet design; load = P(S0) − P(design at full load);
 * Δk = P(Sk) − P(Sk−1); unexplained = measured − P(S5) ("air in-leakage, instruments").
 * The lines add up to measured − datasheet design (a telescoping sum). Cost by cause runs every state
 * through the turbine curve and telescopes in heat-rate % (never kPa × slope).
 */
import { liquidDensityKgM3 } from '../steam/index.js';
import { heatRateChangePct, type CorrectionCurve } from '../turbine/index.js';
import { DEFAULT_HEI_TABLES, type HeiTables } from './hei-tables.js';
import type { CondenserGeometry } from './geometry.js';
import { backpressureAtCleanlinessKpa } from './expected-backpressure.js';

export interface CondenserOperatingState {
  cwInletC: number;
  /** CW mass flow, kg/s (the model's W) */
  cwMassFlowKgS: number;
  dutyMw: number;
  pluggedTubes: number;
  cleanliness: number;
}

export interface DeviationBreakdownInput {
  geometry: CondenserGeometry;
  heiTables?: HeiTables;
  /** User U_clean relative to HEI (CondenserPointResult.uCleanScale); default 1. */
  uCleanScale?: number;
  /** Datasheet design point: full-load duty, design CW, design plugging and cleanliness, design backpressure. */
  design: CondenserOperatingState & { backpressureKpa: number };
  /** Heat-balance duty at today's load, MW. */
  heatBalanceDutyMw: number;
  /** Today's measured state: CW-side duty and the measured CF. */
  measured: CondenserOperatingState & { backpressureKpa: number };
  /** Fitted fouling-trend CF for the day; when absent the measured CF is used. */
  trendCleanliness?: number;
  /** To cost the causes: today's load fraction on the unit's correction curve. */
  turbine?: { curve: CorrectionCurve; loadFraction: number };
}

export type DeviationCause = 'model-offset' | 'load' | 'cw-inlet-temperature' | 'cw-flow' | 'duty' | 'plugged-tubes' | 'fouling' | 'unexplained';

export interface DeviationLine {
  cause: DeviationCause;
  label: string;
  deltaKpa: number;
  /** Heat-rate change attributed to this cause, % (present when a turbine curve is given). */
  heatRatePct?: number;
}

export interface DeviationBreakdown {
  datasheetDesignKpa: number;
  designFullLoadModelKpa: number;
  states: (CondenserOperatingState & { name: 'S0' | 'S1' | 'S2' | 'S3' | 'S4' | 'S5'; backpressureKpa: number })[];
  measuredKpa: number;
  lines: DeviationLine[];
  /** measured − datasheet design, kPa: the lines add up to it. */
  totalKpa: number;
  cleanlinessSource: 'fouling-trend' | 'measured';
  order: string;
}

const LABELS: Record<DeviationCause, string> = {
  'model-offset': 'Model against datasheet at design conditions',
  load: "Today's load (heat-balance duty) against full load",
  'cw-inlet-temperature': 'CW inlet temperature',
  'cw-flow': 'CW flow',
  duty: 'Measured CW-side duty against heat balance',
  'plugged-tubes': 'Plugged tubes',
  fouling: 'Fouling (cleanliness)',
  unexplained: 'Unexplained (air in-leakage, instruments)',
};

export const DEVIATION_ORDER = 'S0 → t1 → CW flow → duty → plugged tubes → cleanliness (fixed; interactions land on later factors)';

export function deviationBreakdown(input: DeviationBreakdownInput): DeviationBreakdown {
  const { geometry, design, measured } = input;
  const heiTables = input.heiTables ?? DEFAULT_HEI_TABLES;
  const uCleanScale = input.uCleanScale ?? 1;
  const model = (s: CondenserOperatingState): number =>
    backpressureAtCleanlinessKpa({
      geometry,
      heiTables,
      uCleanScale,
      cwInletC: s.cwInletC,
      cwFlowM3s: s.cwMassFlowKgS / liquidDensityKgM3(s.cwInletC),
      dutyMw: s.dutyMw,
      pluggedTubes: s.pluggedTubes,
      cleanliness: s.cleanliness,
    });
  const trendCf = input.trendCleanliness;
  const fouledCf = trendCf ?? measured.cleanliness;

  const designFull = model(design);
  const s0: CondenserOperatingState = { ...pick(design), dutyMw: input.heatBalanceDutyMw };
  const s1 = { ...s0, cwInletC: measured.cwInletC };
  const s2 = { ...s1, cwMassFlowKgS: measured.cwMassFlowKgS };
  const s3 = { ...s2, dutyMw: measured.dutyMw };
  const s4 = { ...s3, pluggedTubes: measured.pluggedTubes };
  const s5 = { ...s4, cleanliness: fouledCf };
  const chain = [s0, s1, s2, s3, s4, s5];
  const states = chain.map((s, k) => ({ name: `S${k}` as DeviationBreakdown['states'][number]['name'], ...s, backpressureKpa: model(s) }));
  const p = states.map((s) => s.backpressureKpa);

  // Pressures at the ends of each line, in order: datasheet → design model → S0 … S5 → measured.
  const points = [design.backpressureKpa, designFull, ...p, measured.backpressureKpa];
  const causes: DeviationCause[] = ['model-offset', 'load', 'cw-inlet-temperature', 'cw-flow', 'duty', 'plugged-tubes', 'fouling', 'unexplained'];
  const hr = input.turbine ? points.map((x) => heatRateChangePct(input.turbine!.curve, input.turbine!.loadFraction, x)) : undefined;
  const lines: DeviationLine[] = causes.map((cause, k) => ({
    cause,
    label: LABELS[cause],
    deltaKpa: points[k + 1]! - points[k]!,
    ...(hr ? { heatRatePct: hr[k + 1]! - hr[k]! } : {}),
  }));
  return {
    datasheetDesignKpa: design.backpressureKpa,
    designFullLoadModelKpa: designFull,
    states,
    measuredKpa: measured.backpressureKpa,
    lines,
    totalKpa: measured.backpressureKpa - design.backpressureKpa,
    cleanlinessSource: trendCf === undefined ? 'measured' : 'fouling-trend',
    order: DEVIATION_ORDER,
  };
}

function pick(s: CondenserOperatingState): CondenserOperatingState {
  return { cwInletC: s.cwInletC, cwMassFlowKgS: s.cwMassFlowKgS, dutyMw: s.dutyMw, pluggedTubes: s.pluggedTubes, cleanliness: s.cleanliness };
}
