/** Builders of small scheduling problems for the decision-engine tests. */
import { tableFromCostCurve } from '@shared/domain/decision/schedule/penalty-cost-table.js';
import type { PlannedCleaning, ScheduleMethod, ScheduleProblem } from '@shared/domain/decision/schedule/schedule-problem.js';
import { mayStart } from '@shared/domain/decision/schedule/schedule-problem.js';
import { priceSchedule } from '@shared/domain/decision/schedule/schedule-pricing.js';
import { baseScenario } from '@shared/domain/decision/schedule/schedule-problem.js';

export function smallProblem(overrides: Partial<ScheduleProblem> = {}, days = 40): ScheduleProblem {
  // Penalty rising steeply as cleanliness falls, with a seasonal factor so days differ.
  const table = tableFromCostCurve(
    days,
    [
      { cleanliness: 0.4, costPerDay: 30_000 },
      { cleanliness: 0.6, costPerDay: 12_000 },
      { cleanliness: 0.8, costPerDay: 3_000 },
      { cleanliness: 1.0, costPerDay: 0 },
    ],
    (d) => 1 + 0.5 * Math.sin(d / 6),
  );
  const methods: ScheduleMethod[] = [
    {
      id: 'outage-wash',
      cleaningCost: 20_000,
      durationDays: 2,
      unitDuringCleaning: 'outage',
      deratePct: 0,
      recoveredCleanliness: 0.92,
      foulingRateMultiplier: 1,
    },
    {
      id: 'derate-brush',
      cleaningCost: 8_000,
      durationDays: 3,
      unitDuringCleaning: 'derate',
      deratePct: 50,
      recoveredCleanliness: 0.85,
      foulingRateMultiplier: 1.2,
    },
  ];
  const plannedOutage = new Uint8Array(days);
  for (let d = 20; d <= 23; d++) plannedOutage[d] = 1;
  return {
    days,
    table,
    lostGeneration: {
      ratingMw: 10,
      loadFraction: new Float64Array(days).fill(1),
      replacementPricePerMwh: new Float64Array(days).fill(80),
      ownFuelCostPerMwh: new Float64Array(days).fill(30),
      ownCo2CostPerMwh: new Float64Array(days).fill(5),
    },
    fouling: { model: 'linear', ratePerDay: 0.02 },
    initial: { daysSinceCleaning: 10, cleanlinessAfterCleaning: 0.9, foulingRateMultiplier: 1 },
    methods,
    plannedOutage,
    minSpacingDays: 6,
    discountRate: 0.08,
    yearIndex: new Int32Array(days).map((_, d) => Math.floor(d / 15)),
    referenceCleanliness: 0.92,
    ...overrides,
  };
}

/** Every feasible schedule (windows, spacing, no overlap), by plain recursion. */
export function allSchedules(problem: ScheduleProblem): PlannedCleaning[][] {
  const out: PlannedCleaning[][] = [];
  const walk = (from: number, lastStart: number, chosen: PlannedCleaning[]) => {
    out.push(chosen);
    for (let e = from; e < problem.days; e++) {
      if (e - lastStart < problem.minSpacingDays) continue;
      for (const m of problem.methods) {
        if (!mayStart(problem, m, e)) continue;
        walk(e + m.durationDays, e, [...chosen, { startDay: e, methodId: m.id }]);
      }
    }
  };
  walk(0, -problem.initial.daysSinceCleaning, []);
  return out;
}

export function bruteForceBest(problem: ScheduleProblem): { cost: number; cleanings: PlannedCleaning[]; count: number } {
  const scenario = baseScenario(problem);
  let best = { cost: Number.POSITIVE_INFINITY, cleanings: [] as PlannedCleaning[] };
  const all = allSchedules(problem);
  for (const s of all) {
    const cost = priceSchedule(problem, s, scenario).discountedTotals.total;
    if (cost < best.cost) best = { cost, cleanings: s };
  }
  return { ...best, count: all.length };
}
