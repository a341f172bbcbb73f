import { describe, expect, it } from 'vitest';
import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { casePhysicalSentence } from '@shared/text/case-physical-text';

// Closed form, as in physical-cost.test.ts: HR 10,000 Btu/kWh, fuel 3 per MMBtu, 50 kg CO2/MMBtu at 20 per tonne,
// replacement 60 per MWh, a quarter of hours capacity-limited: a MWh of penalty costs 0.75 × 10 × 4 + 0.25 × 60 = 45.
const inputs = (over: Partial<CalcScheduleInput['drivers']> = {}) =>
  ({
    drivers: { cwInletC: 20, loadFraction: 0.8, fuelPricePerMmbtu: 3, replacementPricePerMwh: 60, co2PricePerTonne: 20, interpolation: 'mid-month', ...over },
    unit: { heatRateBtuKwh: 10_000, co2KgPerMmbtu: 50, capacityLimitedShare: 0.25 },
  }) as unknown as CalcScheduleInput;

describe('a case’s fouling cost as CO2 and lost output', () => {
  it('turns the plan’s and the baseline’s fouling cost into t CO2 and MWh and says how much CO2 the plan avoids', () => {
    // plan 450,000 → 10,000 MWh: 7,500 MWh at load held → 75,000 MMBtu → 3,750 t; 2,500 MWh lost
    // baseline 900,000 → 20,000 MWh: 7,500 t CO2 and 5,000 MWh
    expect(casePhysicalSentence(inputs(), 450_000, 900_000)).toBe(
      'Fouling over the horizon stands for 3,750 t CO2 from extra fuel and 2,500 MWh of output lost in this plan, against 7,500 t CO2 from extra fuel and 5,000 MWh of output lost in the baseline. The plan avoids 3,750 t CO2.',
    );
  });

  it('says why there are no quantities when prices change over the horizon', () => {
    const monthly = { monthly: [3, 3, 3, 3, 3, 3, 4, 4, 4, 4, 4, 4] } as unknown as number;
    expect(casePhysicalSentence(inputs({ fuelPricePerMmbtu: monthly }), 450_000, 900_000)).toMatch(/^MWh and t CO2 are not shown: the prices change/);
  });

  it('says plainly when fouling costs nothing in either', () => {
    expect(casePhysicalSentence(inputs(), 0, 0)).toBe('Fouling costs nothing over the horizon in the plan or the baseline: no extra fuel and no output lost.');
  });
});
