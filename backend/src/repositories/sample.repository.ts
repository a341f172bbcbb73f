/**
 * Stored historian samples (`performance_sample`): the import's writes, the views' reads, and a sample looked
 * up within the caller's scope. The recompute's reads and write-back are in sample-analysis.repository.ts;
 * which samples count, in sample-validity.ts.
 */
import type { EntityManager } from 'typeorm';
import type { SAMPLE_COLUMNS } from '@shared/schemas/health.js';
import { PerformanceSample } from '../entities/performance-sample.entity.js';
import type { ImportSample } from '../import/index.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { LOADED_COLUMNS, type SampleOwner } from './sample-bulk-load.repository.js';
import { PASSED_CHECKS_SQL } from './sample-validity.js';
import { restrictUnitRecordsToScope } from './scope-filter.js';

/**
 * SQL condition on `performance_sample` (alias-free, one parameter: the unit's id): the row belongs to no import
 * still checking or importing. An import stores its rows while it checks the file and removes them all when it
 * fails, so readers see a unit's rows only once their import is complete.
 */
export const SHOWN_SAMPLE_SQL = `importId NOT IN (SELECT i.id FROM data_import i WHERE i.unitId = ? AND i.status IN ('checking', 'importing'))`;

/** The sample, or null when it does not exist, its import is not complete or its unit lies outside the scope. */
export function findSampleInScope(em: EntityManager, scope: TenantScope, id: string): Promise<PerformanceSample | null> {
  if (!/^\d{1,19}$/.test(id)) return Promise.resolve(null);
  const qb = em
    .getRepository(PerformanceSample)
    .createQueryBuilder('s')
    .where('s.id = :id', { id })
    .andWhere(`s.importId NOT IN (SELECT i.id FROM data_import i WHERE i.unitId = s.unitId AND i.status IN ('checking', 'importing'))`);
  return restrictUnitRecordsToScope(qb, 's', scope, { ownTenantColumn: false }).getOne();
}

const isoOrNull = (v: unknown) => (v ? new Date(v as string).toISOString() : null);

/** The time of the unit's first or last shown sample: the (unit, time) index read from one end, stopping at the first shown row. */
async function endSampleTime(em: EntityManager, unitId: string, end: 'ASC' | 'DESC'): Promise<string | null> {
  const [row] = await em.query(
    `SELECT timestampUtc AS ts FROM performance_sample WHERE unitId = ? AND ${SHOWN_SAMPLE_SQL} ORDER BY timestampUtc ${end} LIMIT 1`,
    [unitId, unitId],
  );
  return isoOrNull(row?.ts);
}

/** How many samples a unit shows and the times of its first and last (ISO, UTC). */
export async function sampleSpanOfUnit(em: EntityManager, unitId: string): Promise<{ count: number; first: string | null; last: string | null }> {
  // every row of the unit, less the rows of its imports still running (counted on the import index)
  const [row] = await em.query(
    `SELECT (SELECT COUNT(*) FROM performance_sample WHERE unitId = ?)
          - (SELECT COUNT(*) FROM performance_sample WHERE importId IN (SELECT i.id FROM data_import i WHERE i.unitId = ? AND i.status IN ('checking', 'importing'))) AS n`,
    [unitId, unitId],
  );
  const count = Number(row.n);
  return { count, first: count ? await endSampleTime(em, unitId, 'ASC') : null, last: count ? await endSampleTime(em, unitId, 'DESC') : null };
}

export function lastSampleTimeOfUnit(em: EntityManager, unitId: string): Promise<string | null> {
  return endSampleTime(em, unitId, 'DESC');
}

export async function countSamplesOfUnit(em: EntityManager, unitId: string): Promise<number> {
  const [row] = await em.query('SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ?', [unitId]);
  return Number(row.n);
}

/** The columns a chart of hourly points may draw. */
export type ChartColumn = (typeof SAMPLE_COLUMNS)[number];

export interface ChartPointRow {
  ts: Date | string;
  /** whether the point passed the import's and the model's checks (sample-validity.ts) */
  passedChecks: boolean;
  values: Partial<Record<ChartColumn, number | null>>;
}

