import { describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { monthlyProfilesFromHistory } from '@shared/domain/decision/drivers/seasonal-drivers.js';
import { calcScheduleInput } from '@shared/schemas/calc-schedule.js';
import type { InputSources } from '@shared/schemas/cases.js';
import { TYPICAL_CLEANING_METHODS, type CleaningMethod } from '@shared/schemas/cleaning-method.js';
import {
  alignInitialToStart,
  baselineFor,
  caseWarnings,
  chooseMethods,
  MAX_CASE_METHODS,
  OUTAGE_LOOKAHEAD_DAYS,
} from '../../../backend/src/services/cases/case-prefill.js';
import { historyDays } from '../../../backend/src/services/cases/unit-history.js';
import { carryEntered } from '../../../backend/src/services/cases/input-sources.js';

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

describe('seasonal drivers from a short history', () => {
  const history = Array.from({ length: 59 }, (_, d) => ({ date: addDays('2026-01-01', d), cwInletC: 8, loadFraction: 0.7 }));

  it('months without history come from the design CW inlet and the history’s mean load, and are listed', () => {
    const p = monthlyProfilesFromHistory(history, { cwInletC: 18, loadFraction: 0.75 });
    expect(p.filledMonths).toEqual([3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(p.cwInletC.slice(0, 2)).toEqual([8, 8]);
    expect(p.cwInletC.slice(2)).toEqual(Array(10).fill(18));
    expect(p.loadFraction[5]).toBe(0.75);
  });

  it('without a design fill, gaps are filled from the neighbouring months as before', () => {
    expect(monthlyProfilesFromHistory(history).cwInletC[6]).toBe(8);
  });
});

describe('the load profile counts days off line', () => {
  it('a day with no valid point or a load below the minimum counts as load 0; its CW inlet is left out', () => {
    const days = historyDays(
      [
        { day: '2026-01-01', pointsUsed: 20, cwInletC: 10, loadMw: 270 },
        { day: '2026-01-02', pointsUsed: 0, cwInletC: null, loadMw: null },
        { day: '2026-01-03', pointsUsed: 5, cwInletC: 11, loadMw: 30 },
      ],
      300,
      0.4,
    );
    expect(days.map((d) => d.loadFraction)).toEqual([0.9, 0, 0]);
    expect(days.map((d) => d.cwInletC)).toEqual([10, null, 11]);
    const p = monthlyProfilesFromHistory(days);
    expect(p.loadFraction[0]).toBeCloseTo(0.3, 10);
    expect(p.cwInletC[0]).toBeCloseTo(10.5, 10);
  });
});

describe('a library larger than a case takes', () => {
  const method = (i: number, over: Partial<CleaningMethod>): CleaningMethod => ({
    ...TYPICAL_CLEANING_METHODS[1]!,
    id: `m-${i}`,
    name: `Method ${i}`,
    ...over,
  });
  it('prefills every on-line and derate method and the cheapest outage ones, at most twelve, and says so', () => {
    const library = [
      ...Array.from({ length: 14 }, (_, i) => method(i, { fixedCost: 100_000 - i * 1000 })),
      method(20, { unitDuringCleaning: 'online', fixedCost: 500_000 }),
      method(21, { unitDuringCleaning: 'derate', deratePct: 50, fixedCost: 400_000 }),
    ];
    const chosen = chooseMethods(library, 10_000);
    expect(chosen.methods).toHaveLength(MAX_CASE_METHODS);
    expect(chosen.methods.map((m) => m.id)).toContain('m-20');
    expect(chosen.methods.map((m) => m.id)).toContain('m-21');
    expect(chosen.methods.map((m) => m.id)).not.toContain('m-0'); // the dearest outage methods stay out
    expect(chosen.left).toBe(4);
  });
  it('a library of twelve or fewer is taken whole', () => {
    expect(chooseMethods([...TYPICAL_CLEANING_METHODS], 10_000)).toEqual({ methods: [...TYPICAL_CLEANING_METHODS], left: 0 });
  });
});

describe('the baseline a plant would follow', () => {
  it('with a planned outage in the horizon, the baseline cleans at every planned outage with the cheapest outage method', () => {
    const b = baselineFor([{ from: '2026-06-01', to: '2026-06-14' }], [...TYPICAL_CLEANING_METHODS], 15_000, '2026-04-01', 730);
    expect(b.baseline).toEqual({ kind: 'every-planned-outage', methodId: 'shot-tube-cleaners' });
    expect(b.detail).toMatch(/cheapest outage method/);
  });
  it('without an outage in the horizon (or without an outage method) the baseline is no cleaning', () => {
    expect(baselineFor([{ from: '2030-06-01', to: '2030-06-14' }], [...TYPICAL_CLEANING_METHODS], 15_000, '2026-04-01', 730).baseline).toEqual({
      kind: 'never',
    });
    expect(baselineFor([{ from: '2026-06-01', to: '2026-06-14' }], [TYPICAL_CLEANING_METHODS[0]!], 15_000, '2026-04-01', 730).baseline).toEqual({
      kind: 'never',
    });
  });
});

describe('the start and the days since the cleaning move together', () => {
  it('moving the start shifts the days since the cleaning when they were measured, not when entered', () => {
    const sources: InputSources = { initial: { source: 'measured', detail: 'fit' } };
    const later = { ...base, startDate: '2026-04-11' };
    expect(alignInitialToStart(later, base, sources).initial.daysSinceCleaning).toBe(40);
    expect(alignInitialToStart({ ...base, startDate: '2026-03-01' }, base, sources).initial.daysSinceCleaning).toBe(0);
    expect(alignInitialToStart(later, base, { initial: { source: 'entered', detail: 'by Ann' } }).initial.daysSinceCleaning).toBe(30);
    // the person changed the start and the initial condition together: theirs is kept
    expect(alignInitialToStart({ ...later, initial: { ...base.initial, daysSinceCleaning: 5 } }, base, sources).initial.daysSinceCleaning).toBe(5);
  });

  it('a copy with an entered start takes the fresh days since the cleaning shifted to that start', () => {
    const original = {
      inputs: { ...base, startDate: '2026-05-01' },
      inputSources: { startDate: { source: 'entered' as const, detail: 'by Ann' }, initial: { source: 'measured' as const, detail: 'fit' } },
    };
    const fresh = {
      inputs: { ...base, startDate: '2026-04-20', initial: { ...base.initial, daysSinceCleaning: 50 } },
      inputSources: { initial: { source: 'measured' as const, detail: 'fit' } },
    };
    const copy = calcScheduleInput.parse(carryEntered(original, fresh).inputs);
    expect(copy.startDate).toBe('2026-05-01');
    expect(copy.initial.daysSinceCleaning).toBe(61);
  });

  it('a copy with entered planned outages keeps the horizon they were entered for', () => {
    const original = {
      inputs: { ...base, horizonDays: 900, plannedOutages: [{ from: '2028-06-01', to: '2028-06-10' }] },
      inputSources: { plannedOutages: { source: 'entered' as const, detail: 'by Ann' }, horizonDays: { source: 'prefilled' as const, detail: 'two years' } },
    };
    const fresh = { inputs: { ...base, horizonDays: 730 }, inputSources: {} };
    const copy = calcScheduleInput.parse(carryEntered(original, fresh).inputs);
    expect(copy.horizonDays).toBe(900);
    expect(copy.plannedOutages).toEqual(original.inputs.plannedOutages);
  });
});

describe('warnings a case carries beside the calculation’s', () => {
  const sources: InputSources = {
    'drivers.cwInletC': { source: 'prefilled', detail: 'measured in 2 of 12 months' },
    fouling: { source: 'measured', detail: 'fitted over 31 days' },
  };
  it('a start before the last data day, a start more than a year ahead, few measured months and a short fit are each named', () => {
    const w = caseWarnings(
      { inputs: { ...base, startDate: '2026-03-01' }, inputSources: sources, lastDataDay: '2026-03-20', measuredMonths: 2, fittedSpanDays: 31 },
      '2026-03-21',
    );
    expect(w.join(' ')).toMatch(/starts on 1 Mar 2026, before the last day of data/);
    expect(w.join(' ')).toMatch(/2 of 12 months/);
    expect(w.join(' ')).toMatch(/31 days .* extrapolated .* 365/);
    const ahead = caseWarnings(
      { inputs: { ...base, startDate: '2027-06-01' }, inputSources: sources, lastDataDay: '2026-03-20', measuredMonths: 12, fittedSpanDays: 200 },
      '2026-03-21',
    );
    expect(ahead.join(' ')).toMatch(/more than a year ahead/);
    const fine = caseWarnings(
      { inputs: { ...base, startDate: '2026-03-22' }, inputSources: sources, lastDataDay: '2026-03-20', measuredMonths: 12, fittedSpanDays: 200 },
      '2026-03-21',
    );
    expect(fine).toEqual([]);
  });
  it('outages are prefilled as far as the longest horizon', () => {
    expect(OUTAGE_LOOKAHEAD_DAYS).toBe(1830);
  });
});
