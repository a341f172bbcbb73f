/** The case's results: the shared schedule calculation of its inputs, with a readable refusal when it cannot run. */
import { runScheduleCommand } from '@shared/domain/decision/schedule/schedule-command.js';
import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule.js';
import { AppError } from '../../http/app-error.js';

export function calculateCase(inputs: CalcScheduleInput, status: 400 | 409, lead: string): CalcScheduleOutput {
  try {
    return runScheduleCommand(inputs);
  } catch (err) {
    throw new AppError(status, `${lead}: ${err instanceof Error ? err.message : String(err)}`);
  }
}
