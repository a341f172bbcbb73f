/**
 * Independent recomputation of the MW, MWh, MMBtu and t CO2 the product shows beside a fouling cost
 * (shared/domain/turbine/physical-cost.ts, shared/text/physical-cost-text.ts, shared/text/case-physical-text.ts).
 *
 * Every expected figure below was worked out by hand from the closed form of the cost (penalty-cost.ts, the blend of
 * blendedCostPerHour) and checked with python3 arithmetic; none is read back from the code under test.
 *
 * The closed form of one hour at load L (MW), heat-rate penalty h (%), output penalty k = h / (1 + h/100) (%, the
 * firing-held relation of a heat-rate curve), heat rate HR (Btu/kWh), fuel price f, CO2 factor e (kg/MMBtu), CO2
 * price c, replacement price R and capacity-limited share s:
 *   extra fuel   F = L · 1000 · HR · h/100 / 10⁶            MMBtu/h
 *   lost output  W = L · k/100                              MW
 *   cost         C = (1 − s) · F · (f + e/1000 · c) + s · W · R
 * Turned back with one price V = (1 − s) · HR/1000 · (f + e/1000 · c) + s · R per MWh of penalty, the product's
 * MWh P = C / V is exact when s = 0 (fuel) or s = 1 (lost output); in between it mixes h and k, so it is off by a
 * factor of order h/100 (worked out in section 1).
 */
