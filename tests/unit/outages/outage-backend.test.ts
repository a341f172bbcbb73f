/**
 * The outage backend's pure parts: pricing a recovered cleanliness from a unit's recent days, the figures of a
 * selection, who may do what, the cautions per kind of work, the lane chart's layout and an approved case's cleaning
 * priced as an item. Figures invented for tests.
 */
import { describe, expect, it } from 'vitest';
import { buildUnitModel, type UnitSetupSi } from '@shared/domain/monitoring/index.js';
import { priceCleanlinessRecovered, type OperatingDay } from '../../../backend/src/services/outages/cleanliness-pricing.js';
import { caseCleaningPriced, caseDiscountFactor } from '../../../backend/src/services/outages/price-item.js';
import { cautionsFor, DEFER_TO_PRACTICE, outageActionsFor, outageRefusal, outageVisibleTo } from '../../../backend/src/services/outages/outage-rules.js';
import { selectionFigures } from '../../../backend/src/services/outages/scope-figures.js';
import { dayTicks } from '../../../backend/src/reports/outage-report/lane-chart.js';
import type { CleaningCase } from '../../../backend/src/entities/cleaning-case.entity.js';
import type { OutageItem } from '../../../backend/src/entities/outage-item.entity.js';
import type { Outage } from '../../../backend/src/entities/outage.entity.js';
import { TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../../factories/units.js';

const model = buildUnitModel({ condenser: TEST_CONDENSER, turbine: TEST_TURBINE, economics: TEST_ECONOMICS } as UnitSetupSi);
const day = (n: number) => new Date(Date.UTC(2026, 0, 1 + n)).toISOString().slice(0, 10);
const price = (days: OperatingDay[], cleanlinessRecovered = 0.05, horizonDays = 100) =>
  priceCleanlinessRecovered({ unitName: 'Unit 7', model, cwFlowM3s: 15, pluggedTubes: 120, days, cleanlinessRecovered, horizonDays, currency: 'USD' });

describe('pricing a recovered cleanliness', () => {
  it('takes the median conditions of the last 90 days and the median cleanliness of the last 30', () => {
    // 120 days: the first 30 are ignored (hot, dirty); of the last 90, CW inlet 18/22 alternate → median 20;
    // cleanliness 0.60 for days 31–90, then 0.75 for the last 30 → 0.75.
    const days: OperatingDay[] = Array.from({ length: 120 }, (_, n) => ({
      day: day(n),
      cwInletC: n < 30 ? 35 : n % 2 ? 18 : 22,
      loadMw: n < 30 ? 150 : 289,
      cleanliness: n < 30 ? 0.3 : n < 90 ? 0.6 : 0.75,
    }));
    const p = price(days);
    expect(p.cwInletC).toBe(20);
    expect(p.loadFraction).toBeCloseTo(0.85, 12);
    expect(p.cleanlinessBefore).toBe(0.75);
    expect(p.cleanlinessAfter).toBeCloseTo(0.8, 12);
    expect(p.backpressureAfterKpa).toBeLessThan(p.backpressureBeforeKpa);
    expect(p.benefit.toNumber()).toBeCloseTo(p.costPerDay.toNumber() * 100, 2);
    expect(p.text).toContain('90 days with data');
  });

  it('is worth more the dirtier the condenser starts, for the same points recovered', () => {
    const at = (cleanliness: number) => price(Array.from({ length: 10 }, (_, n) => ({ day: day(n), cwInletC: 24, loadMw: 320, cleanliness })));
    expect(at(0.55).benefit.toNumber()).toBeGreaterThan(at(0.85).benefit.toNumber());
  });

  it('never prices past the unit’s reference cleanliness: a recovery from there is worth nothing', () => {
    // The test unit's reference is 0.90 (factories/units.ts); a unit reading above it gains nothing from more points.
    expect(model.referenceCleanliness).toBe(0.9);
    const p = price([{ day: day(0), cwInletC: 20, loadMw: 289, cleanliness: 0.95 }]);
    expect(p.cleanlinessAfter).toBe(0.95);
    expect(p.benefit.toNumber()).toBe(0);
    expect(p.text).toContain('capped at the unit’s reference of 90 %');
  });

  it('prices a recovery that would pass the reference as reaching the reference, and says so', () => {
    // 0.85 + 0.10 would be 0.95: priced at 0.90, the same as a recovery of exactly 0.05.
    const days = [{ day: day(0), cwInletC: 20, loadMw: 289, cleanliness: 0.85 }];
    const capped = price(days, 0.1);
    expect(capped.cleanlinessAfter).toBe(0.9);
    expect(capped.benefit.toNumber()).toBe(price(days, 0.05).benefit.toNumber());
    expect(capped.text).toContain('from 85.0 % to 90.0 % (capped at the unit’s reference of 90 %)');
    expect(price(days, 0.05).text).not.toContain('capped');
  });

  it('gives the temperature and backpressure in US units beside SI, and one day in the singular', () => {
    // NIST SP 811: 1 inHg (0 °C) = 3.386389 kPa; °F = °C × 9/5 + 32, so 20 °C = 68.0 °F.
    const p = price([{ day: day(0), cwInletC: 20, loadMw: 289, cleanliness: 0.7 }], 0.1, 1);
    const inHg = (kpa: number) => (kpa / 3.386389).toFixed(2);
    expect(p.text).toContain('CW inlet 20.0 °C (68.0 °F)');
    expect(p.text).toContain(
      `${p.backpressureBeforeKpa.toFixed(2)} → ${p.backpressureAfterKpa.toFixed(2)} kPa(a) (${inHg(p.backpressureBeforeKpa)} → ${inHg(p.backpressureAfterKpa)} inHgA)`,
    );
    expect(p.text).toMatch(/ a day × 1 day = /);
    expect(price([{ day: day(0), cwInletC: 20, loadMw: 289, cleanliness: 0.7 }], 0.1, 2).text).toMatch(/ a day × 2 days = /);
  });

  it('refuses to price without a day of data', () => {
    expect(() => price([])).toThrow(RangeError);
  });
});

const outage = { startDate: '2026-10-05', endDate: '2026-10-14', budget: '50000.00', currency: 'USD' } as Outage;
const item = (id: string, cost: number, durationDays: number, lane: string, benefit: number, needs: string[] = []) =>
  ({ id, title: `Item ${id}`, cost: cost.toFixed(2), durationDays, lane, pricedBenefit: benefit.toFixed(2), needs }) as OutageItem;

describe('the figures of a selection', () => {
  const items = [item('a', 20_000.1, 3, 'A', 60_000.2), item('b', 30_000, 8, 'A', 40_000, ['c']), item('c', 5_000, 2, 'B', 1_000)];

  it('adds money exactly and days per lane, and names the critical lane', () => {
    const f = selectionFigures(outage, items, ['a', 'c']);
    expect(f).toMatchObject({ totalCost: 25_000.1, totalBenefit: 61_000.2, laneDays: { A: 3, B: 2 }, criticalLaneDays: 3, feasible: true, problems: [] });
  });

  it('says what breaks: the budget, a lane longer than the window, a need left out', () => {
    const f = selectionFigures(outage, items, ['a', 'b']);
    expect(f.feasible).toBe(false);
    expect(f.problems).toEqual([
      'The cost $50,000.10 is over the budget of $50,000.00',
      'Lane “A” needs 11 days; the window has 10',
      '“Item b” needs “Item c”, which is not in the scope',
    ]);
  });
});

describe('who may do what with an outage', () => {
  it('viewers read approved outages only', () => {
    expect(outageVisibleTo('viewer', 'draft')).toBe(false);
    expect(outageVisibleTo('viewer', 'approved')).toBe(true);
    expect(outageVisibleTo('analyst', 'draft')).toBe(true);
  });

  it('analysts, approvers and administrators plan; approvers and administrators approve; administrators delete; approved is frozen', () => {
    expect(outageActionsFor('draft', 'analyst')).toEqual({ edit: true, optimise: true, saveScope: true, approve: false, delete: false });
    expect(outageActionsFor('draft', 'approver')).toEqual({ edit: true, optimise: true, saveScope: true, approve: true, delete: false });
    expect(outageActionsFor('draft', 'admin')).toEqual({ edit: true, optimise: true, saveScope: true, approve: true, delete: true });
    expect(outageActionsFor('approved', 'admin')).toEqual({ edit: false, optimise: false, saveScope: false, approve: false, delete: true });
    expect(outageActionsFor('draft', 'viewer')).toEqual({ edit: false, optimise: false, saveScope: false, approve: false, delete: false });
    expect(outageRefusal('edit', 'approved', 'analyst')?.status).toBe(409);
    expect(outageRefusal('edit', 'draft', 'viewer')?.status).toBe(403);
  });
});

describe('cautions for the work chosen', () => {
  it('name chemicals and water jetting for a cleaning, confined entry for waterbox work, and always defer to local practice', () => {
    const cleaning = cautionsFor(['case-cleaning']);
    expect(cleaning.join(' ')).toMatch(/jetting/);
    expect(cleaning.join(' ')).toMatch(/safety data sheet/);
    const air = cautionsFor(['air-in-leakage-repair']);
    expect(air.join(' ')).not.toMatch(/jetting|confined/);
    expect(cautionsFor(['waterbox-repair', 'tube-plugging']).join(' ')).toMatch(/permit-required confined space/);
    for (const list of [cleaning, air, cautionsFor([])]) expect(list.at(-1)).toBe(DEFER_TO_PRACTICE);
    // each caution once, however many items share it
    const many = cautionsFor(['waterbox-repair', 'waterbox-repair', 'other']);
    expect(new Set(many).size).toBe(many.length);
  });
});

describe('the lane chart', () => {
  it('marks about eight round day ticks and always the window’s last day', () => {
    expect(dayTicks(14)).toEqual([0, 2, 4, 6, 8, 10, 12, 14]);
    expect(dayTicks(21)).toEqual([0, 5, 10, 15, 20, 21]);
    expect(dayTicks(1)).toEqual([0, 1]);
    for (const n of [3, 30, 45, 90, 200, 365]) {
      const ticks = dayTicks(n);
      expect(ticks.at(-1)).toBe(n);
      expect(ticks.length).toBeLessThanOrEqual(10);
    }
  });
});

describe('an approved case’s cleaning as an outage item', () => {
  // Invented case: start 1 Jan 2026, 8 %, plan 60,000 against a baseline of 100,000 (both discounted); its first
  // cleaning costs 10,000 on 1 Mar 2027, in horizon year 1 (the second), so the case booked it at 1.08^-2.
  const record = (cleanings: number) =>
    ({
      title: 'Spring lancing',
      currency: 'USD',
      inputs: { startDate: '2026-01-01', discountRate: 0.08, horizonDays: 1095, baseline: { kind: 'never' } },
      results: {
        cleanings: Array.from({ length: cleanings }, (_, i) => ({
          date: i === 0 ? '2027-03-01' : '2028-03-01',
          endDate: i === 0 ? '2027-03-03' : '2028-03-03',
          methodName: 'Lancing',
          cleaningCost: 10_000,
        })),
        discountedTotals: { total: 60_000 },
        baseline: { discountedTotals: { total: 100_000 } },
      },
    }) as unknown as CleaningCase;

  it('discounts a day as the case books it: (1 + r)^-(k+1) for horizon year k', () => {
    expect(caseDiscountFactor('2026-01-01', '2026-12-31', 0.08)).toBeCloseTo(1 / 1.08, 12);
    expect(caseDiscountFactor('2026-01-01', '2027-01-01', 0.08)).toBeCloseTo(1 / 1.08 ** 2, 12);
    expect(caseDiscountFactor('2026-01-01', '2027-03-01', 0.08)).toBeCloseTo(0.85733882, 8);
  });

  it('adds back the first cleaning’s cost discounted like the saving, and says the benefit is the whole plan’s', () => {
    // By hand: 100,000 − 60,000 = 40,000 saved; 10,000 / 1.08² = 8,573.39 added back; 48,573.39 in all.
    const c = caseCleaningPriced(record(1), { startDate: '2027-02-20', endDate: '2027-03-10' });
    expect(c.priced.pricedBenefit.toNumber()).toBe(48_573.39);
    expect(c.defaults).toEqual({ title: 'Lancing (case “Spring lancing”)', cost: 10_000, durationDays: 3 });
    expect(c.priced.pricingText).toContain('the benefit is the case’s whole plan against its baseline, not this cleaning alone');
    expect(c.priced.pricingText).toContain('$48,573');
    expect(caseCleaningPriced(record(2), { startDate: '2027-02-20', endDate: '2027-03-10' }).priced.pricingText).toContain(
      'the case’s whole plan of 2 cleanings against its baseline, not this cleaning alone',
    );
  });
});
