import { describe, expect, it } from 'vitest';
import { physicalCost, type PhysicalCostBasis } from '@shared/domain/turbine/physical-cost';
import { penaltyCostPerHour } from '@shared/domain/turbine/penalty-cost';
import { physicalCostParts, physicalCostShort, physicalCostWords } from '@shared/text/physical-cost-text';

// Hand-computed, closed form. Value of one MWh of penalty (heat-rate equivalent):
//   load held (1 − s of hours): HR/1000 MMBtu/MWh × (fuel price + CO2 kg/MMBtu / 1000 × CO2 price)
//                              = 10 × (3 + 50/1000 × 20) = 10 × 4 = 40 per MWh, weighted 0.75 → 30
//   firing held (s of hours): replacement price 60 per MWh, weighted 0.25 → 15
//   together 45 per MWh.
const BASIS: PhysicalCostBasis = {
  heatRateBtuKwh: 10_000,
  fuelPricePerMmbtu: 3,
  co2KgPerMmbtu: 50,
  co2PricePerTonne: 20,
  replacementPricePerMwh: 60,
  capacityLimitedShare: 0.25,
};

describe('physical quantities behind a fouling cost (closed form)', () => {
  it('a day costing 10,800 at 45 per MWh is 240 MWh of penalty: 10 MW, 60 MWh lost in capacity-limited hours, 1,800 MMBtu and 90 t CO2 in the others', () => {
    const p = physicalCost(10_800, BASIS, 24)!;
    expect(p.penaltyMwh).toBeCloseTo(240, 9); // 10,800 / 45
    expect(p.lostMw).toBeCloseTo(10, 9); // 240 MWh / 24 h
    expect(p.lostMwh).toBeCloseTo(60, 9); // 0.25 × 240
    expect(p.extraFuelMmbtu).toBeCloseTo(1_800, 9); // 0.75 × 240 MWh × 10 MMBtu/MWh
    expect(p.co2Tonnes).toBeCloseTo(90, 9); // 1,800 × 50 kg / 1000
  });

  it('turns back exactly what the cost per hour was made of (the forward formula of the monitoring calculation)', () => {
    // 400 MW load, 1.5 % heat-rate penalty; output penalty taken equal (the heat-rate equivalent the inverse returns)
    const c = penaltyCostPerHour({ ratingMw: 400, loadFraction: 1, heatRatePenaltyPct: 1.5, outputPenaltyPct: 1.5, ...BASIS });
    const s = BASIS.capacityLimitedShare;
    const perHour = (1 - s) * (c.fuelCostPerHour + c.co2CostPerHour) + s * c.capacityCostPerHour;
    const p = physicalCost(perHour * 24, BASIS, 24)!;
    expect(p.lostMw).toBeCloseTo(6, 9); // 400 × 1.5 %
    expect(p.extraFuelMmbtu).toBeCloseTo(0.75 * 24 * 60, 9); // 6 MW × 10 MMBtu/MWh = 60 MMBtu/h in 18 h
    expect(p.co2Tonnes).toBeCloseTo((0.75 * 24 * 60 * 50) / 1000, 9);
  });

  it('without hours there is no MW figure, and the energies do not depend on the hours', () => {
    const p = physicalCost(10_800, BASIS)!;
    expect(p.lostMw).toBeNull();
    expect(p.co2Tonnes).toBeCloseTo(90, 9);
  });

  it('a unit never capacity-limited loses no output, one always capacity-limited burns no extra fuel', () => {
    const heldLoad = physicalCost(4_000, { ...BASIS, capacityLimitedShare: 0 }, 24)!; // 4,000 / 40 = 100 MWh
    expect(heldLoad.lostMwh).toBe(0);
    expect(heldLoad.extraFuelMmbtu).toBeCloseTo(1_000, 9);
    const heldFiring = physicalCost(6_000, { ...BASIS, capacityLimitedShare: 1 }, 24)!; // 6,000 / 60 = 100 MWh
    expect(heldFiring.lostMwh).toBeCloseTo(100, 9);
    expect(heldFiring.co2Tonnes).toBe(0);
  });

  it('a negative cost (cleaner than the reference) gives negative quantities; zero gives zero', () => {
    const p = physicalCost(-450, BASIS, 24)!; // −10 MWh
    expect(p.lostMwh).toBeCloseTo(-2.5, 9);
    expect(p.co2Tonnes).toBeCloseTo(-3.75, 9); // −10 × 0.75 × 10 MMBtu × 50 kg / 1000
    expect(physicalCost(0, BASIS, 24)!.co2Tonnes).toBe(0);
  });

  it('when the prices give a MWh no value (or a negative one) the quantities cannot be told from the cost', () => {
    expect(physicalCost(1_000, { ...BASIS, fuelPricePerMmbtu: 0, co2PricePerTonne: 0, replacementPricePerMwh: 0 }, 24)).toBeNull();
    expect(physicalCost(1_000, { ...BASIS, capacityLimitedShare: 1, replacementPricePerMwh: -20 }, 24)).toBeNull();
    expect(physicalCost(Number.NaN, BASIS, 24)).toBeNull();
    expect(physicalCost(null, BASIS, 24)).toBeNull();
  });
});

