/**
 * A tall historian file against the wide file of the same data: a year of 1-minute values of 8 tags (525,600
 * times; 4.2 M tall rows with short tag names and ISO 8601 timestamps, in time order) through the whole file
 * pipeline of an import as the job runs each shape — the wide file checked and classified in one read; the tall
 * file checked and aligned to a 1-min grid, then the aligned file classified — timed end to end, with the peak growth of the resident set during the tall run. The rate is samples handed to
 * the store per second; the database write, the same for both shapes, is not part of this case
 * (import-end-to-end.ts times it).
 */
import { once } from 'node:events';
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { BenchRow } from '../run.js';
import { checkAnyShape } from '../../backend/src/import/prepare-file.js';
import { checkAndImportSamples, importSamples } from '../../backend/src/import/index.js';

const TIMES = 525_600;
const START = Date.UTC(2024, 0, 1);
const TAGS = ['MW', 'BP', 'CWI', 'CWO', 'CWF', 'HW', 'DO', 'AIR'];
const HEADERS = ['Timestamp', 'Gross MW', 'BP inHgA', 'CW In F', 'CW Out F', 'CW Flow gpm', 'Hotwell F', 'DO ppb', 'Air SCFM'];
const QUANTITIES = [
  ['grossLoad', 'MW'],
  ['backpressure', 'inHg'],
  ['cwInletTemperature', 'degF'],
  ['cwOutletTemperature', 'degF'],
  ['cwFlow', 'gpm'],
  ['hotwellTemperature', 'degF'],
  ['dissolvedOxygen', 'ppb'],
  ['airRemovalFlow', 'scfm'],
] as const;

function valuesAt(i: number, noise: () => number): string[] {
  const day = i / 1440;
  const inlet = 62 - 18 * Math.cos((2 * Math.PI * day) / 366) + noise() * 0.3;
  const load = 420 + 60 * Math.sin((2 * Math.PI * i) / 1440) + noise();
  const rise = 0.046 * load;
  const bp = 1.2 + (inlet - 40) * 0.03 + load * 0.0012;
  return [
    load.toFixed(1),
    bp.toFixed(3),
    inlet.toFixed(2),
    (inlet + rise).toFixed(2),
    (250_000 + noise() * 800).toFixed(0),
    (inlet + rise + 6).toFixed(2),
    (7 + noise()).toFixed(1),
    (4 + noise()).toFixed(1),
  ];
}

async function writeBoth(widePath: string, tallPath: string): Promise<void> {
  const wide = createWriteStream(widePath);
  const tall = createWriteStream(tallPath);
  wide.write(`${HEADERS.join(',')}\n`);
  tall.write('Tag,Timestamp,Value\n');
  let seed = 12345;
  const noise = () => {
    seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
    return seed / 4294967296 - 0.5;
  };
  let w = '';
  let t = '';
  for (let i = 0; i < TIMES; i++) {
    const ts = new Date(START + i * 60_000).toISOString().replace('.000Z', 'Z');
    const v = valuesAt(i, noise);
    w += `${ts},${v.join(',')}\n`;
    for (let k = 0; k < TAGS.length; k++) t += `${TAGS[k]},${ts},${v[k]}\n`;
    if (t.length > 1 << 20) {
      if (!wide.write(w)) await once(wide, 'drain');
      if (!tall.write(t)) await once(tall, 'drain');
      w = '';
      t = '';
    }
  }
  wide.end(w);
  tall.end(t);
  await Promise.all([once(wide, 'finish'), once(tall, 'finish')]);
}

const timestamp = { column: 'Timestamp', format: 'iso-8601-offset' as const };
const WIDE_MAPPING = { timestamp, columns: Object.fromEntries(QUANTITIES.map(([q, unit], k) => [q, { column: HEADERS[k + 1]!, unit }])) };
const TALL_MAPPING = {
  timestamp,
  columns: Object.fromEntries(QUANTITIES.map(([q, unit], k) => [q, { column: TAGS[k]!, unit }])),
  tall: { tagColumn: 'Tag', valueColumn: 'Value', gridMinutes: 1, rule: 'nearest', toleranceMinutes: 0.5 },
};

/**
 * The file pipeline of one import as the import job runs it: a wide file in time order is checked and classified in
 * one read (checkAndImportSamples); a tall file is checked and aligned, then its aligned file classified. Rate and
 * RSS growth.
 */
async function run(file: string, mapping: unknown, shape: 'wide' | 'tall'): Promise<{ seconds: number; samples: number; peakMb: number }> {
  global.gc?.();
  const base = process.memoryUsage().rss;
  let peak = base;
  const sample = () => {
    peak = Math.max(peak, process.memoryUsage().rss);
  };
  const timer = setInterval(sample, 20);
  const t0 = performance.now();
  let samples = 0;
  try {
    if (shape === 'wide') {
      const { check, summary } = await checkAndImportSamples(file, {
        mapping,
        steadiness: { ratingMw: 520 },
        onBatch: (batch) => {
          samples += batch.length;
          sample();
        },
      });
      if (!check.ok || !summary) throw new Error(`bench file did not pass in one read: ${JSON.stringify(check.fileError ?? check.errors.slice(0, 3))}`);
    } else
      await tallPipeline(file, mapping, (n) => {
        samples += n;
        sample();
      });
  } finally {
    clearInterval(timer);
  }
  sample();
  return { seconds: (performance.now() - t0) / 1000, samples, peakMb: (peak - base) / 1e6 };
}

/** A tall file as the job takes it: checked and aligned to a wide file, which is then classified. */
async function tallPipeline(file: string, mapping: unknown, counted: (n: number) => void): Promise<void> {
  const { check, prepared } = await checkAnyShape(file, { mapping });
  if (!check.ok || !prepared) throw new Error(`bench file did not pass the check: ${JSON.stringify(check.fileError ?? check.errors.slice(0, 3))}`);
  try {
    await importSamples(prepared.path, {
      mapping: prepared.mapping,
      statusWords: prepared.statusWords,
      fileOrder: check.order,
      steadiness: { ratingMw: 520 },
      onBatch: (batch) => counted(batch.length),
    });
  } finally {
    await prepared.dispose();
  }
}

export default async (): Promise<BenchRow[]> => {
  const dir = await mkdtemp(path.join(tmpdir(), 'cleancase-bench-tall-'));
  try {
    const widePath = path.join(dir, 'year-wide.csv');
    const tallPath = path.join(dir, 'year-tall.csv');
    await writeBoth(widePath, tallPath);
    const { size } = await stat(tallPath);
    const wide = await run(widePath, WIDE_MAPPING, 'wide');
    const tall = await run(tallPath, TALL_MAPPING, 'tall');
    if (wide.samples !== TIMES || tall.samples !== TIMES) throw new Error(`expected ${TIMES} samples, wide ${wide.samples}, tall ${tall.samples}`);
    const wideRate = TIMES / wide.seconds;
    const tallRate = TIMES / tall.seconds;
    return [
      { name: 'import file pipeline, wide 1-min year of 8 tags', value: wideRate, unit: 'samples/s' },
      { name: `import file pipeline, tall 4.2 M rows (${(size / 1e6).toFixed(0)} MB), aligned to 1 min`, value: tallRate, unit: 'samples/s' },
      { name: 'import file pipeline, tall rate ÷ wide rate', value: tallRate / wideRate, unit: 'ratio', target: { value: 0.5, higherIsBetter: true } },
      { name: 'import file pipeline, tall peak RSS growth', value: tall.peakMb, unit: 'MB', target: { value: 400, higherIsBetter: false } },
    ];
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
};
