/**
 * Bad files at volume: at least FILES generated historian files that are broken in the ways real exports are
 * (wrong encodings, BOMs, mixed line ends, quoted newlines, huge cells, other delimiters, dates in many formats,
 * thousands separators and decimal commas, truncated or re-sheeted XLSX, plain junk) go through the upload
 * endpoint and, when it accepts them, are started with the proposed mapping and run. Never a 5xx; every refusal
 * says why; an import ends complete with exactly the rows it counts as stored, or failed/rejected with none.
 */
import { readdir } from 'node:fs/promises';
import ExcelJS from 'exceljs';
import fc from 'fast-check';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { makeTempDir, physicalHistory, US_HEADERS } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

/** Generated files (the issue asks for at least 500). */
const FILES = 500;
/** Files in flight at once, each lane on its own unit. */
const LANES = 4;
/** One file's upload, start and import together; far more than any of them takes. */
const FILE_LIMIT_MS = 30_000;
/** A fixed seed, so a run can be repeated and CI is not a lottery; FUZZ_SEED explores others (the seed that found the stalled workbook: 922647081). */
const SEED = process.env.FUZZ_SEED ? Number(process.env.FUZZ_SEED) : 922_647_081;

let t: TestApp;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let analyst: TestAgent;
let units: GeneratingUnit[];
let xlsxBase: { plain: Buffer; twoSheets: Buffer };

const BASE = physicalHistory({ startUtc: Date.UTC(2023, 4, 1), hours: 72, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });

/** One generated file: its bytes, its name, and what was done to it (shown when it fails). */
interface BadFile {
  label: string;
  name: string;
  bytes: Buffer;
}

const pad = (n: number) => String(n).padStart(2, '0');
/** A time in one of the formats historians and spreadsheets write. */
const DATE_FORMATS: ((ms: number) => string)[] = [
  (ms) => new Date(ms).toISOString(),
  (ms) => new Date(ms).toISOString().replace('T', ' ').slice(0, 19),
  (ms) => new Date(ms).toISOString().slice(0, 16),
  (ms) => {
    const d = new Date(ms);
    return `${pad(d.getUTCDate())}/${pad(d.getUTCMonth() + 1)}/${d.getUTCFullYear()} ${pad(d.getUTCHours())}:00`;
  },
  (ms) => {
    const d = new Date(ms);
    const h = d.getUTCHours();
    return `${d.getUTCMonth() + 1}/${d.getUTCDate()}/${d.getUTCFullYear()} ${h % 12 || 12}:00 ${h < 12 ? 'AM' : 'PM'}`;
  },
  (ms) => {
    const d = new Date(ms);
    return `${pad(d.getUTCDate())}.${pad(d.getUTCMonth() + 1)}.${d.getUTCFullYear()} ${pad(d.getUTCHours())}:00:00`;
  },
  (ms) => String(Math.floor(ms / 1000)),
  (ms) => String(ms),
  (ms) => String(25569 + ms / 86_400_000),
  (ms) => new Date(ms).toISOString().replace('Z', '+05:30'),
  (ms) => new Date(ms).toUTCString(),
  (ms) => new Date(ms).toISOString().replace(/[-:]/g, '').slice(0, 13),
  (ms) => `${new Date(ms).toISOString().slice(0, 10)}T24:00`,
  () => '2024-13-45 25:61',
  () => '',
];

/** A number as exports write it: thousands separators, decimal commas, units, status words, nothing. */
const NUMBER_FORMATS: ((v: number) => string)[] = [
  (v) => v.toFixed(3),
  (v) => v.toLocaleString('en-US', { maximumFractionDigits: 2 }),
  (v) => v.toFixed(2).replace('.', ','),
  (v) => v.toLocaleString('de-DE', { maximumFractionDigits: 2 }),
  (v) => v.toLocaleString('fr-FR', { maximumFractionDigits: 2 }),
  (v) => `${v.toFixed(1)} MW`,
  (v) => v.toExponential(4),
  () => 'NaN',
  () => '#N/A',
  () => 'Bad Input',
  () => 'I/O Timeout',
  () => '-',
  () => '',
  () => '1e400',
  () => '٣٤٥',
];

