/** `calc interval`: optimal interval of a repeating cleaning cycle (ENGINEERING.md §6, contract §8). */
import type { CalcCommand } from '../run-calc.js';
import { calcIntervalInput, calcIntervalOutput, type CalcIntervalOutput } from '@shared/schemas/calc-interval.js';
import { optimalInterval } from '@shared/domain/decision/interval/cleaning-interval.js';
import { toCents } from '@shared/domain/decision/economics/cash-flow-metrics.js';

const command: CalcCommand = {
  input: calcIntervalInput,
  output: calcIntervalOutput,
  run(input: unknown): CalcIntervalOutput {
    const v = calcIntervalInput.parse(input);
    const r = optimalInterval(v);
    return {
      optimalIntervalDays: r.optimalIntervalDays === null ? null : Number(r.optimalIntervalDays.toFixed(6)),
      averageCostPerDay: toCents(r.averageCostPerDay),
      ...(r.reason ? { warnings: [r.reason] } : {}),
    };
  },
};

export default command;