import { describe, expect, it } from 'vitest';
import { blendedCostPerHour } from '@shared/domain/monitoring/sample-analysis';
import type { UnitModel } from '@shared/domain/monitoring/unit-model';
import { physicalCost, type PhysicalCostBasis } from '@shared/domain/turbine/physical-cost';
import { calcScheduleInput, type CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { casePhysicalSentence } from '@shared/text/case-physical-text';
import { formatQuantity, physicalCostParts, physicalCostShort, physicalCostWords } from '@shared/text/physical-cost-text';

/** Harrow Creek Unit 1 of the demo (DEMO VALUES, backend/src/seed/demo-units-seed.ts), as GET /api/units/:id answers. */
const DEMO_BASIS: PhysicalCostBasis = {
  heatRateBtuKwh: 9650,
  fuelPricePerMmbtu: 2.1,
  co2KgPerMmbtu: 97.17, // sub-bituminous coal, the product's factor table (itself "from memory, verify")
  co2PricePerTonne: 0,
  replacementPricePerMwh: 52,
  capacityLimitedShare: 0.15,
};

/** The cost of `hours` hours at a constant load and heat-rate penalty, made by the product's own blend. */
function costOf(basis: PhysicalCostBasis, loadMw: number, heatRatePenaltyPct: number, hours: number): number {
  const model = {
    ratingMw: loadMw,
    heatRateBtuKwh: basis.heatRateBtuKwh,
    economics: {
      fuelPricePerMmbtu: basis.fuelPricePerMmbtu,
      co2KgPerMmbtu: basis.co2KgPerMmbtu,
      co2PricePerTonne: basis.co2PricePerTonne,
      replacementPricePerMwh: basis.replacementPricePerMwh,
      capacityLimitedShare: basis.capacityLimitedShare,
    },
  } as unknown as UnitModel;
  // firing-held output penalty of a heat-rate penalty, by hand: k = h / (1 + h/100)
  const outputPenaltyPct = heatRatePenaltyPct / (1 + heatRatePenaltyPct / 100);
  return hours * blendedCostPerHour(model, 1, { heatRatePenaltyPct, outputPenaltyPct });
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('1. the inversion against the closed form (450 MW, 1.2 % heat-rate penalty for 24 h, demo prices)', () => {
  // Hand computation: F = 450·1000·9650·0.012/10⁶ = 52.11 MMBtu/h → 1,250.64 MMBtu a day;
  // k = 1.2/1.012 = 1.185771 % → W = 5.335968 MW → 128.06324 MWh a day.
  const L = 450;
  const h = 1.2;

  it('with no capacity-limited hours the extra fuel and its CO2 come back exactly (closed form)', () => {
    for (const co2Price of [0, 25]) {
      const basis = { ...DEMO_BASIS, capacityLimitedShare: 0, co2PricePerTonne: co2Price };
      const p = physicalCost(costOf(basis, L, h, 24), basis, 24)!;
      expect(relative(p.extraFuelMmbtu, 1250.64)).toBeLessThan(1e-12);
      expect(relative(p.co2Tonnes, 121.5246888)).toBeLessThan(1e-9); // 1,250.64 × 97.17 / 1000
      expect(p.lostMwh).toBe(0);
    }
  });

  it('with every hour capacity-limited the lost output comes back exactly, as MWh and as MW (closed form)', () => {
    const basis = { ...DEMO_BASIS, capacityLimitedShare: 1 };
    const p = physicalCost(costOf(basis, L, h, 24), basis, 24)!;
    expect(relative(p.lostMwh, 128.0632411)).toBeLessThan(1e-9);
    expect(relative(p.lostMw!, 5.335968379)).toBeLessThan(1e-9);
    expect(p.extraFuelMmbtu).toBe(0);
    expect(p.co2Tonnes).toBe(0);
  });

  it('with the demo share (15 %) fuel and CO2 read 0.37 % low and the lost output 0.83 % high: not exact, as the closed form predicts', () => {
    // Hand computation: V = 0.85·9.65·2.1 + 0.15·52 = 25.02525 per MWh; C = 24·(0.85·52.11·2.1 + 0.15·5.335968·52)
    // = 3,231.2857; P = C/V = 129.12102 MWh. True fuel 0.85·1,250.64 = 1,063.044 MMBtu, product 0.85·P·9.65 = 1,059.1151;
    // true lost output 0.15·128.06324 = 19.20949 MWh, product 0.15·P = 19.36815 MWh; MW 5.33597 true, 5.38004 product.
    const p = physicalCost(costOf(DEMO_BASIS, L, h, 24), DEMO_BASIS, 24)!;
    expect(relative(p.penaltyMwh, 129.121015)).toBeLessThan(1e-8);
    expect(relative(p.extraFuelMmbtu, 1059.115126)).toBeLessThan(1e-8);
    expect(relative(p.lostMwh, 19.36815225)).toBeLessThan(1e-8);
    expect(relative(p.lostMw!, 5.380042292)).toBeLessThan(1e-8);
    // against the physical truth: fuel low by s·R·(h/100)/(1 + h/100)/V = 0.37 %, lost MW high by (h/100)·(1 − s)·HR/1000·f/V = 0.83 %
    expect((1063.044 - p.extraFuelMmbtu) / 1063.044).toBeCloseTo((0.15 * 52 * 0.012) / 1.012 / 25.02525, 6);
    expect((p.lostMw! - 5.335968379) / 5.335968379).toBeCloseTo((0.012 * 0.85 * 9.65 * 2.1) / 25.02525, 6);
    // the error is below 1 % at this (large) penalty, and shows in the MW's last digit: 5.4 shown against 5.3 true
    expect(formatQuantity(p.lostMw!)).toBe('5.4');
    expect(formatQuantity(5.335968379)).toBe('5.3');
  });

  it('at the demo unit’s own fouling penalty (about 0.25 %) the mix error is below 0.2 %, under the precision shown (closed form)', () => {
    // Same formulas at h = 0.25 % and 432 MW (Harrow Creek Unit 1 on 1 Dec 2026: P/24 ≈ 1.07 MW of 432 MW).
    const hd = 0.25;
    const p = physicalCost(costOf(DEMO_BASIS, 432, hd, 24), DEMO_BASIS, 24)!;
    const trueFuel = 0.85 * 24 * ((432 * 1000 * 9650 * hd) / 100 / 1e6);
    const trueLostMw = (432 * hd) / (1 + hd / 100) / 100;
    expect(relative(p.extraFuelMmbtu, trueFuel)).toBeLessThan(0.001);
    expect(relative(p.lostMw!, trueLostMw)).toBeLessThan(0.002);
    expect(formatQuantity(p.lostMw!)).toBe(formatQuantity(trueLostMw));
    expect(formatQuantity(p.co2Tonnes)).toBe(formatQuantity((trueFuel * 97.17) / 1000));
  });
});

describe('2. the demo unit’s stored figures (Harrow Creek Unit 1, demo seeded for 2 Dec 2026)', () => {
  // Stored costs as GET /api/units/:id/health and GET /api/portfolio answered on that seed (both gave the same
  // per-day mean and since-cleaning sum); the quantities are the hand computation with V = 25.02525 per MWh.
  it('one day (1 Dec 2026, 24 valid hours, 640.32 USD): 3.84 MWh lost, 209.88 MMBtu, 20.39 t CO2 (hand computation)', () => {
    const p = physicalCost(640.3221713186135, DEMO_BASIS)!;
    expect(relative(p.penaltyMwh, 25.587043938)).toBeLessThan(1e-9); // 640.32217 / 25.02525
    expect(relative(p.lostMwh, 3.838056591)).toBeLessThan(1e-9); // × 0.15
    expect(relative(p.extraFuelMmbtu, 209.8777279)).toBeLessThan(1e-9); // × 0.85 × 9.65
    expect(relative(p.co2Tonnes, 20.39381882)).toBeLessThan(1e-9); // × 97.17 / 1000
    expect(p.lostMw).toBeNull(); // no hours given, no MW
  });

  it('the head’s mean of the last week (599.54 USD a day over 24 h): 1.0 MW and 19 t CO2 a day, in words (hand computation)', () => {
    const p = physicalCost(599.5405754015362, DEMO_BASIS, 24)!;
    expect(relative(p.lostMw!, 0.998226084)).toBeLessThan(1e-9); // 599.54 / 25.02525 / 24
    expect(relative(p.co2Tonnes, 19.09495316)).toBeLessThan(1e-9);
    expect(physicalCostWords(p, 0.15, 'a day')).toEqual({
      output: '1.0 MW less output in the 15 % of hours the unit is capacity-limited',
      co2: '19 t CO2 a day from extra fuel in the other hours',
    });
    expect(physicalCostParts(p, 0.15, 'a day')).toEqual(['1.0 MW lost when capacity-limited', '19 t CO2 a day']);
  });

  it('since the last cleaning (166,249.87 USD): 996 MWh and 5,295 t CO2 in all, thousands grouped (hand computation)', () => {
    const p = physicalCost(166249.87359279022, DEMO_BASIS)!;
    expect(relative(p.lostMwh, 996.4927838)).toBeLessThan(1e-9);
    expect(relative(p.co2Tonnes, 5294.943628)).toBeLessThan(1e-9);
    expect(physicalCostShort(p, 0.15, 'in all')).toBe('996 MWh lost when capacity-limited · 5,295 t CO2 in all');
  });

  it('a sum of days turns into the same quantities as the day-by-day figures added up (linear, closed form)', () => {
    const days = [591.090696731559, 606.634484315402, 714.344942099779, 594.7458560345349, 693.0411569856527, 476.4399312839802, 495.92562428876215];
    const summed = days.map((c) => physicalCost(c, DEMO_BASIS)!).reduce((a, p) => a + p.co2Tonnes, 0);
    expect(
      relative(
        summed,
        physicalCost(
          days.reduce((a, c) => a + c, 0),
          DEMO_BASIS,
        )!.co2Tonnes,
      ),
    ).toBeLessThan(1e-12);
  });
});

/** The demo case on Harrow Creek Unit 1 (inputs as the case page holds them), parsed by the product's own schema. */
function demoCaseInputs(change: (raw: Record<string, unknown>) => void = () => {}): CalcScheduleInput {
  const raw: Record<string, unknown> = {
    startDate: '2026-12-03',
    horizonDays: 730,
    drivers: {
      cwInletC: { monthly: [5.121, 5.27, 7.39, 11.948, 17.814, 22.79, 25.907, 27.443, 24.584, 19.93, 14.057, 8.594] },
      loadFraction: { monthly: [0.8046, 0.7657, 0.6608, 0.794, 0.7878, 0.8265, 0.8644, 0.8014, 0.5815, 0.799, 0.7922, 0.7903] },
      fuelPricePerMmbtu: 2.1,
      replacementPricePerMwh: 52,
      co2PricePerTonne: 0,
    },
    unit: {
      ratingMw: 520,
      heatRateBtuKwh: 9650,
      co2KgPerMmbtu: 97.17,
      capacityLimitedShare: 0.15,
      condenser: {
        surfaceM2: 24051,
        tubeCount: 22000,
        passes: 2,
        tubeOdMm: 25.4,
        tubeBwg: 22,
        tubeMaterial: 'titanium',
        pluggedTubes: 140,
        cwFlowM3s: 10.4,
        designDutyMw: 598,
      },
    },
    fouling: { model: 'asymptotic', maxIndex: 0.5770198935692955, timeConstantDays: 157.97241019193893 },
    initial: { daysSinceCleaning: 257, cleanlinessAfterCleaning: 0.93, foulingRateMultiplier: 1 },
    methods: ['hp-water-lancing', 'sponge-ball-campaign'],
    discountRate: 0.08,
  };
  change(raw);
  return calcScheduleInput.parse(raw);
}

describe('3. a case’s figures (the demo case on Harrow Creek Unit 1: plan 226,386.20, baseline 505,271.29 of fouling over 730 days)', () => {
  it('reads 7,210 t CO2 and 1,357 MWh for the plan, 16,093 t and 3,029 MWh for the baseline, 8,882 t avoided (hand computation)', () => {
    // P = C / 25.02525: plan 9,046.311 MWh → 0.15·P = 1,356.95 MWh, 0.85·P·9.65·97.17/1000 = 7,210.24 t;
    // baseline 20,190.459 MWh → 3,028.57 MWh, 16,092.54 t; avoided 16,092.54 − 7,210.24 = 8,882.30 t.
    expect(casePhysicalSentence(demoCaseInputs(), 226386.2, 505271.29)).toBe(
      'Fouling over the horizon stands for 7,210 t CO2 from extra fuel and 1,357 MWh of output lost in this plan, against ' +
        '16,093 t CO2 from extra fuel and 3,029 MWh of output lost in the baseline. The plan avoids 8,882 t CO2.',
    );
  });

  it('with monthly prices (fuel, replacement or CO2) it shows no quantities and says why; monthly load or CW alone does not stop it', () => {
    const monthly = { monthly: [2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 3] };
    for (const key of ['fuelPricePerMmbtu', 'replacementPricePerMwh', 'co2PricePerTonne'])
      expect(
        casePhysicalSentence(
          demoCaseInputs((r) => ((r.drivers as Record<string, unknown>)[key] = monthly)),
          226386.2,
          505271.29,
        ),
      ).toMatch(/^MWh and t CO2 are not shown: the prices change over the horizon/);
    expect(casePhysicalSentence(demoCaseInputs(), 226386.2, 505271.29)).toMatch(/^Fouling over the horizon stands for/);
  });

  it('with a cost-per-day curve entered instead of the condenser model it shows no quantities: that money was not made from the prices', () => {
    // The direct cost curve (here 4,000 a day at CF 0.6, nothing at 0.92) says nothing about fuel or MW; turning
    // it back with the drivers' prices would invent t CO2 and MWh the case never computed.
    const direct = demoCaseInputs((r) => {
      const unit = r.unit as Record<string, unknown>;
      delete unit.condenser;
      unit.activeTubes = 21860;
      r.directPenalty = {
        points: [
          { cleanliness: 0.6, costPerDay: 4000 },
          { cleanliness: 0.92, costPerDay: 0 },
        ],
      };
    });
    const sentence = casePhysicalSentence(direct, 226386.2, 505271.29);
    expect(sentence).not.toMatch(/t CO2 from extra fuel/);
    expect(sentence).toMatch(/^MWh and t CO2 are not shown: /);
  });
});

describe('4. edge cases', () => {
  it('share 0: no output lost, all CO2 from extra fuel; share 1: no CO2, all output lost (closed form)', () => {
    const none = { ...DEMO_BASIS, capacityLimitedShare: 0 };
    const p0 = physicalCost(1000, none, 24)!;
    // 1000 / (9.65 · 2.1) = 49.3461 MWh → 476.190 MMBtu → 46.2714 t
    expect(relative(p0.co2Tonnes, (1000 / 20.265) * 9.65 * 0.09717)).toBeLessThan(1e-12);
    expect(physicalCostWords(p0, 0, 'a day')).toEqual({
      output: 'no output lost: load is held with extra fuel in every hour',
      co2: '46 t CO2 a day from extra fuel',
    });
    expect(physicalCostParts(p0, 0, 'a day')).toEqual(['46 t CO2 a day']);

    const all = { ...DEMO_BASIS, capacityLimitedShare: 1 };
    const p1 = physicalCost(1000, all, 24)!;
    expect(relative(p1.lostMw!, 1000 / 52 / 24)).toBeLessThan(1e-12); // 0.80128 MW
    expect(physicalCostWords(p1, 1, 'a day')).toEqual({
      output: '0.8 MW less output in the 100 % of hours the unit is capacity-limited',
      co2: 'no extra fuel: the unit is capacity-limited in every hour',
    });
    expect(physicalCostParts(p1, 1, 'a day')).toEqual(['0.8 MW lost when capacity-limited']);
  });

  it('CO2 price 0 still gives the CO2 of the extra fuel (the tonnes do not depend on their price; closed form)', () => {
    const free = physicalCost(1000, { ...DEMO_BASIS, co2PricePerTonne: 0 })!;
    const priced = physicalCost(1000, { ...DEMO_BASIS, co2PricePerTonne: 30 })!;
    expect(free.co2Tonnes).toBeGreaterThan(0);
    // the same money buys less penalty when CO2 is priced: V = 0.85·9.65·(2.1 + 0.09717·30) + 7.8 = 48.8365 against 25.02525
    expect(relative(priced.penaltyMwh / free.penaltyMwh, 25.02525 / (0.85 * 9.65 * (2.1 + 0.09717 * 30) + 7.8))).toBeLessThan(1e-12);
  });

  it('a negative cost (cleaner than the reference) gives negative quantities and words that say "more output" and "less", never a minus zero', () => {
    const p = physicalCost(-599.5405754015362, DEMO_BASIS, 24)!;
    expect(p.lostMw!).toBeCloseTo(-0.998226084, 8);
    expect(p.co2Tonnes).toBeCloseTo(-19.09495316, 7);
    expect(physicalCostWords(p, 0.15, 'a day')).toEqual({
      output: '1.0 MW more output than at the reference cleanliness, in capacity-limited hours',
      co2: '19 t CO2 a day less than at the reference cleanliness',
    });
    expect(physicalCostShort(p, 0.15, 'a day')).toBe('1.0 MW gained when capacity-limited · 19 t CO2 a day less');
    const tiny = physicalCost(-0.001, DEMO_BASIS, 24)!;
    for (const text of [...Object.values(physicalCostWords(tiny, 0.15, 'a day')), ...physicalCostParts(tiny, 0.15, 'a day')]) {
      expect(text).not.toMatch(/[−-]0\b/);
      expect(text).toMatch(/under 0\.1/);
    }
  });

  it('a zero cost says nothing is lost; a missing cost, a missing price or prices that give a MWh no value give no figure', () => {
    expect(physicalCostShort(physicalCost(0, DEMO_BASIS, 24), 0.15, 'a day')).toBe('no MW or CO2 lost');
    expect(physicalCost(null, DEMO_BASIS)).toBeNull();
    expect(physicalCost(undefined, DEMO_BASIS)).toBeNull();
    expect(physicalCost(Number.NaN, DEMO_BASIS)).toBeNull();
    expect(physicalCost(100, { ...DEMO_BASIS, fuelPricePerMmbtu: Number.NaN })).toBeNull();
    // fuel free and no CO2 price with no capacity-limited hours: a MWh costs nothing, so money cannot say how many
    expect(physicalCost(100, { ...DEMO_BASIS, fuelPricePerMmbtu: 0, capacityLimitedShare: 0 })).toBeNull();
    // every hour capacity-limited at a negative replacement price
    expect(physicalCost(100, { ...DEMO_BASIS, replacementPricePerMwh: -20, capacityLimitedShare: 1 })).toBeNull();
    expect(physicalCostWords(null, 0.15, 'a day').output).toMatch(/not shown/);
    expect(physicalCostParts(null, 0.15, 'a day')).toEqual([]);
  });
});

describe('5. units and wording', () => {
  it('MW for a rate (hours given), MWh for a total (no hours), t CO2 with its period, thousands grouped', () => {
    const rate = physicalCost(120_000, DEMO_BASIS, 24)!;
    const total = physicalCost(120_000, DEMO_BASIS)!;
    // 120,000 / 25.02525 = 4,795.157 MWh; / 24 = 199.798 MW; 0.15 × 4,795.157 = 719.27 MWh; CO2 0.85·4,795.157·9.65·0.09717 = 3,821.85 t
    expect(physicalCostParts(rate, 0.15, 'a day')).toEqual(['200 MW lost when capacity-limited', '3,822 t CO2 a day']);
    expect(physicalCostParts(total, 0.15, 'in all')).toEqual(['719 MWh lost when capacity-limited', '3,822 t CO2 in all']);
    expect(physicalCostWords(total, 0.15, 'in all').output).toBe('719 MWh of output lost in the 15 % of hours the unit is capacity-limited');
  });

  it('one decimal below 10, whole numbers from 9.95 on, "under 0.1" below 0.05 (hand rounding)', () => {
    expect(formatQuantity(0.049)).toBe('under 0.1');
    expect(formatQuantity(0.05)).toBe('0.1');
    expect(formatQuantity(9.94)).toBe('9.9');
    expect(formatQuantity(9.95)).toBe('10');
    expect(formatQuantity(12_345.6)).toBe('12,346');
    expect(formatQuantity(-0.0001)).toBe('under 0.1');
  });
});
