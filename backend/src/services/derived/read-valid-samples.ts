/** Step 1 of the recompute: the unit's re-analysable samples, read in id order in chunks so memory stays bounded. */
import type { DataSource } from 'typeorm';
import { REANALYSABLE_SAMPLE_SQL } from '../../repositories/sample-validity.js';

const CHUNK = 5_000;

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

export async function* readValidSamples(ds: DataSource, unitId: string): AsyncGenerator<StoredSample[]> {
  let lastId = '0';
  for (;;) {
    const rows: StoredSample[] = await ds.query(
      `SELECT id, timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s, hotwellC, dissolvedOxygenPpb, airRemovalKgS, validity
         FROM performance_sample WHERE unitId = ? AND id > ? AND ${REANALYSABLE_SAMPLE_SQL} ORDER BY id LIMIT ${CHUNK}`,
      [unitId, lastId],
    );
    if (rows.length === 0) return;
    lastId = String(rows[rows.length - 1].id);
    yield rows;
  }
}

export async function countSamples(ds: DataSource, unitId: string): Promise<number> {
  return Number((await ds.query(`SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ?`, [unitId]))[0].n);
}
