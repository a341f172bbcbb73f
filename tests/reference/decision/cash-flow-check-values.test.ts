import { describe, expect, it } from 'vitest';
import { irr, npv } from '@shared/domain/decision/economics/cash-flow-metrics.js';
import cashflow from '@backend/cli/commands/cashflow.js';

// Source: Gitman, Principles of Managerial Finance, Brief 3rd ed., as used in numpy-financial's documentation
// (ENGINEERING.md §7).
describe('cash-flow metrics against the published check values', () => {
  it('npv(0.281, [−100, 39, 59, 55, 20]) = −0.0084785916', () => {
    expect(npv(0.281, [-100, 39, 59, 55, 20]).toNumber()).toBeCloseTo(-0.0084785916, 10);
  });

  it('irr([−100, 39, 59, 55, 20]) = 0.2809484212', () => {
    expect(irr([-100, 39, 59, 55, 20]).irr?.toNumber()).toBeCloseTo(0.2809484212, 10);
  });

  it('irr([−250000, 100000, 150000, 200000, 250000, 300000]) = 0.5672303344', () => {
    expect(irr([-250_000, 100_000, 150_000, 200_000, 250_000, 300_000]).irr?.toNumber()).toBeCloseTo(0.5672303344, 10);
  });

  it('the cashflow command gives the same figures, money to the cent', () => {
    expect(cashflow.run({ rate: 0.281, cashflows: [-100, 39, 59, 55, 20] })).toMatchObject({ npv: -0.01, irr: 0.2809484212 });
  });
});
