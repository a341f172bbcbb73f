export {
  type CorrectionCurve,
  type PenaltyBetween,
  compileCorrectionCurve,
  curveChangePct,
  curveExtrapolationWarning,
  heatRateChangePct,
  penaltyBetween,
  outputChangeFromHeatRatePct,
  heatRateChangeFromOutputPct,
} from './correction-curve.js';
export { GENERIC_CORRECTION_CURVE } from './generic-curve.js';
export { CO2_KG_PER_MMBTU, CO2_FACTORS_NOTE, type Fuel } from './emission-factors.js';
export { penaltyCostPerHour, extraFuelMmbtuPerHour, lostGenerationValuePerMwh, type PenaltyCostInput, type PenaltyCostPerHour } from './penalty-cost.js';
export { buildMonotoneCubic, evaluateMonotoneCubic, type MonotoneCubic } from './monotone-cubic.js';
