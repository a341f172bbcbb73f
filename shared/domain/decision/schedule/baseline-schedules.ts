/** Baselines a proposed schedule is compared with. */
import type { PlannedCleaning, ScheduleProblem } from './schedule-problem.js';

export type BaselinePolicy =
  | { kind: 'never' }
  /** one cleaning with the given method at the start of the first planned outage it fits in */
  | { kind: 'next-planned-outage'; methodId: string }
  /** a cleaning with the given method at the start of every planned outage it fits in */
  | { kind: 'every-planned-outage'; methodId: string }
  | { kind: 'fixed'; cleanings: PlannedCleaning[] };

/** Planned outages as [first, last] day ranges. */
export function plannedOutageRanges(plannedOutage: Uint8Array, days: number): { fromDay: number; toDay: number }[] {
  const out: { fromDay: number; toDay: number }[] = [];
  for (let d = 0; d < days; d++) {
    if (!plannedOutage[d]) continue;
    const from = d;
    while (d + 1 < days && plannedOutage[d + 1]) d++;
    out.push({ fromDay: from, toDay: d });
  }
  return out;
}

export function baselineCleanings(problem: ScheduleProblem, policy: BaselinePolicy): PlannedCleaning[] {
  if (policy.kind === 'never') return [];
  if (policy.kind === 'fixed') return [...policy.cleanings];
  const method = problem.methods.find((m) => m.id === policy.methodId);
  if (!method) throw new Error(`unknown baseline method "${policy.methodId}"`);
  const fitting = plannedOutageRanges(problem.plannedOutage, problem.days)
    .filter((r) => r.toDay - r.fromDay + 1 >= method.durationDays)
    .map((r) => ({ startDay: r.fromDay, methodId: method.id }));
  return policy.kind === 'next-planned-outage' ? fitting.slice(0, 1) : fitting;
}
