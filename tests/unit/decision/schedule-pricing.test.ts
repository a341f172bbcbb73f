import { describe, expect, it } from 'vitest';
import { priceSchedule } from '@shared/domain/decision/schedule/schedule-pricing.js';
import { compileSchedulePricer } from '@shared/domain/decision/schedule/fast-repricing.js';
import { baseScenario, type PricingScenario } from '@shared/domain/decision/schedule/schedule-problem.js';
import { baselineCleanings } from '@shared/domain/decision/schedule/baseline-schedules.js';
import { smallProblem } from './small-schedule-problem.js';

describe('pricing a given schedule', () => {
  const p = smallProblem({}, 40);
  const base = baseScenario(p);

  it('an outage method outside a planned outage at full load loses the full rating for its duration, valued at replacement less own fuel and CO2', () => {
    const priced = priceSchedule(p, [{ startDay: 5, methodId: 'outage-wash' }], base);
    // [derived] 10 MW × 24 h × 2 days × (80 − 30 − 5) $/MWh
    expect(priced.cleanings[0]?.downtimeCost).toBeCloseTo(10 * 24 * 2 * 45, 9);
    expect(priced.cleanings[0]?.foulingCostDuring).toBe(0);
  });

  it('when the unit runs part-loaded, an outage cleaning loses only the MW the unit would have made', () => {
    const load = new Float64Array(40).fill(0.6);
    load[6] = 0.3;
    const partLoad = smallProblem({ lostGeneration: { ...p.lostGeneration, loadFraction: load } }, 40);
    const priced = priceSchedule(partLoad, [{ startDay: 5, methodId: 'outage-wash' }], baseScenario(partLoad));
    // [derived] lost MWh = load × rating × 24 h a day: 10 MW × (0.6 + 0.3) × 24 h × 45 $/MWh
    expect(priced.cleanings[0]?.downtimeCost).toBeCloseTo(10 * (0.6 + 0.3) * 24 * 45, 9);
  });

  it('a derate cleaning costs only the load above the derated limit, and nothing when the unit runs below it', () => {
    // 50 % derate: the unit may still make 50 % of its rating
    const at = (loadFraction: number) => {
      const q = smallProblem({ lostGeneration: { ...p.lostGeneration, loadFraction: new Float64Array(40).fill(loadFraction) } }, 40);
      return priceSchedule(q, [{ startDay: 5, methodId: 'derate-brush' }], baseScenario(q)).cleanings[0]!.downtimeCost;
    };
    // [derived] max(0, load − (1 − derate)) × rating × 24 h × 3 days × 45 $/MWh
    expect(at(0.8)).toBeCloseTo((0.8 - 0.5) * 10 * 24 * 3 * 45, 9);
    expect(at(0.4)).toBe(0);
    expect(at(0.5)).toBe(0);
  });

  it('at full load a derate method loses rating × derate % for its duration', () => {
    const priced = priceSchedule(p, [{ startDay: 5, methodId: 'derate-brush' }], base);
    // [derived] 10 MW × 50 % × 24 h × 3 days × 45 $/MWh
    expect(priced.cleanings[0]?.downtimeCost).toBeCloseTo(10 * 0.5 * 24 * 3 * 45, 9);
    // the unit keeps running during a derate cleaning, so fouling cost continues at the cleanliness found
    expect(priced.cleanings[0]?.foulingCostDuring).toBeGreaterThan(0);
  });

  it('a cleaning inside a planned outage costs no downtime and the outage days carry no fouling cost', () => {
    const priced = priceSchedule(p, [{ startDay: 20, methodId: 'outage-wash' }], base);
    expect(priced.cleanings[0]).toMatchObject({ downtimeCost: 0, daysInPlannedOutage: 2 });
    for (let d = 20; d <= 23; d++) expect(priced.dailyFoulingCost[d]).toBe(0);
  });

  it('fouling does not grow through a planned outage: the fouling index is the same before and after it', () => {
    // outage days 20–23 of the fixture; no cleaning
    const priced = priceSchedule(p, [], base);
    expect(priced.dailyCleanliness[19]).toBeGreaterThan(priced.dailyCleanliness[20]!);
    for (let d = 21; d <= 24; d++) expect(priced.dailyCleanliness[d]).toBe(priced.dailyCleanliness[20]);
    expect(priced.dailyCleanliness[25]).toBeLessThan(priced.dailyCleanliness[24]!);
  });

  it('a day without load is off line: no fouling growth, no fouling cost, and a cleaning that day loses nothing', () => {
    const load = new Float64Array(40).fill(1);
    for (const d of [8, 9, 10]) load[d] = 0;
    const idle = smallProblem({ lostGeneration: { ...p.lostGeneration, loadFraction: load } }, 40);
    const priced = priceSchedule(idle, [], baseScenario(idle));
    expect(priced.dailyCleanliness[9]).toBe(priced.dailyCleanliness[8]);
    expect(priced.dailyCleanliness[11]).toBe(priced.dailyCleanliness[8]);
    for (const d of [8, 9, 10]) expect(priced.dailyFoulingCost[d]).toBe(0);
    // [derived] the same path with the idle days removed: day 11 is at the operating age of day 8
    const busy = priceSchedule(p, [], base);
    expect(priced.dailyCleanliness[11]).toBeCloseTo(busy.dailyCleanliness[8]!, 12);
    const cleaning = priceSchedule(idle, [{ startDay: 8, methodId: 'outage-wash' }], baseScenario(idle));
    expect(cleaning.cleanings[0]?.downtimeCost).toBe(0);
  });

  it('after a cleaning the cleanliness restarts at the method’s recovered value and falls again', () => {
    const priced = priceSchedule(p, [{ startDay: 5, methodId: 'outage-wash' }], base);
    expect(priced.dailyCleanliness[7]).toBeCloseTo(0.92, 12);
    expect(priced.dailyCleanliness[8]).toBeLessThan(priced.dailyCleanliness[7]!);
    expect(priced.dailyCleanliness[4]).toBeLessThan(0.9 * 0.92);
  });

  it('totals add up: the daily costs sum to the totals, and the yearly sums to the totals', () => {
    const priced = priceSchedule(
      p,
      [
        { startDay: 5, methodId: 'outage-wash' },
        { startDay: 25, methodId: 'derate-brush' },
      ],
      base,
    );
    const sum = (a: Float64Array) => a.reduce((s, v) => s + v, 0);
    expect(sum(priced.dailyFoulingCost)).toBeCloseTo(priced.totals.foulingCost, 6);
    expect(sum(priced.dailyCleaningCost)).toBeCloseTo(priced.totals.cleaningCost + priced.totals.downtimeCost, 6);
    expect(priced.yearly.reduce((s, y) => s + y.total, 0)).toBeCloseTo(priced.totals.total, 6);
  });

  it('reports rule breaks of a baseline instead of refusing it, and refuses overlapping cleanings', () => {
    const tight = smallProblem({ minSpacingDays: 20 }, 40);
    const priced = priceSchedule(
      tight,
      [
        { startDay: 5, methodId: 'outage-wash' },
        { startDay: 10, methodId: 'outage-wash' },
      ],
      baseScenario(tight),
    );
    expect(priced.ruleBreaks.some((b) => /less than 20 days/.test(b))).toBe(true);
    expect(() =>
      priceSchedule(
        p,
        [
          { startDay: 5, methodId: 'derate-brush' },
          { startDay: 6, methodId: 'outage-wash' },
        ],
        base,
      ),
    ).toThrow(/overlaps/);
  });

  it('the fast re-pricer gives the same yearly totals as the detailed pricing under changed inputs', () => {
    const plan = [
      { startDay: 3, methodId: 'outage-wash' },
      { startDay: 21, methodId: 'derate-brush' },
    ];
    const fast = compileSchedulePricer(p, plan);
    const scenarios: PricingScenario[] = [
      base,
      { foulingRateScale: 1.3, prices: { fuel: 0.8, co2: 1, replacement: 1.4 }, cleaningCostScale: 1.2, recoveredCleanlinessShift: -0.03, discountRate: 0.12 },
      { foulingRateScale: 0.6, prices: { fuel: 1.2, co2: 1, replacement: 0.5 }, cleaningCostScale: 0.9, recoveredCleanlinessShift: 0.02, discountRate: 0.02 },
    ];
    for (const s of scenarios) {
      const detailed = priceSchedule(p, plan, s).yearly.map((y) => y.total);
      const quick = Array.from(fast.yearlyTotals(s));
      expect(quick.length).toBe(detailed.length);
      quick.forEach((v, i) => expect(v).toBeCloseTo(detailed[i]!, 6));
    }
  });

  it('the fast re-pricer agrees with the detailed pricing when the load varies and some days have none', () => {
    const load = Float64Array.from({ length: 40 }, (_, d) => (d % 9 === 4 ? 0 : 0.45 + 0.5 * Math.abs(Math.sin(d / 5))));
    const varied = smallProblem({ lostGeneration: { ...p.lostGeneration, loadFraction: load } }, 40);
    const plan = [
      { startDay: 3, methodId: 'derate-brush' },
      { startDay: 12, methodId: 'outage-wash' },
      { startDay: 21, methodId: 'derate-brush' },
      { startDay: 30, methodId: 'outage-wash' },
    ];
    const fast = compileSchedulePricer(varied, plan);
    const s: PricingScenario = {
      foulingRateScale: 1.3,
      prices: { fuel: 0.8, co2: 1, replacement: 1.4 },
      cleaningCostScale: 1.2,
      recoveredCleanlinessShift: -0.03,
      discountRate: 0.12,
    };
    const detailed = priceSchedule(varied, plan, s).yearly.map((y) => y.total);
    Array.from(fast.yearlyTotals(s)).forEach((v, i) => expect(v).toBeCloseTo(detailed[i]!, 6));
  });

  it('the next-planned-outage baseline cleans once at the start of the first outage long enough', () => {
    expect(baselineCleanings(p, { kind: 'next-planned-outage', methodId: 'outage-wash' })).toEqual([{ startDay: 20, methodId: 'outage-wash' }]);
    expect(baselineCleanings(p, { kind: 'never' })).toEqual([]);
  });
});
