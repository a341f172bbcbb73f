import { describe, expect, it } from 'vitest';
import { runScheduleCommand } from '@shared/domain/decision/schedule/schedule-command.js';
import { calcScheduleInput } from '@shared/schemas/calc-schedule.js';

// A small hand-written schedule input (values invented for the test).
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
const condenser = { surfaceM2: 17_000, tubeCount: 18_000, passes: 2, tubeOdMm: 25.4, tubeBwg: 18, tubeMaterial: 'stainless', cwFlowM3s: 10, designDutyMw: 400 };
const withCondenser = (c: Record<string, unknown>) => {
  const { directPenalty: _d, ...rest } = input;
  return { ...rest, unit: { ...input.unit, condenser: { ...condenser, ...c } } };
};

function refusal(value: unknown): string {
  const r = calcScheduleInput.safeParse(value);
  return r.success ? '' : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
}

describe('every number of a schedule input is bounded to what is physical or economic', () => {
  it('the hand-written input and a full condenser are accepted', () => {
    expect(refusal(input)).toBe('');
    expect(refusal(withCondenser({}))).toBe('');
  });

  it('refuses prices beyond the unit setup’s ranges, naming the field and the range', () => {
    expect(refusal({ ...input, drivers: { ...input.drivers, fuelPricePerMmbtu: 1e12 } })).toMatch(/drivers\.fuelPricePerMmbtu: .*between 0 and 500/);
    expect(refusal({ ...input, drivers: { ...input.drivers, replacementPricePerMwh: 20_000 } })).toMatch(/replacementPricePerMwh: .*between -500 and 10,000/);
    expect(refusal({ ...input, drivers: { ...input.drivers, replacementPricePerMwh: -600 } })).toMatch(/replacementPricePerMwh: .*between -500 and 10,000/);
    expect(refusal({ ...input, drivers: { ...input.drivers, co2PricePerTonne: 5000 } })).toMatch(/co2PricePerTonne: .*between 0 and 1,000/);
  });

  it('refuses a rating, heat rate or CO2 factor no unit has', () => {
    expect(refusal({ ...input, unit: { ...input.unit, ratingMw: 1e9 } })).toMatch(/unit\.ratingMw: .*between 1 and 2,000 MW/);
    expect(refusal({ ...input, unit: { ...input.unit, heatRateBtuKwh: 0.001 } })).toMatch(/unit\.heatRateBtuKwh: .*between 4,000 and 20,000 Btu\/kWh/);
    expect(refusal({ ...input, unit: { ...input.unit, co2KgPerMmbtu: 900 } })).toMatch(/unit\.co2KgPerMmbtu: .*between 0 and 200/);
    expect(refusal({ ...input, unit: { ...input.unit, activeTubes: 5e6 } })).toMatch(/unit\.activeTubes: .*between 0 and 200,000/);
  });

  it('refuses a condenser outside the condenser setup’s ranges', () => {
    expect(refusal(withCondenser({ surfaceM2: 1e9 }))).toMatch(/surfaceM2: .*between 10 and 200,000 m²/);
    expect(refusal(withCondenser({ tubeCount: 5e6 }))).toMatch(/tubeCount: .*between 50 and 200,000/);
    expect(refusal(withCondenser({ cwFlowM3s: 5000 }))).toMatch(/cwFlowM3s: .*between 0.01 and 200 m³\/s/);
    expect(refusal(withCondenser({ designDutyMw: 1e6 }))).toMatch(/designDutyMw: .*between 1 and 4,000 MW/);
    expect(refusal(withCondenser({ tubeOdMm: 500 }))).toMatch(/tubeOdMm: .*between 12 and 60 mm/);
  });

  it('refuses a discount rate outside 0–50 %, an upfront cost beyond a billion and spacing longer than the horizon', () => {
    expect(refusal({ ...input, discountRate: 50 })).toMatch(/discountRate: .*between 0 and 0.5/);
    expect(refusal({ ...input, discountRate: -0.9 })).toMatch(/discountRate: .*between 0 and 0.5/);
    expect(refusal({ ...input, upfrontCost: 1e15 })).toMatch(/upfrontCost: .*between 0 and 1,000,000,000/);
    expect(refusal({ ...input, minSpacingDays: 61 })).toMatch(/minSpacingDays: .*at most the horizon \(60 days\)/);
    expect(refusal({ ...input, minSpacingDays: 60 })).toBe('');
  });

  it('refuses fouling that would take a clean condenser to the dirtiest plausible one within a day', () => {
    expect(refusal({ ...input, fouling: { model: 'linear', ratePerDay: 50 } })).toMatch(/fouling\.ratePerDay: .*at most 4.17 per day/);
    expect(refusal({ ...input, fouling: { model: 'falling-rate', coefficient: 40, exponent: 0.5 } })).toMatch(/fouling\.coefficient: .*at most 4.17/);
    expect(refusal({ ...input, fouling: { model: 'asymptotic', maxIndex: 100, timeConstantDays: 1 } })).toMatch(/fouling: .*at most 4.17 per day/);
    expect(refusal({ ...input, fouling: { model: 'asymptotic', maxIndex: 0.5, timeConstantDays: 200 } })).toBe('');
  });

  it('refuses a condenser said to be uncleaned for more than ten years, and a start outside 2000–2100', () => {
    expect(refusal({ ...input, initial: { ...input.initial, daysSinceCleaning: 50_000_000 } })).toMatch(/initial\.daysSinceCleaning: .*between 0 and 3,650/);
    expect(refusal({ ...input, startDate: '1900-01-01' })).toMatch(/startDate: .*2000-01-01 and 2100-12-31/);
    expect(refusal({ ...input, startDate: '2027-02-30' })).toMatch(/startDate: .*not a calendar day/);
  });

  it('bounds the uncertainty multipliers and direct penalty costs', () => {
    expect(refusal({ ...input, uncertainty: { ranges: { fuelPrice: { low: 0.5, base: 1, high: 1e6 } } } })).toMatch(/fuelPrice\.high: .*between 0 and 10/);
    expect(
      refusal({
        ...input,
        directPenalty: {
          points: [
            { cleanliness: 0.5, costPerDay: 1e15 },
            { cleanliness: 0.92, costPerDay: 0 },
          ],
        },
      }),
    ).toMatch(/costPerDay: .*between/);
  });
});

describe('results outside a plausible band carry a warning', () => {
  it('a benefit–cost ratio above 10 and an NPV above the unit’s yearly fuel bill are flagged', () => {
    // A steep penalty curve against a cheap cleaning: the ratio and the NPV run far beyond what a plant sees.
    const out = runScheduleCommand(
      calcScheduleInput.parse({
        ...input,
        horizonDays: 730,
        unit: { ...input.unit, ratingMw: 20 },
        directPenalty: {
          points: [
            { cleanliness: 0.3, costPerDay: 2_000_000 },
            { cleanliness: 0.92, costPerDay: 0 },
          ],
        },
      }),
    );
    expect(out.businessCase.benefitCostRatio).toBeGreaterThan(10);
    expect(out.warnings.join(' ')).toMatch(/benefit–cost ratio .* above 10/);
    expect(out.warnings.join(' ')).toMatch(/NPV .* above the unit’s yearly fuel bill/);
  });

  it('an ordinary case carries neither warning', () => {
    const out = runScheduleCommand(calcScheduleInput.parse({ ...input, horizonDays: 365 }));
    expect(out.warnings.join(' ')).not.toMatch(/benefit–cost ratio|yearly fuel bill/);
  });
});