/** A unit's samples in [fromUtc, toUtc), in time order, with the given columns only (rows of complete imports). */
export async function chartPointsOfUnit(
  em: EntityManager,
  unitId: string,
  columns: readonly ChartColumn[],
  fromUtc: string,
  toUtc: string,
): Promise<ChartPointRow[]> {
  const rows: Record<string, unknown>[] = await em.query(
    `SELECT timestampUtc AS ts, ${PASSED_CHECKS_SQL} AS passedChecks, ${columns.join(', ')} FROM performance_sample
      WHERE unitId = ? AND timestampUtc >= ? AND timestampUtc < ? AND ${SHOWN_SAMPLE_SQL} ORDER BY timestampUtc`,
    [unitId, fromUtc, toUtc, unitId],
  );
  return rows.map((r) => ({
    ts: r.ts as Date | string,
    passedChecks: Number(r.passedChecks) === 1,
    values: Object.fromEntries(columns.map((c) => [c, r[c] === null ? null : Number(r[c])])),
  }));
}

/** The measured values a stored row is compared on when the same time is imported again. */
export interface StoredReading {
  ts: Date;
  loadMw: number;
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
}

/** The first and last time (ms) of the unit's rows stored by other imports than the given one; null when there are none. */
export async function storedSpanBesides(em: EntityManager, unitId: string, importId: string): Promise<{ first: number; last: number } | null> {
  const [row] = await em.query('SELECT MIN(timestampUtc) AS first, MAX(timestampUtc) AS last FROM performance_sample WHERE unitId = ? AND importId <> ?', [
    unitId,
    importId,
  ]);
  return row?.first ? { first: new Date(row.first).getTime(), last: new Date(row.last).getTime() } : null;
}

export function storedReadingsBetween(em: EntityManager, unitId: string, from: Date, to: Date): Promise<StoredReading[]> {
  return em.query(
    'SELECT timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s FROM performance_sample WHERE unitId = ? AND timestampUtc BETWEEN ? AND ?',
    [unitId, from, to],
  );
}

const INSERT_COLUMNS = LOADED_COLUMNS;

/** Stores checked rows of one import in one statement. */
export async function insertSamples(em: EntityManager, owner: SampleOwner, samples: readonly ImportSample[]): Promise<void> {
  if (samples.length === 0) return;
  const row = (s: ImportSample): Record<(typeof INSERT_COLUMNS)[number], unknown> => ({
    unitId: owner.unitId,
    importId: owner.importId,
    timestampUtc: new Date(s.timestampUtc),
    loadMw: s.loadMw,
    backpressureKpa: s.backpressureKpa,
    cwInletC: s.cwInletC,
    cwOutletC: s.cwOutletC,
    cwFlowM3s: s.cwFlowM3s,
    flowAssumed: s.flowAssumed,
    hotwellC: s.hotwellC ?? null,
    dissolvedOxygenPpb: s.dissolvedOxygenPpb ?? null,
    airRemovalKgS: s.airRemovalKgS ?? null,
    barometerKpa: s.barometerKpa ?? null,
    cwDifferentialPressureKpa: s.cwDifferentialPressureKpa ?? null,
    condensateFlowKgS: s.condensateFlowKgS ?? null,
    validity: s.validity,
    setupVersion: owner.setupVersion,
  });
  const values = samples.flatMap((s) => {
    const r = row(s);
    return INSERT_COLUMNS.map((c) => r[c]);
  });
  await em.query(
    `INSERT INTO performance_sample (${INSERT_COLUMNS.join(', ')}) VALUES ${samples.map(() => `(${INSERT_COLUMNS.map(() => '?').join(',')})`).join(',')}`,
    values,
  );
}

/** Removes every row an import stored (undo, a failed or restarted import). */
export async function deleteSamplesOfImport(em: EntityManager, importId: string): Promise<void> {
  await em.query('DELETE FROM performance_sample WHERE importId = ?', [importId]);
}
