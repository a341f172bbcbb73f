/**
 * Import pipeline speed and memory: writes a year of 1-minute historian data (525,600 rows, US
 * columns, local Chicago time through both DST changes) to a temp CSV, then times pass 1 (check)
 * and pass 2 (convert, classify, batch) and reports the peak growth of the resident set during each.
 */
import { once } from 'node:events';
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { DateTime } from 'luxon';
import type { BenchRow } from '../run.js';
import { checkImportFile, importSamples } from '../../backend/src/import/index.js';

const ROWS = 525_600;
const ZONE = 'America/Chicago';

export async function writeYearCsv(filePath: string): Promise<void> {
  const out = createWriteStream(filePath);
  out.write('Timestamp,Gross MW,BP (inHgA),CW In Temp °F,CW Out Temp °F,Circ Water Flow gpm\r\n');
  const start = DateTime.fromISO('2024-01-01T00:00', { zone: ZONE }).toMillis();
  let seed = 12345;
  const noise = () => {
    seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
    return seed / 4294967296 - 0.5;
  };
  for (let i = 0; i < ROWS; i++) {
    const t = start + i * 60_000;
    const day = i / 1440;
    const inlet = 62 - 18 * Math.cos((2 * Math.PI * day) / 366) + noise() * 0.3;
    const load = 420 + 60 * Math.sin((2 * Math.PI * i) / 1440) + noise();
    const rise = 0.046 * load;
    const line = `${DateTime.fromMillis(t, { zone: ZONE }).toFormat('MM/dd/yyyy HH:mm')},${load.toFixed(1)},${(1.2 + (inlet - 40) * 0.03 + load * 0.0012).toFixed(3)},${inlet.toFixed(2)},${(inlet + rise).toFixed(2)},${(250_000 + noise() * 800).toFixed(0)}\r\n`;
    if (!out.write(line)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

export const MAPPING = {
  timestamp: { column: 'Timestamp', format: 'local-text', timeZone: ZONE, dateOrder: 'mdy' },
  columns: {
    grossLoad: { column: 'Gross MW', unit: 'MW' },
    backpressure: { column: 'BP (inHgA)', unit: 'inHg' },
    cwInletTemperature: { column: 'CW In Temp °F', unit: 'degF' },
    cwOutletTemperature: { column: 'CW Out Temp °F', unit: 'degF' },
    cwFlow: { column: 'Circ Water Flow gpm', unit: 'gpm' },
  },
};

/** Runs `body` while sampling the resident set; returns wall and CPU seconds and peak growth in MB. */
async function measured(body: (sample: () => void) => Promise<void>): Promise<{ seconds: number; cpuSeconds: number; peakMb: number }> {
  global.gc?.();
  const base = process.memoryUsage().rss;
  let peak = base;
  const sample = () => {
    peak = Math.max(peak, process.memoryUsage().rss);
  };
  const timer = setInterval(sample, 20);
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  try {
    await body(sample);
  } finally {
    clearInterval(timer);
  }
  sample();
  const cpu = process.cpuUsage(cpu0);
  return { seconds: (performance.now() - t0) / 1000, cpuSeconds: (cpu.user + cpu.system) / 1e6, peakMb: (peak - base) / 1e6 };
}

export default async (): Promise<BenchRow[]> => {
  const dir = await mkdtemp(path.join(tmpdir(), 'cleancase-bench-import-'));
  try {
    const file = path.join(dir, 'year-1min.csv');
    await writeYearCsv(file);
    const { size } = await stat(file);
    let order: 'ascending' | 'descending' | 'unordered' = 'unordered';
    let rows = 0;
    const pass1 = await measured(async () => {
      const check = await checkImportFile(file, { mapping: MAPPING });
      if (!check.ok) throw new Error(`bench file did not pass the check: ${JSON.stringify(check.fileError ?? check.errors.slice(0, 3))}`);
      order = check.order;
      rows = check.dataRows;
    });
    let samples = 0;
    const pass2 = await measured(async (sample) => {
      await importSamples(file, {
        mapping: MAPPING,
        fileOrder: order,
        steadiness: { ratingMw: 520 },
        onBatch: (batch) => {
          samples += batch.length;
          sample();
        },
      });
    });
    if (rows !== ROWS || samples !== ROWS) throw new Error(`expected ${ROWS} rows, checked ${rows}, imported ${samples}`);
    return [
      {
        name: `import check, 1-min year CSV (${(size / 1e6).toFixed(0)} MB)`,
        value: ROWS / pass1.seconds,
        unit: 'rows/s',
        target: { value: 50_000, higherIsBetter: true },
      },
      { name: 'import check, per CPU second (all threads)', value: ROWS / pass1.cpuSeconds, unit: 'rows/CPU-s' },
      { name: 'import check, peak RSS growth', value: pass1.peakMb, unit: 'MB' },
      { name: 'import samples (convert, validity, batches)', value: ROWS / pass2.seconds, unit: 'rows/s', target: { value: 50_000, higherIsBetter: true } },
      { name: 'import samples, per CPU second (all threads)', value: ROWS / pass2.cpuSeconds, unit: 'rows/CPU-s' },
      { name: 'import samples, peak RSS growth', value: pass2.peakMb, unit: 'MB' },
    ];
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
};
