/**
 * The fouling forecast with its band: the latest cycle refitted on its stored daily medians (suspected air
 * in-leakage days left out), 120 days ahead of the last day with valid data. It is the costly part of the health
 * view (a nonlinear fit), so the recompute draws it once and stores it with the unit's analysis; the view draws
 * it itself only for an analysis stored before the forecast was.
 */
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date.js';
import { fitFoulingTrend } from '@shared/domain/decision/fouling/fouling-trend.js';
import type { DailyFigure } from '@shared/schemas/health.js';
import type { FoulingCycleSummary, StoredForecast } from '@shared/schemas/unit-analysis.js';

export const FORECAST_DAYS = 120;

/**
 * The forecast after `lastDay` of the latest cycle, from the unit's daily figures in day order; null when the
 * latest cycle has no fitted trend or there is no day with valid data.
 */
export function forecastBand(days: readonly DailyFigure[], latestCycle: FoulingCycleSummary | null | undefined): StoredForecast | null {
  const withData = days.filter((d) => d.pointsUsed > 0);
  const lastDay = withData.at(-1)?.day ?? null;
  if (!lastDay || !latestCycle || latestCycle.status !== 'fitted') return null;
  const start = latestCycle.startDay;
  const points = withData
    .filter((d) => d.day >= start && !d.airLeakSuspected && d.medianCleanliness !== null)
    .map((d) => ({ day: daysBetween(start, d.day), cleanliness: d.medianCleanliness! }));
  const base = { lastDay, cycleStartDay: start };
  let fit: ReturnType<typeof fitFoulingTrend>;
  try {
    fit = fitFoulingTrend({ points, cleanlinessAfterCleaning: latestCycle.cleanlinessAfterCleaning, forecastDays: FORECAST_DAYS });
  } catch {
    return { ...base, status: 'failed', points: [] };
  }
  if (fit.status !== 'fitted') return { ...base, status: 'not-fitted', points: [] };
  const lastOffset = daysBetween(start, lastDay);
  return {
    ...base,
    status: 'fitted',
    bandProbability: fit.bandProbability,
    points: fit.forecast.filter((f) => f.day > lastOffset).map((f) => ({ day: addDays(start, f.day), cleanliness: f.cleanliness, low: f.low, high: f.high })),
  };
}
