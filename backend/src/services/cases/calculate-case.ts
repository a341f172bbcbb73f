/** The case's results: the shared schedule calculation of its inputs, with a readable refusal when it cannot run. */
import { runScheduleCommand } from '@shared/domain/decision/schedule/schedule-command.js';
import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule.js';
import { AppError } from '../../http/app-error.js';

/**
 * The most Monte Carlo trial-days one request may ask for. Measured with the schedule calculation on this
 * machine (2 shared cores, load ≈ 9): 5,000 trials × 730 days (the prefill) ≈ 0.8–1.6 s with 5 or 12 methods;
 * 20,000 × 1,000 ≈ 3.0–3.3 s; 20,000 × 1,830 ≈ 5.9 s with 1 method, 8.5 s with 12. The time follows trials ×
 * days; the methods (at most 12, by the input schema) add under a third, so the bound counts trial-days and
 * leaves that margin. The prefill (3.65 million) is under a fifth of it.
 */
export const MAX_TRIAL_DAYS = 20_000_000;

const grouped = (n: number) => n.toLocaleString('en-GB');

/** Null when the calculation is small enough for one request, else the sentence saying how to shrink it. */
export function tooMuchWork(inputs: CalcScheduleInput): string | null {
  const trials = inputs.uncertainty?.trials ?? 5000;
  const trialDays = trials * inputs.horizonDays;
  if (trialDays <= MAX_TRIAL_DAYS) return null;
  const maxTrials = Math.floor(MAX_TRIAL_DAYS / inputs.horizonDays);
  return (
    `${grouped(trials)} Monte Carlo trials over a ${grouped(inputs.horizonDays)}-day horizon is more than one calculation may take ` +
    `(trials × horizon days at most ${grouped(MAX_TRIAL_DAYS)}): use at most ${grouped(Math.min(maxTrials, trials))} trials for this horizon, or shorten the horizon`
  );
}

export function calculateCase(inputs: CalcScheduleInput, status: 400 | 409, lead: string): CalcScheduleOutput {
  const tooMuch = tooMuchWork(inputs);
  if (tooMuch) throw new AppError(status, `${lead}: ${tooMuch}`);
  try {
    return runScheduleCommand(inputs);
  } catch (err) {
    throw new AppError(status, `${lead}: ${err instanceof Error ? err.message : String(err)}`);
  }
}
