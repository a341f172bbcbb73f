export { DEMO_PLANTS, DEMO_UNITS, DEMO_SCENARIO_SEED, DEMO_START_LOCAL, DEMO_END_LOCAL, demoUnit, demoPlant } from './demo-scenario.js';
export type { DemoPlant, DemoUnitSpec, DemoFileStyle } from './demo-scenario.js';
export {
  generateDemoUnitData,
  designBackpressureKpa,
  dutyAtLoadMw,
  foulingCleanliness,
  MIN_DEMO_SPAN_DAYS,
  type DemoHour,
  type DemoUnitData,
  type DemoCleaning,
  type DemoOutage,
  type DemoFault,
  type DemoGenerationOptions,
} from './generate-demo-data.js';
export { demoShiftDays, plantToday, shiftDay } from './demo-calendar.js';
export { writeDemoCsv, writeDemoXlsx, demoImportMapping, excelSerialLocal, DEMO_FILE_COLUMNS } from './demo-files.js';
export { writeDemoFileSets, type DemoFileSet, type DemoFileSetOptions } from './demo-file-set.js';
