/**
 * The recompute's statements on `performance_sample`: the samples it reads in id order, chunk by chunk, and
 * the per-sample analysis it writes back. Which rows are read is decided in sample-validity.ts.
 */
import { Readable } from 'node:stream';
import type { EntityManager } from 'typeorm';
import type { SampleAnalysis } from '@shared/domain/monitoring/index.js';
import type { PerformanceSample } from '../entities/performance-sample.entity.js';
import { loadedNumber, loadStatement } from './sample-bulk-load.repository.js';
import { REANALYSABLE_SAMPLE_SQL } from './sample-validity.js';

/** A stored sample as the model reads it. */
export interface StoredSample {
  id: string;
  ts: Date;
  loadMw: number;
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
  hotwellC: number | null;
  dissolvedOxygenPpb: number | null;
  airRemovalKgS: number | null;
  validity: string;
}

/** The next chunk of a unit's re-analysable samples after the given id. */
export function reanalysableSamplesAfter(em: EntityManager, unitId: string, afterId: string, limit: number): Promise<StoredSample[]> {
  return em.query(
    `SELECT id, timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s, hotwellC, dissolvedOxygenPpb, airRemovalKgS, validity
       FROM performance_sample WHERE unitId = ? AND id > ? AND ${REANALYSABLE_SAMPLE_SQL} ORDER BY id LIMIT ${Number(limit)}`,
    [unitId, afterId],
  );
}

export type SampleColumn = keyof Omit<PerformanceSample, 'unit' | 'id' | 'timestampUtc'>;

/** The next chunk of all a unit's samples after the given id: id, time (`ts`) and the given columns. */
export function samplesAfter<C extends SampleColumn>(
  em: EntityManager,
  unitId: string,
  afterId: string,
  limit: number,
  columns: readonly C[],
): Promise<({ id: string; ts: Date | string } & Record<C, unknown>)[]> {
  return em.query(
    `SELECT id, timestampUtc AS ts, ${columns.join(', ')} FROM performance_sample WHERE unitId = ? AND id > ? ORDER BY id LIMIT ${Number(limit)}`,
    [unitId, afterId],
  );
}

/** The analysis columns of `performance_sample` the recompute writes, besides `validity`. */
export const ANALYSIS_COLUMNS = [
  'cleanliness',
  'ttdK',
  'dutyMw',
  'expectedBackpressureKpa',
  'excessBackpressureKpa',
  'foulingKpa',
  'cwInletKpa',
  'cwFlowKpa',
  'loadKpa',
  'pluggingKpa',
  'unexplainedKpa',
  'heatRatePenaltyPct',
  'foulingCostPerHour',
  'unexplainedCostPerHour',
] as const satisfies readonly (keyof SampleAnalysis & keyof PerformanceSample)[];

export type AnalysisColumn = (typeof ANALYSIS_COLUMNS)[number];

export interface AnalysedSample {
  id: string;
  /** `ok`, or `model:<reason>` when the model rejected the point */
  validity: string;
  /** null where the model rejected the point */
  analysis: Pick<SampleAnalysis, AnalysisColumn> | null;
}

const WRITTEN = ['validity', ...ANALYSIS_COLUMNS] as const;

/**
 * Analyses are written through a temporary table, loaded with LOAD DATA and joined in one UPDATE per chunk:
 * `em` must stay on one connection (a query runner's manager) from openAnalysisScratch to closeAnalysisScratch.
 */
export async function openAnalysisScratch(em: EntityManager): Promise<void> {
  await em.query(
    `CREATE TEMPORARY TABLE IF NOT EXISTS derived_update (id bigint PRIMARY KEY, validity varchar(32) NOT NULL, ${ANALYSIS_COLUMNS.map((c) => `${c} double NULL`).join(', ')}) ENGINE=MEMORY`,
  );
}

const LOAD_ANALYSES_SQL = `LOAD DATA LOCAL INFILE 'analyses.tsv' INTO TABLE derived_update CHARACTER SET utf8mb4
  FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n' (id, ${WRITTEN.join(', ')})`;

/** One analysed sample as a loaded line (a validity is a reason code: no tab, newline or backslash). */
function analysisLine(s: AnalysedSample): string {
  let line = `${s.id}\t${s.validity}`;
  for (const c of ANALYSIS_COLUMNS) line += `\t${loadedNumber(s.analysis?.[c])}`;
  return `${line}\n`;
}

/** Writes one chunk of analyses, stamped with the setup version they were made with. */
export async function writeAnalyses(em: EntityManager, analysed: readonly AnalysedSample[], setupVersion: number): Promise<void> {
  if (analysed.length === 0) return;
  await em.query('TRUNCATE TABLE derived_update');
  const body = Buffer.from(analysed.map(analysisLine).join(''), 'utf8');
  const loaded = await loadStatement(em, LOAD_ANALYSES_SQL, () => Readable.from([body]));
  if (loaded.affectedRows !== analysed.length || loaded.warningStatus !== 0)
    throw new Error(`the recompute could write ${loaded.affectedRows} of ${analysed.length} analyses`);
  await em.query(
    `UPDATE performance_sample s JOIN derived_update d ON d.id = s.id SET ${WRITTEN.map((c) => `s.${c} = d.${c}`).join(', ')}, s.setupVersion = ?`,
    [setupVersion],
  );
}

export async function closeAnalysisScratch(em: EntityManager): Promise<void> {
  await em.query('DROP TEMPORARY TABLE IF EXISTS derived_update');
}

/** Without a complete setup nothing is analysed: the analysis columns that carry figures are cleared. */
export async function clearAnalysesOfUnit(em: EntityManager, unitId: string): Promise<void> {
  await em.query(
    `UPDATE performance_sample SET cleanliness = NULL, ttdK = NULL, expectedBackpressureKpa = NULL, excessBackpressureKpa = NULL, foulingCostPerHour = NULL WHERE unitId = ?`,
    [unitId],
  );
}
