/** One call for the seed: generate every demo unit and write its historian files with their mappings. */
import path from 'node:path';
import type { ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { DEMO_SCENARIO_SEED, DEMO_UNITS, demoPlant, type DemoPlant } from './demo-scenario.js';
import { generateDemoUnitData, type DemoUnitData } from './generate-demo-data.js';
import { plantToday } from './demo-calendar.js';
import { demoImportMapping, writeDemoCsv, writeDemoXlsx } from './demo-files.js';

export interface DemoFileSet {
  plant: DemoPlant;
  data: DemoUnitData;
  csvPath: string;
  csvMapping: ImportMappingInput;
  xlsxPath?: string;
  xlsxMapping?: ImportMappingInput;
}

export interface DemoFileSetOptions {
  xlsx?: boolean;
  seed?: number;
  /** The day the demo is made on, for every plant (tests); without it, each plant's own today at `now`. */
  today?: string;
  now?: Date;
  /** Days of history per unit (generateDemoUnitData); the whole story by default. */
  days?: number;
  /** Only these units (by key); all of them by default. */
  units?: string[];
}

export async function writeDemoFileSets(dir: string, options: DemoFileSetOptions = {}): Promise<DemoFileSet[]> {
  const sets: DemoFileSet[] = [];
  const now = options.now ?? new Date();
  for (const unit of DEMO_UNITS.filter((u) => !options.units || options.units.includes(u.key))) {
    const today = options.today ?? plantToday(demoPlant(unit.plantKey).timeZone, now);
    const data = generateDemoUnitData(unit, { today, seed: options.seed ?? DEMO_SCENARIO_SEED, days: options.days });
    const csvPath = path.join(dir, `${unit.key}.csv`);
    await writeDemoCsv(data, csvPath);
    const set: DemoFileSet = { plant: demoPlant(unit.plantKey), data, csvPath, csvMapping: demoImportMapping(data, 'csv') };
    if (options.xlsx) {
      set.xlsxPath = path.join(dir, `${unit.key}.xlsx`);
      await writeDemoXlsx(data, set.xlsxPath);
      set.xlsxMapping = demoImportMapping(data, 'xlsx');
    }
    sets.push(set);
  }
  return sets;
}
