/**
 * The import's bulk write: checked rows streamed into `performance_sample` with `LOAD DATA LOCAL INFILE` from a
 * generated tab-separated stream (no file on disk), several times faster than multi-row INSERTs.
 *
 * LOAD DATA LOCAL cannot stop the client's stream, so MariaDB turns errors on single rows (a duplicate
 * unit and time, a value it had to convert) into warnings and goes on. A load is therefore accepted only when
 * every row sent was stored without a warning; otherwise it throws, and the caller's transaction and the
 * import's all-or-nothing rule remove what it wrote.
 */
import { Readable } from 'node:stream';
import type { EntityManager } from 'typeorm';
import type { PerformanceSample } from '../entities/performance-sample.entity.js';
import type { ImportSample } from '../import/index.js';

/** The columns an import writes for each sample, in order (a loaded line; the INSERT path uses the same list). */
export const LOADED_COLUMNS = [
  'unitId',
  'importId',
  'timestampUtc',
  'loadMw',
  'backpressureKpa',
  'cwInletC',
  'cwOutletC',
  'cwFlowM3s',
  'flowAssumed',
  'hotwellC',
  'dissolvedOxygenPpb',
  'airRemovalKgS',
  'barometerKpa',
  'cwDifferentialPressureKpa',
  'condensateFlowKgS',
  'validity',
  'setupVersion',
] as const satisfies readonly (keyof PerformanceSample)[];

export interface SampleOwner {
  unitId: string;
  importId: string;
  setupVersion: number;
}

/** `\N` is LOAD DATA's NULL; a finite number as JavaScript prints it reads back as the same double. */
const num = (v: number | undefined | null): string => (v === undefined || v === null || !Number.isFinite(v) ? '\\N' : String(v));
/** Escapes what LOAD DATA's default field rules treat specially (backslash, tab, newline). */
const text = (v: string): string =>
  /[\\\t\n\r]/.test(v) ? v.replace(/[\\\t\n\r]/g, (c) => (c === '\\' ? '\\\\' : c === '\t' ? '\\t' : c === '\n' ? '\\n' : '\\r')) : v;
const pad2 = (n: number) => (n < 10 ? `0${n}` : String(n));
const DAY_MS = 86_400_000;
let cachedDay = Number.NaN;
let cachedDayText = '';
/**
 * UTC wall-clock time with milliseconds, as a `datetime(3)` column holds it (the connection runs in UTC).
 * Rows come in time order, so the date part is formatted once a day.
 */
function datetime(time: number): string {
  const ms = Math.round(time);
  const day = Math.floor(ms / DAY_MS);
  if (day !== cachedDay) {
    cachedDay = day;
    cachedDayText = new Date(day * DAY_MS).toISOString().slice(0, 11).replace('T', ' ');
  }
  const inDay = ms - day * DAY_MS;
  const milli = inDay % 1000;
  const secs = (inDay - milli) / 1000;
  return `${cachedDayText}${pad2(Math.floor(secs / 3600))}:${pad2(Math.floor(secs / 60) % 60)}:${pad2(secs % 60)}.${milli < 10 ? '00' : milli < 100 ? '0' : ''}${milli}`;
}

/** One sample as a tab-separated line in LOADED_COLUMNS order. */
export function sampleLine(owner: SampleOwner, s: ImportSample): string {
  return `${owner.unitId}\t${owner.importId}\t${datetime(s.timestampUtc)}\t${num(s.loadMw)}\t${num(s.backpressureKpa)}\t${num(s.cwInletC)}\t${num(s.cwOutletC)}\t${num(s.cwFlowM3s)}\t${s.flowAssumed ? '1' : '0'}\t${num(s.hotwellC)}\t${num(s.dissolvedOxygenPpb)}\t${num(s.airRemovalKgS)}\t${num(s.barometerKpa)}\t${num(s.cwDifferentialPressureKpa)}\t${num(s.condensateFlowKgS)}\t${text(s.validity)}\t${owner.setupVersion}\n`;
}

/** Lines of ~1,000 samples per stream chunk (bytes: the driver copies buffers): few calls, flat memory. */
function* lineChunks(owner: SampleOwner, samples: readonly ImportSample[]): Generator<Buffer> {
  for (let i = 0; i < samples.length; i += 1_000) {
    let chunk = '';
    for (const s of samples.slice(i, i + 1_000)) chunk += sampleLine(owner, s);
    yield Buffer.from(chunk, 'utf8');
  }
}

export const LOAD_SAMPLES_SQL = `LOAD DATA LOCAL INFILE 'samples.tsv' INTO TABLE performance_sample CHARACTER SET utf8mb4
  FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n' (${LOADED_COLUMNS.join(', ')})`;

interface LoadResult {
  affectedRows: number;
  warningStatus: number;
}

/** The driver connection under a TypeORM manager bound to one connection (a transaction's or a query runner's). */
interface RawConnection {
  query(options: { sql: string; infileStreamFactory: () => Readable }, callback: (err: Error | null, result: LoadResult) => void): void;
}

/** Streams a body of lines into `performance_sample`; resolves with the rows stored and the warnings raised. */
export function loadLines(em: EntityManager, lines: () => Readable): Promise<LoadResult> {
  return loadStatement(em, LOAD_SAMPLES_SQL, lines);
}

/** Runs one `LOAD DATA LOCAL INFILE` statement with the given body of lines, on the manager's one connection. */
export function loadStatement(em: EntityManager, sql: string, lines: () => Readable): Promise<LoadResult> {
  const connection = (em.queryRunner as unknown as { databaseConnection?: RawConnection } | undefined)?.databaseConnection;
  if (!connection) throw new Error('a bulk load needs a manager bound to one connection (inside a transaction)');
  return new Promise((resolve, reject) => {
    connection.query({ sql, infileStreamFactory: lines }, (err, result) => (err ? reject(err) : resolve(result)));
  });
}

/** A number as a loaded field: `\\N` (NULL) unless finite. */
export const loadedNumber = (v: number | undefined | null): string => num(v);

/**
 * Stores checked rows of one import with one LOAD DATA statement on the manager's connection; throws unless
 * every row was stored as sent (a row refused as a duplicate or converted with a warning fails the load).
 */
export async function loadSamples(em: EntityManager, owner: SampleOwner, samples: readonly ImportSample[]): Promise<void> {
  if (samples.length === 0) return;
  const result = await loadLines(em, () => Readable.from(lineChunks(owner, samples)));
  if (result.affectedRows !== samples.length || result.warningStatus !== 0) {
    const warnings: { Message: string }[] = result.warningStatus ? await em.query('SHOW WARNINGS LIMIT 3') : [];
    throw new Error(
      `the database stored ${result.affectedRows} of ${samples.length} rows${warnings.length ? ` (${warnings.map((w) => w.Message).join('; ')})` : ''}`,
    );
  }
}
