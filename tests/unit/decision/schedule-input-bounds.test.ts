import { describe, expect, it } from 'vitest';
import { runCalc } from '@backend/cli/run-calc.js';
import schedule from '@backend/cli/commands/schedule.js';
import { calcScheduleInput } from '@shared/schemas/calc-schedule.js';

const input = {
  startDate: '2027-01-01',
  horizonDays: 60,
  drivers: { cwInletC: 20, loadFraction: 0.85, fuelPricePerMmbtu: 3.5, replacementPricePerMwh: 60, co2PricePerTonne: 25 },
  unit: { ratingMw: 300, heatRateBtuKwh: 9500, co2KgPerMmbtu: 53, activeTubes: 18_000 },
  directPenalty: {
    points: [
      { cleanliness: 0.5, costPerDay: 20_000 },
      { cleanliness: 0.92, costPerDay: 0 },
    ],
  },
  fouling: { model: 'linear', ratePerDay: 0.004 },
  initial: { daysSinceCleaning: 30, cleanlinessAfterCleaning: 0.9 },
  methods: ['hp-water-lancing'],
  discountRate: 0.08,
  includeDaily: false,
};
const withDrivers = (drivers: Record<string, unknown>) => ({ ...input, drivers: { ...input.drivers, ...drivers } });
const monthly = (last: number) => ({ monthly: [...Array.from({ length: 11 }, () => 3), last] });

/** The schema's messages for an input, joined. */
function refusal(value: unknown): string {
  const r = calcScheduleInput.safeParse(value);
  return r.success ? '' : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
}

describe('schedule input bounds (the same as the penalty command)', () => {
  it('refuses a negative fuel price, whether constant, monthly or daily', () => {
    expect(refusal(withDrivers({ fuelPricePerMmbtu: -3.5 }))).toMatch(/fuelPricePerMmbtu.*cannot be negative/);
    expect(refusal(withDrivers({ fuelPricePerMmbtu: monthly(-1) }))).toMatch(/fuelPricePerMmbtu\.monthly\.11: .*cannot be negative/);
    expect(refusal(withDrivers({ fuelPricePerMmbtu: { daily: Array.from({ length: 60 }, (_, d) => (d === 7 ? -0.1 : 3)) } }))).toMatch(
      /fuelPricePerMmbtu\.daily\.7: .*cannot be negative/,
    );
  });

  it('refuses a negative CO2 price', () => {
    expect(refusal(withDrivers({ co2PricePerTonne: -5 }))).toMatch(/co2PricePerTonne.*cannot be negative/);
  });

  it('refuses a load above 1.2 of the rating and a negative load; a day at load 0 is a day off line and allowed', () => {
    expect(refusal(withDrivers({ loadFraction: 1.5 }))).toMatch(/loadFraction.*at most 1\.2/);
    expect(refusal(withDrivers({ loadFraction: -0.1 }))).toMatch(/loadFraction.*cannot be negative/);
    expect(refusal(withDrivers({ loadFraction: { daily: Array.from({ length: 60 }, (_, d) => (d < 10 ? 0 : 0.9)) } }))).toBe('');
  });

  it('keeps a negative replacement price (power markets have them)', () => {
    expect(refusal(withDrivers({ replacementPricePerMwh: -20 }))).toBe('');
    expect(refusal(withDrivers({ replacementPricePerMwh: monthly(-40) }))).toBe('');
  });

  it('refuses a CW inlet temperature outside what a measured point may have (0–50 °C)', () => {
    expect(refusal(withDrivers({ cwInletC: 80 }))).toMatch(/cwInletC.*at most 50/);
    expect(refusal(withDrivers({ cwInletC: monthly(-5) }))).toMatch(/cwInletC.*0 °C or more/);
  });

  it('refuses uncertainty ranges that would make a price or cost negative', () => {
    expect(refusal({ ...input, uncertainty: { ranges: { fuelPrice: { low: -0.5, base: 1, high: 1.3 } } } })).toMatch(/fuelPrice\.low/);
  });

  it('says in our words why a cleanliness shift outside −1…1 is refused', () => {
    expect(refusal({ ...input, uncertainty: { ranges: { recoveredCleanliness: { low: -1.5, base: 0, high: 0.05 } } } })).toMatch(
      /recoveredCleanliness\.low: a cleanliness shift is at least −1/,
    );
  });

  it('the CLI answers a negative fuel price with an error in its place, and still answers the other inputs', () => {
    const out = runCalc(schedule, JSON.stringify([withDrivers({ fuelPricePerMmbtu: -3.5 }), withDrivers({ loadFraction: 1.3 }), input]));
    expect(out.failed).toBe(true);
    const [negativeFuel, overload, fine] = JSON.parse(out.output);
    expect(negativeFuel.error).toMatch(/drivers\.fuelPricePerMmbtu: .*cannot be negative/);
    expect(overload.error).toMatch(/drivers\.loadFraction: .*at most 1\.2/);
    expect(fine.error).toBeUndefined();
    expect(fine.businessCase).toBeDefined();
  });
});
