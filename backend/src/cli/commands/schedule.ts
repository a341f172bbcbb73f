/** `calc schedule`: the shared schedule calculation (shared/domain/decision/schedule/schedule-command.ts). */
import type { CalcCommand } from '../run-calc.js';
import { runScheduleFromJson } from '@shared/domain/decision/schedule/schedule-command.js';
import { calcScheduleInput, calcScheduleOutput } from '@shared/schemas/calc-schedule.js';

const command: CalcCommand = { input: calcScheduleInput, output: calcScheduleOutput, run: runScheduleFromJson };

export default command;
