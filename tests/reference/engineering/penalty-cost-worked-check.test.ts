/** Worked check of ENGINEERING.md §4 [derived]: 500 MW, 9,500 Btu/kWh, $3/MMBtu, 80 % capacity factor. */
import { describe, expect, it } from 'vitest';
import { penaltyCostPerHour, CO2_KG_PER_MMBTU } from '@shared/domain/turbine/index.js';

const HOURS_PER_YEAR = 8760;

describe('heat-rate penalty cost, worked check', () => {
  const base = {
    ratingMw: 500,
    loadFraction: 1,
    heatRateBtuKwh: 9500,
    outputPenaltyPct: 0,
    fuelPricePerMmbtu: 3,
    co2PricePerTonne: 0,
    co2KgPerMmbtu: 0,
    replacementPricePerMwh: 0,
  };

  it('a 100 % heat-rate "penalty" is the whole fuel bill: $99.864 M/yr at 80 % capacity factor', () => {
    const c = penaltyCostPerHour({ ...base, heatRatePenaltyPct: 100 });
    expect(c.fuelCostPerHour * HOURS_PER_YEAR * 0.8).toBeCloseTo(99_864_000, 4);
  });

  it('1 % heat rate costs $998,640/yr', () => {
    const c = penaltyCostPerHour({ ...base, heatRatePenaltyPct: 1 });
    expect(c.fuelCostPerHour * HOURS_PER_YEAR * 0.8).toBeCloseTo(998_640, 6);
  });

  it('CO2 is the extra fuel times the emission factor times the CO2 price', () => {
    // 1 % of 4,750 MMBtu/h = 47.5 MMBtu/h × 93.28 kg/MMBtu = 4.4308 t/h × $25/t
    const c = penaltyCostPerHour({ ...base, heatRatePenaltyPct: 1, co2KgPerMmbtu: CO2_KG_PER_MMBTU['bituminous-coal'], co2PricePerTonne: 25 });
    expect(c.co2CostPerHour).toBeCloseTo(47.5 * 0.09328 * 25, 9);
  });

  it('the capacity basis prices the lost MW at the replacement price', () => {
    const c = penaltyCostPerHour({ ...base, loadFraction: 0.8, heatRatePenaltyPct: 0, outputPenaltyPct: 1.5, replacementPricePerMwh: 70 });
    expect(c.capacityCostPerHour).toBeCloseTo(400 * 0.015 * 70, 9);
    expect(c.fuelCostPerHour).toBe(0);
  });
});
