/**
 * Step 3 of the recompute: which days suspect air in-leakage (shared/domain/monitoring/air-leak.ts), judged on
 * the daily cleanliness and witness medians; the judgement restarts at each cleaning.
 */
import { airLeakPeriods, judgeAirLeakDays, type AirLeakDayVerdict, type AirLeakPeriod } from '@shared/domain/monitoring/index.js';
import { witnessMedians, type DailyCleanliness } from './daily-witnesses.js';
import type { CleaningMark } from './fouling-cycles.js';

export interface AirLeakVerdicts {
  verdicts: AirLeakDayVerdict[];
  suspectedDays: Set<string>;
  periods: AirLeakPeriod[];
}

export function judgeAirLeaks(measured: DailyCleanliness, cleanings: readonly CleaningMark[]): AirLeakVerdicts {
  const verdicts = judgeAirLeakDays(
    measured.days.map((day) => ({ day, cleanliness: measured.dailyCleanliness.get(day)!, ...witnessMedians(measured, day) })),
    undefined,
    cleanings.map((c) => c.date),
  );
  return { verdicts, suspectedDays: new Set(verdicts.filter((v) => v.suspected).map((v) => v.day)), periods: airLeakPeriods(verdicts) };
}
