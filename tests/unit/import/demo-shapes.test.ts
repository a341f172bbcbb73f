/**
 * The demo generator writes every historian shape of the same hours (wide, tall with a quality column, title lines
 * with a two-row header), with status words in about 2 % of the value cells; each imports to the same samples.
 */
import { readFile, rename } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { surveyTagFiles } from '@backend/import/per-tag-files.js';
import { checkAnyShape } from '@backend/import/prepare-file.js';
import { importSamples, type ImportSample } from '@backend/import/parse-rows.js';
import {
  DEMO_SHAPE_MAPPINGS,
  DEMO_TAGS,
  demoCells,
  writeDemoPerTagCsvs,
  writeDemoTallCsv,
  writeDemoTitledCsv,
  writeDemoWideCsv,
} from '@backend/seed/demo-data/demo-historian-shapes.js';
import type { DemoHour } from '@backend/seed/demo-data/generate-demo-data.js';
import { makeTempDir } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

/** Fictional steady hours: 480 MW ± a daily swing, 2.0 inHgA-ish backpressure, 24/32 °C water, 12 m³/s. */
const HOURS: DemoHour[] = Array.from({ length: 24 * 20 }, (_, h) => ({
  timestampUtc: Date.UTC(2025, 2, 1) + h * 3_600_000,
  loadMw: 480 + 10 * Math.sin((2 * Math.PI * h) / 24),
  backpressureKpa: 6.8 + 0.2 * Math.sin((2 * Math.PI * h) / 24),
  cwInletC: 24 + Math.sin(h / 50),
  cwOutletC: 32 + Math.sin(h / 50),
  cwFlowM3s: 12,
  hotwellC: 38,
  dissolvedOxygenPpb: 7,
  airRemovalKgS: 0.002,
  barometerKpa: 101,
  truth: { cleanliness: 0.85, effectiveCleanliness: 0.85, dutyMw: 400, cwFlowM3s: 12, backpressureKpa: 6.8, offline: false, airLeak: false, fault: null },
}));

async function stored(file: string, mapping: unknown): Promise<Omit<ImportSample, 'line'>[]> {
  const { check, prepared } = await checkAnyShape(file, { mapping });
  expect(check.errors).toEqual([]);
  expect(check.fileError).toBeUndefined();
  const out: ImportSample[] = [];
  await importSamples(prepared!.path, {
    mapping: prepared!.mapping,
    statusWords: prepared!.statusWords,
    fileOrder: check.order,
    onBatch: (b) => void out.push(...b),
  });
  await prepared!.dispose();
  return out.map(({ line: _line, ...s }) => s);
}

describe('the demo generator’s historian shapes', () => {
  it('marks about 2 % of the value cells with status words', () => {
    const cells = demoCells(HOURS).flat();
    const marked = cells.filter((c) => !/^-?\d/.test(c));
    expect(marked.length / cells.length).toBeGreaterThan(0.01);
    expect(marked.length / cells.length).toBeLessThan(0.03);
    expect(new Set(marked)).toEqual(new Set(['Bad', 'No Data', 'Comm Failure']));
  });

  it('writes wide, tall and titled two-row-header files that import to the same samples', async () => {
    const wide = await stored(await writeDemoWideCsv(HOURS, tmp.file('wide.csv')), DEMO_SHAPE_MAPPINGS.wide);
    expect(wide).toHaveLength(HOURS.length);
    expect(wide.filter((s) => s.validity === 'instrument-status').length).toBeGreaterThan(0);
    expect(await stored(await writeDemoTallCsv(HOURS, tmp.file('tall.csv')), DEMO_SHAPE_MAPPINGS.tall)).toEqual(wide);
    expect(await stored(await writeDemoTitledCsv(HOURS, tmp.file('titled.csv')), DEMO_SHAPE_MAPPINGS.titled)).toEqual(wide);
  });

  it('writes one file per tag whose offset times import to the same samples as the wide file', async () => {
    const wide = await stored(await writeDemoWideCsv(HOURS, tmp.file('wide-for-tags.csv')), DEMO_SHAPE_MAPPINGS.wide);
    const folder = tmp.file('per-tag-upload');
    const files = await writeDemoPerTagCsvs(HOURS, folder);
    const uploaded = await Promise.all(
      files.map(async (f, k) => {
        const numbered = path.join(folder, `${k + 1}.upload`);
        await rename(f, numbered);
        return { name: path.basename(f), path: numbered, bytes: 1 };
      }),
    );
    expect((await surveyTagFiles(folder, uploaded)).map((e) => e.tag)).toEqual([...DEMO_TAGS]);
    expect(await stored(folder, DEMO_SHAPE_MAPPINGS.perTag)).toEqual(wide);
  });

  it('writes one file per tag with its times off the hour', async () => {
    const files = await writeDemoPerTagCsvs(HOURS.slice(0, 3), tmp.file('per-tag'));
    expect(files).toHaveLength(5);
    const lines = (await readFile(files[0]!, 'utf8')).split('\r\n');
    expect(lines.slice(0, 3)).toEqual(['Tag,U1.GEN.MW', 'Timestamp,Value', expect.stringMatching(/^2025-02-28T23:59:30Z,/)]);
  });
});
