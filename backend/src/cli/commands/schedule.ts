/** `calc schedule`: the shared schedule calculation (shared/domain/decision/schedule/schedule-command.ts). */
import type { CalcCommand } from '../run-calc.js';
import { runScheduleFromJson } from '@shared/domain/decision/schedule/schedule-command.js';

const command: CalcCommand = { run: runScheduleFromJson };

export default command;
