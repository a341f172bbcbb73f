/**
 * A demo unit's hours written in the other shapes historians export, for tests and demonstrations: the same
 * values (US customary, the 'us-absolute' columns) as a wide file, as a tall file (tag, time, value, quality),
 * as a wide file with title lines and a two-row header (names, then units), and as one file per tag with each
 * tag's times a little off the hour. Status words replace about 2 % of the value cells (a fixed pseudo-random
 * choice, so a file is the same every time); the wide, tall and titled files mark the same cells.
 */
import { once } from 'node:events';
import { createWriteStream } from 'node:fs';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { DEMO_FILE_COLUMNS } from './demo-files.js';
import type { DemoHour } from './generate-demo-data.js';

const COLUMNS = DEMO_FILE_COLUMNS['us-absolute'].columns.slice(0, 5);
/** Short historian tag names of the five columns (fictional). */
export const DEMO_TAGS = ['U1.GEN.MW', 'U1.COND.BPA', 'U1.CW.TIN', 'U1.CW.TOUT', 'U1.CW.FLOW'] as const;
const UNITS = ['MW', 'inHgA', '°F', '°F', 'gpm'] as const;
const MAPPED = [
  ['grossLoad', 'MW'],
  ['backpressure', 'inHg'],
  ['cwInletTemperature', 'degF'],
  ['cwOutletTemperature', 'degF'],
  ['cwFlow', 'gpm'],
] as const;
const STATUS_WORDS = ['Bad', 'No Data', 'I/O Timeout', 'Comm Failure'] as const;

export interface ShapeOptions {
  /** Share of value cells replaced by a status word (default 0.02). */
  markerShare?: number;
  /** Status words to use (default: Bad, No Data, Comm Failure; add an organisation's own). */
  words?: readonly string[];
}

/** The cells of every hour (text as written), with the same status words in the same cells for every shape. */
export function demoCells(hours: readonly DemoHour[], options: ShapeOptions = {}): string[][] {
  const share = options.markerShare ?? 0.02;
  const words = options.words ?? STATUS_WORDS.filter((w) => w !== 'I/O Timeout');
  let seed = 20_261_202;
  const next = () => {
    seed = (Math.imul(seed, 1_103_515_245) + 12_345) >>> 0;
    return seed / 4_294_967_296;
  };
  return hours.map((h) =>
    COLUMNS.map((c) => {
      const marked = next() < share;
      const word = words[Math.floor(next() * words.length)]!;
      return marked ? word : c.value(h).toFixed(c.decimals);
    }),
  );
}

const iso = (ms: number) => new Date(ms).toISOString().replace('.000Z', 'Z');

async function writeLines(filePath: string, lines: Iterable<string>): Promise<string> {
  const out = createWriteStream(filePath, { encoding: 'utf8' });
  for (const line of lines) if (!out.write(`${line}\r\n`)) await once(out, 'drain');
  out.end();
  await once(out, 'finish');
  return filePath;
}

/** The wide file: Timestamp and the five columns, ISO 8601 UTC times. */
export function writeDemoWideCsv(hours: readonly DemoHour[], filePath: string, options: ShapeOptions = {}): Promise<string> {
  const cells = demoCells(hours, options);
  return writeLines(filePath, [
    ['Timestamp', ...COLUMNS.map((c) => c.header)].join(','),
    ...hours.map((h, i) => [iso(h.timestampUtc), ...cells[i]!].join(',')),
  ]);
}

/** Title lines (export notes, the time range) above a two-row header: names, then units. */
export function writeDemoTitledCsv(hours: readonly DemoHour[], filePath: string, options: ShapeOptions = {}): Promise<string> {
  const cells = demoCells(hours, options);
  const first = hours[0]?.timestampUtc ?? 0;
  const last = hours.at(-1)?.timestampUtc ?? 0;
  return writeLines(filePath, [
    'Historian export: unit 1 condenser tags (demo data)',
    `Range,${iso(first)},${iso(last)}`,
    ['Timestamp', 'Gross load', 'Backpressure', 'CW inlet temp', 'CW outlet temp', 'CW flow'].join(','),
    ['', ...UNITS].join(','),
    ...hours.map((h, i) => [iso(h.timestampUtc), ...cells[i]!].join(',')),
  ]);
}

/** The tall file: Tag,Timestamp,Value,Quality in time order; marked cells carry quality Bad. */
export function writeDemoTallCsv(hours: readonly DemoHour[], filePath: string, options: ShapeOptions = {}): Promise<string> {
  const cells = demoCells(hours, options);
  function* lines(): Generator<string> {
    yield 'Tag,Timestamp,Value,Quality';
    for (let i = 0; i < hours.length; i++) {
      const t = iso(hours[i]!.timestampUtc);
      for (let k = 0; k < DEMO_TAGS.length; k++) {
        const v = cells[i]![k]!;
        yield [DEMO_TAGS[k], t, v, /^[\d.-]/.test(v) ? 'Good' : 'Bad'].join(',');
      }
    }
  }
  return writeLines(filePath, lines());
}

/** One file per tag (Timestamp,Value), each tag's times off the hour by a few tens of seconds. */
export async function writeDemoPerTagCsvs(hours: readonly DemoHour[], dir: string, options: ShapeOptions = {}): Promise<string[]> {
  const cells = demoCells(hours, options);
  await mkdir(dir, { recursive: true });
  const files: string[] = [];
  for (let k = 0; k < DEMO_TAGS.length; k++) {
    const offsetMs = (k * 17 - 30) * 1000;
    files.push(
      await writeLines(path.join(dir, `${DEMO_TAGS[k]}.csv`), [
        `Tag,${DEMO_TAGS[k]}`,
        'Timestamp,Value',
        ...hours.map((h, i) => `${iso(h.timestampUtc + offsetMs)},${cells[i]![k]}`),
      ]),
    );
  }
  return files;
}

/** Mappings of the shapes above. */
export const DEMO_SHAPE_MAPPINGS = {
  wide: {
    timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
    columns: Object.fromEntries(MAPPED.map(([q, unit], k) => [q, { column: COLUMNS[k]!.header, unit }])),
  },
  titled: {
    timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
    columns: Object.fromEntries(
      MAPPED.map(([q, unit], k) => [q, { column: `${['Gross load', 'Backpressure', 'CW inlet temp', 'CW outlet temp', 'CW flow'][k]} (${UNITS[k]})`, unit }]),
    ),
  },
  tall: {
    timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
    columns: Object.fromEntries(MAPPED.map(([q, unit], k) => [q, { column: DEMO_TAGS[k], unit }])),
    quality: { column: 'Quality', goodValues: ['Good'] },
    tall: { tagColumn: 'Tag', valueColumn: 'Value', gridMinutes: 60, rule: 'nearest', toleranceMinutes: 5 },
  },
  /** The one-tag files read together: their columns are those of backend/src/import/per-tag-files.ts. */
  perTag: {
    timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
    columns: Object.fromEntries(MAPPED.map(([q, unit], k) => [q, { column: DEMO_TAGS[k], unit }])),
    tall: { tagColumn: 'Tag', valueColumn: 'Value', gridMinutes: 60, rule: 'nearest', toleranceMinutes: 5 },
  },
} as const satisfies Record<string, ImportMappingInput>;
