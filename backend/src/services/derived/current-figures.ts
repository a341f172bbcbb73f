/**
 * The unit's figures now, as the health view's headline states them, drawn by the recompute from the stored
 * daily figures and stored with the analysis so the portfolio reads every unit's in one statement: the last
 * day's median cleanliness, the means of the last 7 days with valid data (backpressure excess, fouling cost)
 * and the fouling cost summed since the last cleaning.
 */
import type { DailyFigure } from '@shared/schemas/health.js';
import type { StoredCurrentFigures } from '@shared/schemas/unit-analysis.js';

const mean = (values: (number | null)[]) => {
  const v = values.filter((x): x is number => x !== null && Number.isFinite(x));
  return v.length ? v.reduce((a, b) => a + b, 0) / v.length : null;
};

/** Cleanings as the health view reads them: the day each ended. */
export interface CleaningDay {
  startDate: string;
  endDate: string | null;
}

/** The current figures from the daily figures in day order and the unit's cleanings in date order; null without valid data. */
export function currentFigures(days: readonly DailyFigure[], cleanings: readonly CleaningDay[]): StoredCurrentFigures | null {
  const withData = days.filter((d) => d.pointsUsed > 0);
  const last = withData.at(-1);
  if (!last) return null;
  const lastCleaning = cleanings.filter((e) => (e.endDate ?? e.startDate) <= last.day).at(-1) ?? null;
  const cleanedOn = lastCleaning ? (lastCleaning.endDate ?? lastCleaning.startDate) : null;
  const sinceCleaning = withData.filter((d) => !cleanedOn || d.day >= cleanedOn);
  const lastWeek = withData.slice(-7);
  return {
    asOf: last.day,
    cleanliness: last.medianCleanliness,
    excessBackpressureKpa: mean(lastWeek.map((d) => d.meanExcessBackpressureKpa)),
    foulingCostPerDay: mean(lastWeek.map((d) => d.foulingCost)),
    foulingCostSinceCleaning: sinceCleaning.reduce((a, d) => a + (d.foulingCost ?? 0), 0),
    lastCleaningDate: cleanedOn,
    airLeakSuspectedDaysInLastWeek: lastWeek.filter((d) => d.airLeakSuspected).length,
  };
}
