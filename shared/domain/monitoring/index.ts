export { buildUnitModel, type UnitModel, type UnitSetupSi } from './unit-model.js';
export { analyseSample, blendedCostPerHour, type SampleAnalysis, type SampleSi } from './sample-analysis.js';
