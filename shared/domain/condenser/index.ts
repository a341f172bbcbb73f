export { TUBE_MATERIALS, DEFAULT_HEI_TABLES, assertHeiTables, type TubeMaterial, type HeiTables } from './hei-tables.js';
export { type CondenserGeometry, assertGeometry, tubeInsideDiameterM, activeSurfaceM2, tubeVelocityMs } from './geometry.js';
export {
  cleanCoefficientWm2K,
  rescaleCleanCoefficientWm2K,
  tubeConstantC,
  inletTemperatureFactor,
  materialFactor,
  type CleanCoefficient,
} from './clean-coefficient.js';
export { backpressureAtCleanlinessKpa, cwRiseK, type BackpressureModelInput } from './expected-backpressure.js';
export {
  analyseCondenserPoint,
  correctedBackpressureKpa,
  expectedWithinBounds,
  type CondenserPointInput,
  type CondenserPointResult,
} from './condenser-point.js';
export { PLAUSIBLE_CLEANLINESS, PLAUSIBLE_TUBE_VELOCITY_MS, implausibleResults, type ImplausibleResult } from './plausibility.js';
export { reconcileDuty, type DutyReconciliation } from './duty-reconciliation.js';
export {
  deviationBreakdown,
  DEVIATION_ORDER,
  type DeviationBreakdown,
  type DeviationBreakdownInput,
  type DeviationCause,
  type DeviationLine,
  type CondenserOperatingState,
} from './deviation-breakdown.js';
