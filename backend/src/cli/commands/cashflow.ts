/** `calc cashflow`: NPV, IRR, simple and discounted payback of yearly cash flows (ENGINEERING.md §7, contract §8). */
import type { CalcCommand } from '../run-calc.js';
import { calcCashflowInput, calcCashflowOutput, type CalcCashflowOutput } from '@shared/schemas/calc-cashflow.js';
import { discountedPaybackYears, irr, npv, paybackYears, toCents } from '@shared/domain/decision/economics/cash-flow-metrics.js';

const round = (x: number | null, places: number): number | null => (x === null ? null : Number(x.toFixed(places)));

const command: CalcCommand = {
  input: calcCashflowInput,
  output: calcCashflowOutput,
  run(input: unknown): CalcCashflowOutput {
    const v = calcCashflowInput.parse(input);
    const r = irr(v.cashflows);
    return {
      npv: toCents(npv(v.rate, v.cashflows)),
      irr: r.irr === null ? null : Number(r.irr.toDecimalPlaces(10).toString()),
      paybackYears: round(paybackYears(v.cashflows), 6),
      discountedPaybackYears: round(discountedPaybackYears(v.rate, v.cashflows), 6),
      ...(r.reason ? { warnings: [`irr: ${r.reason}`] } : {}),
    };
  },
};

export default command;
