import { describe, expect, it } from 'vitest';
import { calcScheduleInput } from '@shared/schemas/calc-schedule.js';
import type { InputSources } from '@shared/schemas/cases.js';
import { carryEntered, markEntered } from '../../../backend/src/services/cases/input-sources.js';

// A small hand-written schedule input (values invented for the test).
const base = calcScheduleInput.parse({
  startDate: '2026-04-01',
  horizonDays: 365,
  drivers: { cwInletC: 20, loadFraction: 0.85, fuelPricePerMmbtu: 3, replacementPricePerMwh: 50 },
  unit: { ratingMw: 300, heatRateBtuKwh: 9500, activeTubes: 15000 },
  directPenalty: {
    points: [
      { cleanliness: 0.6, costPerDay: 9000 },
      { cleanliness: 0.9, costPerDay: 0 },
    ],
  },
  fouling: { model: 'linear', ratePerDay: 0.001 },
  initial: { daysSinceCleaning: 30, cleanlinessAfterCleaning: 0.9 },
  methods: ['hp-water-lancing'],
  discountRate: 0.08,
});
const sources: InputSources = {
  'drivers.cwInletC': { source: 'measured', detail: 'monthly means' },
  'drivers.fuelPricePerMmbtu': { source: 'prefilled', detail: 'economics' },
  discountRate: { source: 'prefilled', detail: 'economics' },
  fouling: { source: 'measured', detail: 'fitted' },
};

describe('where each input of a case came from', () => {
  it('an edited driver and an edited top-level input become entered; the others keep their source', () => {
    const after = { ...base, discountRate: 0.1, drivers: { ...base.drivers, fuelPricePerMmbtu: 4 } };
    const marked = markEntered(base, after, sources, 'entered by Ann');
    expect(marked['drivers.fuelPricePerMmbtu']).toEqual({ source: 'entered', detail: 'entered by Ann' });
    expect(marked.discountRate?.source).toBe('entered');
    expect(marked['drivers.cwInletC']).toEqual(sources['drivers.cwInletC']);
    expect(marked.fouling).toEqual(sources.fouling);
  });

  it('the same value written with its keys in another order is not a change', () => {
    const reordered = { ...base, fouling: { ratePerDay: 0.001, model: 'linear' as const } };
    expect(markEntered(base, reordered, sources, 'x').fouling).toEqual(sources.fouling);
  });

  it('a copy keeps what was entered and takes the rest from the fresh prefill', () => {
    const original = { inputs: { ...base, discountRate: 0.11 }, inputSources: { ...sources, discountRate: { source: 'entered' as const, detail: 'by Ann' } } };
    const fresh = { inputs: { ...base, drivers: { ...base.drivers, fuelPricePerMmbtu: 5, cwInletC: 21 } }, inputSources: sources };
    const copy = carryEntered(original, fresh);
    const parsed = calcScheduleInput.parse(copy.inputs);
    expect(parsed.discountRate).toBe(0.11);
    expect(parsed.drivers.fuelPricePerMmbtu).toBe(5);
    expect(parsed.drivers.cwInletC).toBe(21);
    expect(copy.inputSources.discountRate?.source).toBe('entered');
  });
});
