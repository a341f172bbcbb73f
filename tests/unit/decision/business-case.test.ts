import { describe, expect, it } from 'vitest';
import { businessCase } from '@shared/domain/decision/economics/business-case.js';
import { priceSchedule } from '@shared/domain/decision/schedule/schedule-pricing.js';
import { optimiseSchedule } from '@shared/domain/decision/schedule/optimal-schedule.js';
import { baseScenario } from '@shared/domain/decision/schedule/schedule-problem.js';
import { smallProblem } from './small-schedule-problem.js';

const t = (foulingCost: number, cleaningCost: number, downtimeCost = 0) => ({
  foulingCost,
  cleaningCost,
  downtimeCost,
  total: foulingCost + cleaningCost + downtimeCost,
});

describe('business case of a schedule against its baseline', () => {
  it('cash flows are the baseline cost minus the proposal’s, per year, with the up-front cost at t = 0', () => {
    const bc = businessCase({ proposedYearly: [t(100, 50), t(80, 0)], baselineYearly: [t(300, 0), t(300, 0)], discountRate: 0.1, upfrontCost: 120 });
    expect(bc.cashflows.map((v) => v.toNumber())).toEqual([-120, 150, 220]);
    expect(bc.foulingSavings.map((v) => v.toNumber())).toEqual([200, 220]);
    expect(bc.extraCleaningCosts.map((v) => v.toNumber())).toEqual([50, 0]);
    // [derived] −120 + 150/1.1 + 220/1.21
    expect(bc.npv.toNumber()).toBeCloseTo(-120 + 150 / 1.1 + 220 / 1.21, 10);
    // [derived] benefits 200/1.1 + 220/1.21 over costs 120 + 50/1.1
    expect(bc.benefitCostRatio!.toNumber()).toBeCloseTo((200 / 1.1 + 220 / 1.21) / (120 + 50 / 1.1), 10);
    expect(bc.paybackYears).toBeCloseTo(0.8, 12);
    expect(bc.irr).not.toBeNull();
  });

  it('with no extra cleaning cost the benefit–cost ratio is not defined and says why', () => {
    const bc = businessCase({ proposedYearly: [t(100, 0)], baselineYearly: [t(200, 0)], discountRate: 0.1 });
    expect(bc.benefitCostRatio).toBeNull();
    expect(bc.benefitCostReason).toMatch(/not defined/);
    expect(bc.paybackYears).toBe(0);
  });

  it('its NPV equals the baseline’s discounted total minus the proposal’s (same year-end discounting as the optimiser)', () => {
    const p = smallProblem({ yearIndex: new Int32Array(60).map((_, d) => Math.floor(d / 20)) }, 60);
    const s = baseScenario(p);
    const proposed = priceSchedule(p, optimiseSchedule(p).cleanings, s);
    const baseline = priceSchedule(p, [], s);
    const bc = businessCase({ proposedYearly: proposed.yearly, baselineYearly: baseline.yearly, discountRate: p.discountRate });
    expect(bc.npv.toNumber()).toBeCloseTo(baseline.discountedTotals.total - proposed.discountedTotals.total, 6);
    // the optimiser's schedule can never be worse than not cleaning at all
    expect(bc.npv.toNumber()).toBeGreaterThanOrEqual(0);
  });
});
