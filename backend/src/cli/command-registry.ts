/** Every calculation command, shared by the CLI (`npm run calc`) and the REST calculation API. */
import type { CalcCommand } from './run-calc.js';
import cashflow from './commands/cashflow.js';
import condenserPoint from './commands/condenser-point.js';
import foulingFit from './commands/fouling-fit.js';
import interval from './commands/interval.js';
import penalty from './commands/penalty.js';
import saturation from './commands/saturation.js';
import schedule from './commands/schedule.js';

export const CALC_COMMANDS: Record<string, CalcCommand> = {
  saturation,
  'condenser-point': condenserPoint,
  penalty,
  interval,
  cashflow,
  'fouling-fit': foulingFit,
  schedule,
};
