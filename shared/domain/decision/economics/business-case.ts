/**
 * Business case of a proposed cleaning schedule against a baseline (ENGINEERING.md §7): yearly cash flows
 * (fouling savings less extra cleaning and downtime costs), values[0] at t = 0 carrying any up-front cost,
 * NPV, IRR, simple and discounted payback, benefit–cost ratio. Money in decimal.js from here on.
 */
import Decimal from 'decimal.js';
import type { CostTotals } from '../schedule/schedule-pricing.js';
import { benefitCostRatio, discountedPaybackYears, irr, npv, paybackYears } from './cash-flow-metrics.js';

export interface BusinessCaseInput {
  proposedYearly: readonly CostTotals[];
  baselineYearly: readonly CostTotals[];
  discountRate: number;
  /** spent at t = 0 (for example a ball-recirculation system), money; default 0 */
  upfrontCost?: number;
}

export interface BusinessCase {
  /** values[0] at t = 0, values[k] at the end of horizon year k */
  cashflows: Decimal[];
  foulingSavings: Decimal[];
  extraCleaningCosts: Decimal[];
  npv: Decimal;
  irr: Decimal | null;
  irrReason?: string;
  paybackYears: number | null;
  discountedPaybackYears: number | null;
  benefitCostRatio: Decimal | null;
  benefitCostReason?: string;
}

export function businessCase(input: BusinessCaseInput): BusinessCase {
  if (input.proposedYearly.length !== input.baselineYearly.length) throw new Error('the proposal and the baseline must cover the same years');
  const upfront = new Decimal(input.upfrontCost ?? 0);
  const foulingSavings = input.baselineYearly.map((b, y) => new Decimal(b.foulingCost).minus(input.proposedYearly[y]!.foulingCost));
  const extraCleaningCosts = input.baselineYearly.map((b, y) => {
    const p = input.proposedYearly[y]!;
    return new Decimal(p.cleaningCost).plus(p.downtimeCost).minus(b.cleaningCost).minus(b.downtimeCost);
  });
  const cashflows = [upfront.neg(), ...foulingSavings.map((s, y) => s.minus(extraCleaningCosts[y]!))];
  const rate = input.discountRate;
  const presentBenefits = npv(rate, [0, ...foulingSavings]);
  const presentCosts = npv(rate, [upfront, ...extraCleaningCosts]);
  const ratio = benefitCostRatio(presentBenefits, presentCosts);
  const r = irr(cashflows);
  return {
    cashflows,
    foulingSavings,
    extraCleaningCosts,
    npv: npv(rate, cashflows),
    irr: r.irr,
    ...(r.reason ? { irrReason: r.reason } : {}),
    paybackYears: paybackYears(cashflows),
    discountedPaybackYears: discountedPaybackYears(rate, cashflows),
    benefitCostRatio: ratio,
    ...(ratio === null ? { benefitCostReason: 'the proposal costs no more in cleaning and downtime than the baseline, so the ratio is not defined' } : {}),
  };
}
