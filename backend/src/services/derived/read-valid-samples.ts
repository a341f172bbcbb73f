/**
 * Step 1 of the recompute: the unit's re-analysable samples, read in id order in chunks so memory stays bounded;
 * and every sample with the same columns, for the pass that analyses them and gathers the daily figures.
 */
import type { DataSource } from 'typeorm';
import { reanalysableSamplesAfter, samplesAfter, type StoredSample } from '../../repositories/sample-analysis.repository.js';

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

const READ = ['loadMw', 'backpressureKpa', 'cwInletC', 'cwOutletC', 'cwFlowM3s', 'hotwellC', 'dissolvedOxygenPpb', 'airRemovalKgS', 'validity'] as const;

/** Every sample of the unit (re-analysable or not) in id order, in chunks. */
export async function* readEverySample(ds: DataSource, unitId: string): AsyncGenerator<StoredSample[]> {
  let lastId = '0';
  for (;;) {
    const rows = (await samplesAfter(ds.manager, unitId, lastId, CHUNK, READ)) as unknown as StoredSample[];
    if (rows.length === 0) return;
    lastId = String(rows[rows.length - 1]!.id); // rows is not empty here
    yield rows;
  }
}
