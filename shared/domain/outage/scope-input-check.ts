/**
 * Figures the optimiser cannot weigh: an empty or repeated id, a cost, duration, budget or window that is negative or
 * not a number, a benefit that is not a number. The service bounds every typed number before it gets here; this is
 * the last line, so a bad figure gives a sentence instead of a wrong proposal.
 */
import type { ScopeProblem } from './scope-problem.js';
import { quoted } from './scope-wording.js';

export function inputProblems(problem: ScopeProblem): string[] {
  const out: string[] = [];
  const nonNegative = (v: number) => Number.isFinite(v) && v >= 0;
  if (!nonNegative(problem.budget)) out.push('The budget must be a number of zero or more.');
  if (!nonNegative(problem.windowDays)) out.push('The outage window must be a number of days of zero or more.');
  const seen = new Set<string>();
  for (const item of problem.items) {
    const name = item.title ? quoted(item.title) : `The item with id ${quoted(item.id)}`;
    if (!item.id) out.push(`${name} has no id.`);
    else if (seen.has(item.id)) out.push(`The id ${quoted(item.id)} is used by more than one item.`);
    seen.add(item.id);
    if (!nonNegative(item.cost)) out.push(`${name} needs a cost of zero or more.`);
    if (!nonNegative(item.durationDays)) out.push(`${name} needs a duration of zero days or more.`);
    if (!Number.isFinite(item.benefit)) out.push(`${name} needs a benefit that is a number.`);
  }
  return out;
}
