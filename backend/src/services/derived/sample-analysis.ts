/**
 * Step 5 of the recompute: each re-analysable sample's analysis with its day's trend cleanliness
 * (shared/domain/monitoring/sample-analysis.ts), or the reason the model rejects it.
 */
import { analyseSample, type UnitModel } from '@shared/domain/monitoring/index.js';
import { PointRejectedError } from '@shared/domain/validity/index.js';
import type { AnalysedSample } from '../../repositories/sample-analysis.repository.js';
import { modelRejection } from '../../repositories/sample-validity.js';
import { trendCleanlinessOn, type CycleTrend } from './fouling-cycles.js';
import type { StoredSample } from './read-valid-samples.js';

export interface SampleAnalysisInput {
  model: UnitModel;
  dayOf: (ts: number) => string;
  pluggedTubesOn: (day: string) => number;
  cycles: CycleTrend[];
}

export function analyseSamples({ model, dayOf, pluggedTubesOn, cycles }: SampleAnalysisInput, rows: readonly StoredSample[]): AnalysedSample[] {
  return rows.map((r) => {
    const day = dayOf(new Date(r.ts).getTime());
    try {
      return { id: r.id, validity: 'ok', analysis: analyseSample(model, r, pluggedTubesOn(day), trendCleanlinessOn(cycles, day)) };
    } catch (err) {
      return { id: r.id, validity: modelRejection(err instanceof PointRejectedError ? err.reason : null), analysis: null };
    }
  });
}
