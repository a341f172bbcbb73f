import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import { costVersusInterval, optimalInterval, type IntervalCurvePoint, type IntervalOptimum } from '@shared/domain/decision/interval/cleaning-interval';
import { resolveMethod } from './method-inputs';

export type IntervalCurve =
  { ok: true; methodName: string; cycleDays: number; from: string; points: IntervalCurvePoint[]; optimum: IntervalOptimum } | { ok: false; reason: string };

/**
 * Average cost per day against the cleaning interval, for repeating the schedule's first cleaning: the fouling
 * cost per day is the case's own daily path after that cleaning (its seasons and prices on those days), the
 * cleaning and downtime cost that cleaning's. The shared interval calculation (ENGINEERING.md §6) does the
 * rest; the curve covers only as many days as that cycle lasts in the schedule.
 */
export function intervalCurve(results: CalcScheduleOutput, inputs: CalcScheduleInput): IntervalCurve {
  const first = results.cleanings[0];
  if (!first) return { ok: false, reason: 'The recommended schedule has no cleaning, so there is no cycle to repeat.' };
  const daily = results.daily ?? [];
  const start = daily.findIndex((d) => d.date > first.endDate);
  const next = results.cleanings[1];
  const stop = next ? daily.findIndex((d) => d.date >= next.date) : daily.length;
  const cycleDays = start < 0 ? [] : daily.slice(start, stop < 0 ? daily.length : stop);
  const costPerDay = cycleDays.map((d) => d.foulingCost);
  const [cycleStart] = cycleDays;
  if (!cycleStart || costPerDay.length < 14)
    return { ok: false, reason: 'The cycle after the first cleaning is shorter than two weeks in this schedule: too short to draw.' };
  const method = inputs.methods.map(resolveMethod).find((m) => m?.id === first.methodId);
  const cycle = {
    cleaningCost: first.cleaningCost,
    downtimeCost: first.downtimeCost,
    // days without fouling cost: the unit is off line while an outage method runs
    downtimeDays: method?.unitDuringCleaning === 'outage' ? method.durationDays : 0,
    penalty: { model: 'tabulated' as const, costPerDay },
  };
  try {
    const points = costVersusInterval(cycle, costPerDay.length - 1, costPerDay.length > 200 ? 2 : 1);
    return { ok: true, methodName: first.methodName, cycleDays: costPerDay.length, from: cycleStart.date, points, optimum: optimalInterval(cycle) };
  } catch (error) {
    return { ok: false, reason: error instanceof Error ? error.message : 'The interval could not be computed.' };
  }
}
