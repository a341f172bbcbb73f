/**
 * Step 5 of the recompute: each re-analysable sample's analysis with its day's trend cleanliness
 * (shared/domain/monitoring/sample-analysis.ts), or the reason the model rejects it. Every sample, analysed or
 * not, goes to the day's figures with the values written back, so they need not be read again.
 */
import { analyseSample, type UnitModel } from '@shared/domain/monitoring/index.js';
import { PointRejectedError } from '@shared/domain/validity/index.js';
import { ANALYSIS_COLUMNS, type AnalysedSample } from '../../repositories/sample-analysis.repository.js';
import { modelRejection, reanalysable } from '../../repositories/sample-validity.js';
import type { DailyAccumulator } from './daily-aggregates.js';
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

/** An analysis as the table holds it once written: every column, null where the model rejected the point or a value is not finite. */
function asStored(analysis: AnalysedSample['analysis']): Record<(typeof ANALYSIS_COLUMNS)[number], number | null> {
  const out = {} as Record<(typeof ANALYSIS_COLUMNS)[number], number | null>;
  for (const c of ANALYSIS_COLUMNS) {
    const v = analysis?.[c];
    out[c] = v !== undefined && Number.isFinite(v) ? v : null;
  }
  return out;
}

/**
 * Analyses the re-analysable samples of each chunk (every sample of the unit, in id order) and adds every sample to
 * the day's figures as it will be stored; yields the analyses to write back.
 */
export async function* analyseAndGather(
  input: SampleAnalysisInput,
  chunks: AsyncIterable<StoredSample[]>,
  daily: DailyAccumulator,
): AsyncGenerator<AnalysedSample[]> {
  for await (const rows of chunks) {
    const analysed = analyseSamples(
      input,
      rows.filter((r) => reanalysable(r.validity)),
    );
    let k = 0;
    for (const r of rows) {
      if (!reanalysable(r.validity)) daily.add(r);
      else {
        const a = analysed[k++]!; // one analysis per re-analysable row, in order
        daily.add({ ...r, ...asStored(a.analysis), validity: a.validity });
      }
    }
    yield analysed;
  }
}