describe('the physical quantities in words', () => {
  it('names the lost output with the share of hours it applies to, and the CO2 of the extra fuel, each with its unit', () => {
    const w = physicalCostWords(physicalCost(10_800, BASIS, 24), BASIS.capacityLimitedShare, 'a day');
    expect(w.output).toBe('10 MW less output in the 25 % of hours the unit is capacity-limited');
    expect(w.co2).toBe('90 t CO2 a day from extra fuel in the other hours');
  });

  it('says what zero and negative figures mean instead of showing "−0 MW"', () => {
    const none = physicalCostWords(physicalCost(0, BASIS, 24), 0.25, 'a day');
    expect(none.output).toBe('no output lost');
    expect(none.co2).toBe('no extra CO2');
    const better = physicalCostWords(physicalCost(-450, BASIS, 24), 0.25, 'a day');
    expect(better.output).toBe('0.4 MW more output than at the reference cleanliness, in capacity-limited hours'); // 10 MWh / 24 h
    expect(better.co2).toBe('3.8 t CO2 a day less than at the reference cleanliness'); // 3.75 t
    const tiny = physicalCostWords(physicalCost(0.45, BASIS, 24), 0.25, 'a day');
    expect(tiny.output).toBe('under 0.1 MW less output in the 25 % of hours the unit is capacity-limited');
    expect(tiny.co2).toBe('under 0.1 t CO2 a day from extra fuel in the other hours');
    expect(tiny.output).not.toMatch(/[−-]0/);
  });

  it('says why a quantity is absent: never capacity-limited, always capacity-limited, or prices that say nothing', () => {
    const heldLoad = physicalCostWords(physicalCost(4_000, { ...BASIS, capacityLimitedShare: 0 }, 24), 0, 'a day');
    expect(heldLoad.output).toBe('no output lost: load is held with extra fuel in every hour');
    const heldFiring = physicalCostWords(physicalCost(6_000, { ...BASIS, capacityLimitedShare: 1 }, 24), 1, 'a day');
    expect(heldFiring.co2).toBe('no extra fuel: the unit is capacity-limited in every hour');
    const unknown = physicalCostWords(null, 0.25, 'a day');
    expect(unknown.output).toBe('MW and t CO2 not shown: the unit’s prices give no value to a MWh');
    expect(unknown.co2).toBeNull();
  });

  it('a share that would round to 0 % or 100 % keeps a decimal, and a CO2 factor of 0 says so instead of "under 0.1 t"', () => {
    const rare = physicalCostWords(physicalCost(10_800, { ...BASIS, capacityLimitedShare: 0.004 }, 24), 0.004, 'a day');
    expect(rare.output).toMatch(/in the 0\.4 % of hours/);
    const mostly = physicalCostWords(physicalCost(10_800, { ...BASIS, capacityLimitedShare: 0.998 }, 24), 0.998, 'a day');
    expect(mostly.output).toMatch(/in the 99\.8 % of hours/);
    const noFactor = physicalCostWords(physicalCost(10_800, { ...BASIS, co2KgPerMmbtu: 0 }, 24), 0.25, 'a day');
    expect(noFactor.co2).toBe('no CO2 counted: the CO2 factor of the unit’s fuel is set to 0');
    expect(physicalCostParts(physicalCost(10_800, { ...BASIS, co2KgPerMmbtu: 0 }, 24), 0.25, 'a day')).toEqual([
      '12 MW lost when capacity-limited', // 10,800 / (0.75 × 10 × 3 + 0.25 × 60 = 37.5) = 288 MWh over 24 h
      'no CO2 counted (CO2 factor 0)',
    ]);
  });

  it('writes a period total with grouped thousands and the period named', () => {
    const w = physicalCostWords(physicalCost(1_080_000, BASIS), 0.25, 'since the last cleaning');
    expect(w.output).toBe('6,000 MWh of output lost in the 25 % of hours the unit is capacity-limited');
    expect(w.co2).toBe('9,000 t CO2 since the last cleaning from extra fuel in the other hours');
  });
});

describe('the physical quantities short, for a table cell', () => {
  it('gives MW (or MWh without hours) and t CO2 with their units', () => {
    expect(physicalCostShort(physicalCost(10_800, BASIS, 24), 0.25, 'a day')).toBe('10 MW lost when capacity-limited · 90 t CO2 a day');
    expect(physicalCostShort(physicalCost(1_080_000, BASIS), 0.25, 'since cleaning')).toBe('6,000 MWh lost when capacity-limited · 9,000 t CO2 since cleaning');
  });

  it('leaves out what the share of hours rules out, and says what zero and negative mean', () => {
    expect(physicalCostShort(physicalCost(4_000, { ...BASIS, capacityLimitedShare: 0 }, 24), 0, 'a day')).toBe('50 t CO2 a day'); // 100 MWh × 10 × 50 / 1000
    expect(physicalCostShort(physicalCost(6_000, { ...BASIS, capacityLimitedShare: 1 }, 24), 1, 'a day')).toBe('4.2 MW lost when capacity-limited'); // 100 MWh / 24 h
    expect(physicalCostShort(physicalCost(0, BASIS, 24), 0.25, 'a day')).toBe('no MW or CO2 lost');
    expect(physicalCostShort(physicalCost(-450, BASIS, 24), 0.25, 'a day')).toBe('0.4 MW gained when capacity-limited · 3.8 t CO2 a day less');
    expect(physicalCostShort(null, 0.25, 'a day')).toBeNull();
  });
});

describe('the physical quantities as parts, one line each in a table cell', () => {
  it('gives one part per quantity, none when they cannot be told', () => {
    expect(physicalCostParts(physicalCost(10_800, BASIS, 24), 0.25, 'a day')).toEqual(['10 MW lost when capacity-limited', '90 t CO2 a day']);
    expect(physicalCostParts(null, 0.25, 'a day')).toEqual([]);
  });
});
