/** Step 1 of the recompute: the unit's re-analysable samples, read in id order in chunks so memory stays bounded. */
import type { DataSource } from 'typeorm';
import { reanalysableSamplesAfter, type StoredSample } from '../../repositories/sample-analysis.repository.js';

export type { StoredSample };

const CHUNK = 5_000;

export async function* readValidSamples(ds: DataSource, unitId: string): AsyncGenerator<StoredSample[]> {
  let lastId = '0';
  for (;;) {
    const rows = await reanalysableSamplesAfter(ds.manager, unitId, lastId, CHUNK);
    if (rows.length === 0) return;
    lastId = String(rows[rows.length - 1]!.id); // rows is not empty here
    yield rows;
  }
}
