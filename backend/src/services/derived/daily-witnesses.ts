/**
 * Step 2 of the recompute: measured cleanliness per plant-local day (median of the day's plausible points) and
 * the day's air in-leakage witnesses (hotwell subcooling, dissolved oxygen, air removal). A point the model
 * finds implausible (cleanliness, tube velocity, expected backpressure) stays out of the medians; the
 * per-sample analysis records why. A design point outside the range a condenser may read leaves every point
 * out, so no day and no trend either.
 */
import { designPointKpa, plausibleCondenserPoint, type UnitModel } from '@shared/domain/monitoring/index.js';
import { median } from '@shared/domain/statistics.js';
import type { StoredSample } from './read-valid-samples.js';

export interface DayWitness {
  cf: number[];
  subcooling: number[];
  oxygen: number[];
  air: number[];
}

export interface DailyCleanliness {
  /** plant-local days with at least one plausible point, ascending */
  days: string[];
  perDay: Map<string, DayWitness>;
  /** median measured cleanliness per day */
  dailyCleanliness: Map<string, number>;
}

export interface DailyCleanlinessInput {
  model: UnitModel;
  dayOf: (ts: number) => string;
  pluggedTubesOn: (day: string) => number;
  samples: AsyncIterable<StoredSample[]> | Iterable<StoredSample[]>;
}

export function designPointInRange(model: UnitModel): boolean {
  try {
    designPointKpa(model);
    return true;
  } catch {
    return false;
  }
}

export async function measureDailyCleanliness({ model, dayOf, pluggedTubesOn, samples }: DailyCleanlinessInput): Promise<DailyCleanliness> {
  const perDay = new Map<string, DayWitness>();
  for await (const rows of designPointInRange(model) ? samples : []) {
    for (const r of rows) {
      const day = dayOf(new Date(r.ts).getTime());
      try {
        const p = plausibleCondenserPoint(model, r, pluggedTubesOn(day));
        let w = perDay.get(day);
        if (!w) perDay.set(day, (w = { cf: [], subcooling: [], oxygen: [], air: [] }));
        w.cf.push(p.cleanliness);
        if (r.hotwellC !== null) w.subcooling.push(p.saturationC - r.hotwellC);
        if (r.dissolvedOxygenPpb !== null) w.oxygen.push(r.dissolvedOxygenPpb);
        if (r.airRemovalKgS !== null) w.air.push(r.airRemovalKgS);
      } catch {
        // rejected by the model: the per-sample analysis records the reason
      }
    }
  }
  const days = [...perDay.keys()].sort();
  const dailyCleanliness = new Map<string, number>();
  for (const day of days) dailyCleanliness.set(day, median(perDay.get(day)!.cf)!);
  return { days, perDay, dailyCleanliness };
}

/** The day's witness medians (null where a witness was not measured that day). */
export function witnessMedians(
  measured: DailyCleanliness,
  day: string,
): { subcoolingK: number | null; dissolvedOxygenPpb: number | null; airRemovalKgS: number | null } {
  const w = measured.perDay.get(day);
  return { subcoolingK: w ? median(w.subcooling) : null, dissolvedOxygenPpb: w ? median(w.oxygen) : null, airRemovalKgS: w ? median(w.air) : null };
}
