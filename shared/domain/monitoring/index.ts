export { buildUnitModel, type UnitModel, type UnitSetupSi } from './unit-model.js';
export { analyseSample, plausibleCondenserPoint, designPointKpa, blendedCostPerHour, type SampleAnalysis, type SampleSi } from './sample-analysis.js';
export {
  judgeAirLeakDays,
  airLeakPeriods,
  DEFAULT_AIR_LEAK_SETTINGS,
  type AirLeakDay,
  type AirLeakPeriod,
  type AirLeakDayVerdict,
  type AirLeakSettings,
} from './air-leak.js';
export { lttb, lttbKeepingGaps } from './lttb.js';