/** A damage in about one file of six, so most files carry one or two and reach the import itself. */
const sometimes = <T>(arb: fc.Arbitrary<T>) => fc.oneof({ arbitrary: fc.constant(null), weight: 5 }, { arbitrary: arb, weight: 1 });

const encodings = ['utf8', 'utf8-bom', 'utf16le-bom', 'utf16le', 'utf16be-bom', 'latin1'] as const;
function encode(text: string, encoding: (typeof encodings)[number]): Buffer {
  switch (encoding) {
    case 'utf8':
      return Buffer.from(text, 'utf8');
    case 'utf8-bom':
      return Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text, 'utf8')]);
    case 'utf16le-bom':
      return Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
    case 'utf16le':
      return Buffer.from(text, 'utf16le');
    case 'utf16be-bom': {
      const le = Buffer.from(text, 'utf16le');
      return Buffer.concat([Buffer.from([0xfe, 0xff]), le.swap16()]);
    }
    case 'latin1':
      return Buffer.from(text, 'latin1');
  }
}

const csvFile: fc.Arbitrary<BadFile> = fc
  .record({
    rows: fc.integer({ min: 0, max: 48 }),
    date: fc.integer({ min: 0, max: DATE_FORMATS.length - 1 }),
    number: fc.integer({ min: 0, max: NUMBER_FORMATS.length - 1 }),
    mixNumbers: fc.boolean(),
    delimiter: fc.constantFrom(',', ';', '\t', '|'),
    lineEnd: fc.constantFrom('\n', '\r\n', '\r', 'mixed'),
    encoding: fc.oneof({ arbitrary: fc.constant(encodings[0]), weight: 5 }, fc.constantFrom(...encodings.slice(1))),
    header: fc.constantFrom('us', 'latin', 'duplicated', 'none', 'blank-lines-first'),
    quotedNewline: fc.boolean(),
    hugeCell: sometimes(fc.integer({ min: 10_000, max: 300_000 })),
    cutAt: sometimes(fc.double({ min: 0.05, max: 0.99, noNaN: true })),
  })
  .map((o) => {
    const headers: string[] =
      o.header === 'latin'
        ? ['Zeitstempel', 'Bruttoleistung MW', 'Kondensatordruck inHgA', 'KW Eintritt °F', 'KW Austritt °F', 'KW Menge gpm']
        : [...US_HEADERS];
    if (o.header === 'duplicated') headers[2] = headers[1]!;
    const quote = (cell: string) => (/[",\n\r;\t|]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);
    const lines: string[] = o.header === 'none' ? [] : [headers.map(quote).join(o.delimiter)];
    if (o.header === 'blank-lines-first') lines.unshift('', 'Exported from the plant historian', '');
    BASE.slice(0, o.rows).forEach((r, i) => {
      const values = [r.loadMw, r.backpressureKpa / 3.386389, (r.cwInletC * 9) / 5 + 32, (r.cwOutletC * 9) / 5 + 32, r.cwFlowM3s * 15850.32];
      const fmt = NUMBER_FORMATS[o.mixNumbers ? (o.number + i) % NUMBER_FORMATS.length : o.number]!;
      const cells = [DATE_FORMATS[o.date]!(r.timestampUtc), ...values.map(fmt)];
      if (o.quotedNewline && i === 1) cells[1] = `${cells[1]}\nsecond line`;
      if (o.hugeCell && i === 0) cells[2] = 'x'.repeat(o.hugeCell);
      lines.push(cells.map(quote).join(o.delimiter));
    });
    const text =
      o.lineEnd === 'mixed' ? lines.map((l, i) => l + ['\n', '\r\n', '\r'][i % 3]).join('') : lines.join(o.lineEnd) + (lines.length ? o.lineEnd : '');
    let bytes = encode(text, o.encoding);
    if (o.cutAt !== null) bytes = bytes.subarray(0, Math.max(1, Math.floor(bytes.length * o.cutAt)));
    const label = `CSV ${o.rows} rows, date format ${o.date}, number format ${o.number}${o.mixNumbers ? ' (mixed)' : ''}, ${JSON.stringify(o.delimiter)}, ${JSON.stringify(o.lineEnd)}, ${o.encoding}, header ${o.header}${o.quotedNewline ? ', quoted newline' : ''}${o.hugeCell ? `, ${o.hugeCell}-char cell` : ''}${o.cutAt !== null ? `, cut at ${(o.cutAt * 100).toFixed(0)} %` : ''}`;
    return { label, name: 'history.csv', bytes };
  });

const xlsxFile: fc.Arbitrary<BadFile> = fc
  .record({
    base: fc.constantFrom<'plain' | 'twoSheets'>('plain', 'twoSheets'),
    damage: fc.constantFrom('none', 'cut', 'flip', 'renamed-csv'),
    at: fc.double({ min: 0.01, max: 0.99, noNaN: true }),
  })
  .map((o) => {
    let bytes = Buffer.from(xlsxBase[o.base]);
    const at = Math.floor(bytes.length * o.at);
    if (o.damage === 'cut') bytes = bytes.subarray(0, Math.max(1, at));
    if (o.damage === 'flip') for (let i = at; i < Math.min(bytes.length, at + 64); i++) bytes[i] = bytes[i]! ^ 0x5a;
    const label = `XLSX ${o.base === 'twoSheets' ? 'with an empty first sheet and the data on the second' : 'one sheet'}, ${o.damage === 'none' ? 'intact' : o.damage === 'renamed-csv' ? 'named .csv' : `${o.damage} at ${(o.at * 100).toFixed(0)} %`}`;
    return { label, name: o.damage === 'renamed-csv' ? 'history.csv' : 'history.xlsx', bytes };
  });

const junkFile: fc.Arbitrary<BadFile> = fc
  .tuple(fc.uint8Array({ minLength: 1, maxLength: 4096 }), fc.constantFrom('history.csv', 'history.xlsx', 'history.txt', 'history'))
  .map(([b, name]) => ({ label: `${b.length} random bytes named ${name}`, name, bytes: Buffer.from(b) }));

const badFiles = fc.oneof({ arbitrary: csvFile, weight: 7 }, { arbitrary: xlsxFile, weight: 2 }, { arbitrary: junkFile, weight: 1 });

async function workbook(sheets: { name: string; rows: unknown[][] }[]): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  for (const s of sheets) {
    const sheet = wb.addWorksheet(s.name);
    for (const r of s.rows) sheet.addRow(r);
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** The import jobs run; the recompute each complete import queues is not what this file tests, so it is passed over (marked done). */
const IMPORTS_ONLY = { import: JOB_HANDLERS.import, recompute: async () => undefined };

const rowsOfImport = async (importId: string) =>
  Number(((await t.dataSource.query('SELECT COUNT(*) AS n FROM performance_sample WHERE importId = ?', [importId])) as { n: string }[])[0]!.n);

describe(`${FILES} generated bad files through the upload endpoint`, () => {
  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    const tenant = await createTenant(t.dataSource, 'upload-fuzz');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    const plant = await createPlant(t.dataSource, tenant.organisation.id);
    units = [];
    for (let i = 0; i < LANES; i++) units.push(await createUnit(t.dataSource, plant));
    const table = [[...US_HEADERS], ...BASE.slice(0, 24).map((r) => r.cells.map((c, k) => (k === 0 ? c : Number(c))))];
    xlsxBase = {
      plain: await workbook([{ name: 'Readings', rows: table }]),
      twoSheets: await workbook([
        { name: 'Notes', rows: [] },
        { name: 'Readings', rows: table },
      ]),
    };
  });
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  it(`never a 5xx, every refusal says why, no import half-stored (FUZZ_SEED=${SEED})`, { timeout: 300_000 }, async () => {
    const files = fc.sample(badFiles, { numRuns: FILES, seed: SEED });
    expect(files).toHaveLength(FILES);
    const problems: string[] = [];
    const outcomes = new Map<string, number>();
    const count = (key: string) => outcomes.set(key, (outcomes.get(key) ?? 0) + 1);
    const handle = async (unit: GeneratingUnit, file: BadFile): Promise<void> => {
      const where = (what: string, res: { status: number; body: unknown }) =>
        `${file.label}: ${what} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
      const up = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', file.bytes, file.name);
      if (up.status >= 500 || (up.status >= 400 && !(typeof up.body?.error === 'string' && up.body.error.length > 5))) {
        problems.push(where('upload', up));
        return;
      }
      if (up.status !== 201) {
        count(`upload ${up.status}`);
        return;
      }
      const importId: string = up.body.import.id;
      const start = await analyst.post(`/api/imports/${importId}/start`).set(CSRF).send({ mapping: up.body.proposedMapping });
      if (start.status >= 500 || (start.status >= 400 && !(typeof start.body?.error === 'string' && start.body.error.length > 5))) {
        problems.push(where('start', start));
        return;
      }
      if (start.status !== 202) {
        count(`start ${start.status}`);
        if ((await rowsOfImport(importId)) !== 0) problems.push(where('rows stored by an import that never started', start));
        return;
      }
      await drainJobs(t.dataSource, IMPORTS_ONLY);
      let view = await analyst.get(`/api/imports/${importId}`);
      for (let i = 0; i < 100 && (view.body?.status === 'checking' || view.body?.status === 'importing'); i++) {
        await new Promise((r) => setTimeout(r, 100));
        await drainJobs(t.dataSource, IMPORTS_ONLY);
        view = await analyst.get(`/api/imports/${importId}`);
      }
      if (view.status !== 200) {
        problems.push(where('import view', view));
        return;
      }
      const rows = await rowsOfImport(importId);
      const status: string = view.body.status;
      count(`import ${status}`);
      if (status === 'complete') {
        if (rows !== view.body.counts?.stored) problems.push(where(`complete import with ${rows} rows stored`, view));
      } else if (status === 'failed' || status === 'rejected') {
        if (rows !== 0) problems.push(where(`${status} import with ${rows} rows left`, view));
        if (!(typeof view.body.message === 'string' && view.body.message.length > 5) && !(view.body.errors?.length > 0))
          problems.push(where(`${status} import without a reason`, view));
      } else problems.push(where('import still running', view));
    };
    let next = 0;
    await Promise.all(
      units.map(async (unit) => {
        while (next < files.length) {
          const file = files[next++]!;
          let timer: NodeJS.Timeout | undefined;
          const limit = new Promise<'hung'>((resolve) => (timer = setTimeout(() => resolve('hung'), FILE_LIMIT_MS)));
          const outcome = await Promise.race([handle(unit, file), limit]);
          clearTimeout(timer);
          if (outcome === 'hung') problems.push(`${file.label}: not finished after ${FILE_LIMIT_MS / 1000} s (upload, start or import hangs)`);
        }
      }),
    );
    console.log(`upload fuzz (FUZZ_SEED=${SEED}): ${[...outcomes].map(([k, n]) => `${n}× ${k}`).join(', ')}`);
    expect(problems.slice(0, 5), `${problems.length} of ${FILES} files handled wrongly`).toEqual([]);
    // Refused uploads leave no file: only uploads still waiting for their mapping keep theirs.
    const waiting = Number(
      (
        (await t.dataSource.query(`SELECT COUNT(*) AS n FROM data_import WHERE storedPath IS NOT NULL AND unitId IN (?)`, [units.map((u) => u.id)])) as {
          n: string;
        }[]
      )[0]!.n,
    );
    expect((await readdir(tmp.file('uploads'))).length).toBe(waiting);
  });
});
