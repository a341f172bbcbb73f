/**
 * Step 6 of the recompute: writes each chunk of analysed samples back to `performance_sample` through a
 * temporary table on one connection (one joined UPDATE per chunk), stamped with the setup version used.
 */
import type { DataSource } from 'typeorm';
import { ANALYSIS_COLUMNS, type AnalysedSample } from './sample-analysis.js';

export interface WriteBackInput {
  setupVersion: number;
  chunks: AsyncIterable<AnalysedSample[]>;
  /** after each chunk, with the samples written so far */
  onChunk?: (written: number) => Promise<void>;
}

const COLUMNS = ['validity', ...ANALYSIS_COLUMNS] as const;

export async function writeBackAnalyses(ds: DataSource, { setupVersion, chunks, onChunk }: WriteBackInput): Promise<number> {
  const runner = ds.createQueryRunner();
  await runner.connect();
  let written = 0;
  try {
    await runner.query(`CREATE TEMPORARY TABLE IF NOT EXISTS derived_update (id bigint PRIMARY KEY, validity varchar(32) NOT NULL, ${ANALYSIS_COLUMNS.map((c) => `${c} double NULL`).join(', ')}) ENGINE=MEMORY`);
    for await (const analysed of chunks) {
      if (analysed.length === 0) continue;
      const values: unknown[] = [];
      for (const s of analysed) values.push(s.id, s.validity, ...ANALYSIS_COLUMNS.map((c) => s.analysis?.[c] ?? null));
      await runner.query('TRUNCATE TABLE derived_update');
      await runner.query(`INSERT INTO derived_update (id, ${COLUMNS.join(', ')}) VALUES ${analysed.map(() => `(?,${COLUMNS.map(() => '?').join(',')})`).join(',')}`, values);
      await runner.query(`UPDATE performance_sample s JOIN derived_update d ON d.id = s.id SET ${COLUMNS.map((c) => `s.${c} = d.${c}`).join(', ')}, s.setupVersion = ?`, [setupVersion]);
      written += analysed.length;
      await onChunk?.(written);
    }
    await runner.query('DROP TEMPORARY TABLE IF EXISTS derived_update');
  } finally {
    await runner.release();
  }
  return written;
}

/** Without a complete setup nothing is analysed: the analysis columns that carry figures are cleared. */
export async function clearAnalyses(ds: DataSource, unitId: string): Promise<void> {
  await ds.query(`UPDATE performance_sample SET cleanliness = NULL, ttdK = NULL, expectedBackpressureKpa = NULL, excessBackpressureKpa = NULL, foulingCostPerHour = NULL WHERE unitId = ?`, [unitId]);
}
