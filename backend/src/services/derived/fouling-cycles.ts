/**
 * Splits a unit's daily cleanliness into cleaning cycles (a cleaning restarts the trend from its date) and
 * fits the fouling trend of each; gives the trend CF for any day, or undefined where no trend exists.
 */
import { fitFoulingTrend, type FoulingTrendResult } from '@shared/domain/decision/fouling/fouling-trend.js';
import { cleanlinessAfter } from '@shared/domain/decision/fouling/fouling-models.js';
import { daysBetween } from '@shared/domain/calendar/plant-date.js';

export interface CycleTrend {
  startDay: string;
  endDay: string | null;
  result: FoulingTrendResult;
}

export interface CleaningMark {
  /** plant-local date the cleaning ended (the trend restarts from it) */
  date: string;
  cleanlinessAfter: number | null;
}

export function fitCycles(dailyCleanliness: Map<string, number>, cleanings: CleaningMark[], excludedDays: Set<string>): CycleTrend[] {
  const days = [...dailyCleanliness.keys()].sort();
  const firstDay = days[0];
  if (firstDay === undefined) return [];
  const sorted = [...cleanings].sort((a, b) => a.date.localeCompare(b.date));
  const before = sorted.filter((c) => c.date <= firstDay).at(-1);
  const cycles: { start: string; end: string | null; cf0?: number }[] = [];
  let current = { start: before?.date ?? firstDay, cf0: before?.cleanlinessAfter ?? undefined };
  for (const c of sorted.filter((c) => c.date > firstDay)) {
    cycles.push({ ...current, end: c.date });
    current = { start: c.date, cf0: c.cleanlinessAfter ?? undefined };
  }
  cycles.push({ ...current, end: null });

  return cycles.map((cycle) => {
    const points = days
      .filter((d) => d >= cycle.start && (cycle.end === null || d < cycle.end) && !excludedDays.has(d))
      .map((d) => ({ day: daysBetween(cycle.start, d), cleanliness: dailyCleanliness.get(d)! }));
    return { startDay: cycle.start, endDay: cycle.end, result: fitFoulingTrend({ points, cleanlinessAfterCleaning: cycle.cf0, forecastDays: 0 }) };
  });
}

export function trendCleanlinessOn(cycles: CycleTrend[], day: string): number | undefined {
  const cycle = cycles.find((c) => day >= c.startDay && (c.endDay === null || day < c.endDay));
  if (!cycle || cycle.result.status !== 'fitted') return undefined;
  const chosen = cycle.result.chosen;
  return cleanlinessAfter(chosen.model, chosen.cleanlinessAfterCleaning, daysBetween(cycle.startDay, day));
}

/** What the health view needs of a cycle's fit (plain JSON, stored with the unit). */
export function cycleSummary(c: CycleTrend) {
  if (c.result.status !== 'fitted') {
    return {
      startDay: c.startDay,
      endDay: c.endDay,
      status: c.result.status,
      reason: c.result.reason,
      usablePoints: c.result.usablePoints,
      minimumPoints: c.result.minimumPoints,
      minimumSpanDays: c.result.minimumSpanDays,
    };
  }
  const chosen = c.result.chosen;
  return {
    startDay: c.startDay,
    endDay: c.endDay,
    status: 'fitted' as const,
    model: chosen.model,
    cleanlinessAfterCleaning: chosen.cleanlinessAfterCleaning,
    rSquared: chosen.rSquared,
    residualStdCleanliness: chosen.residualStdCleanliness,
    aic: chosen.aic,
    pointsUsed: c.result.pointsUsed,
    outlierDays: c.result.outlierDays.length,
    alternatives: c.result.models.map((m) => ({ model: m.model.model, aic: m.aic, rSquared: m.rSquared })),
  };
}
