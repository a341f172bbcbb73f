/**
 * The pure steps of a unit's recompute (backend/src/services/derived): daily cleanliness and witnesses →
 * air in-leakage verdicts → fouling cycles → per-sample analysis, and the rules they share. The steps that
 * read or write the database (read valid samples, write-back, daily aggregates, cleaning outlook) are covered
 * through the API by tests/api/unit-recompute.test.ts and tests/api/unit-health.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { buildUnitModel } from '@shared/domain/monitoring/index.js';
import { measureDailyCleanliness, witnessMedians } from '@backend/services/derived/daily-witnesses.js';
import { judgeAirLeaks } from '@backend/services/derived/air-leak-verdicts.js';
import { fitCycles, trendCleanlinessOn } from '@backend/services/derived/fouling-cycles.js';
import { analyseSamples } from '@backend/services/derived/sample-analysis.js';
import type { StoredSample } from '@backend/services/derived/read-valid-samples.js';
import { cleaningMarks, plannedOutages, pluggedTubesOn } from '@backend/services/derived/unit-context.js';
import { modelRejection, reasonLeftOut, validForCalculations } from '@backend/repositories/sample-validity.js';
import { MODEL, SETUP, sampleAt } from '../monitoring/monitoring-fixture.js';

const START = '2025-01-01';
const dayOf = (ts: number) => new Date(ts).toISOString().slice(0, 10);
const plugged = () => SETUP.condenser.pluggedTubes;
let nextId = 1;

/** A stored sample at noon UTC of `day` whose measured cleanliness is `cleanliness`. */
function stored(day: string, cleanliness: number, extra: Partial<StoredSample> = {}): StoredSample {
  return {
    id: String(nextId++),
    ts: new Date(`${day}T12:00:00Z`),
    ...sampleAt(MODEL, { cleanliness }),
    hotwellC: null,
    dissolvedOxygenPpb: null,
    airRemovalKgS: null,
    validity: 'ok',
    ...extra,
  };
}

/** `n` days of samples fouling from 0.90 down by `rate` a day, two points a day. */
function foulingDays(n: number, rate: number, from = START): StoredSample[] {
  return Array.from({ length: n }, (_, i) => [stored(addDays(from, i), 0.9 - rate * i), stored(addDays(from, i), 0.9 - rate * i)]).flat();
}

describe('daily cleanliness and witnesses', () => {
  it('gives each plant-local day the median measured cleanliness of its points', async () => {
    const rows = [stored(START, 0.8), stored(START, 0.84), stored(START, 0.86), stored(addDays(START, 1), 0.7)];
    const m = await measureDailyCleanliness({ model: MODEL, dayOf, pluggedTubesOn: plugged, samples: [rows] });
    expect(m.days).toEqual([START, addDays(START, 1)]);
    expect(m.dailyCleanliness.get(START)).toBeCloseTo(0.84, 3);
    expect(m.dailyCleanliness.get(addDays(START, 1))).toBeCloseTo(0.7, 3);
  });

  it('leaves a point the model finds implausible out of the day', async () => {
    const wild = stored(START, 0.85, { backpressureKpa: 60 });
    const m = await measureDailyCleanliness({ model: MODEL, dayOf, pluggedTubesOn: plugged, samples: [[stored(START, 0.85), wild]] });
    expect(m.perDay.get(START)!.cf).toHaveLength(1);
  });

  it('takes the day’s witness medians where they were measured and null where not', async () => {
    const rows = [
      stored(START, 0.85, { dissolvedOxygenPpb: 5 }),
      stored(START, 0.85, { dissolvedOxygenPpb: 9 }),
      stored(START, 0.85, { dissolvedOxygenPpb: 7 }),
    ];
    const m = await measureDailyCleanliness({ model: MODEL, dayOf, pluggedTubesOn: plugged, samples: [rows] });
    expect(witnessMedians(m, START)).toEqual({ subcoolingK: null, dissolvedOxygenPpb: 7, airRemovalKgS: null });
    expect(witnessMedians(m, addDays(START, 5))).toEqual({ subcoolingK: null, dissolvedOxygenPpb: null, airRemovalKgS: null });
  });

  it('when the design point is outside what a condenser may read, no day is measured', async () => {
    // A design duty of another unit (ten times this one's) puts the modelled design point above 50 kPa.
    const broken = buildUnitModel({ ...SETUP, condenser: { ...SETUP.condenser, designDutyMw: 5000 } });
    const m = await measureDailyCleanliness({ model: broken, dayOf, pluggedTubesOn: plugged, samples: [[stored(START, 0.85)]] });
    expect(m.days).toEqual([]);
  });
});

describe('air in-leakage verdicts', () => {
  it('suspects none in steady fouling, and suspects the days of a sudden loss with dissolved oxygen rising', async () => {
    const quiet = foulingDays(40, 0.0005).map((r) => ({ ...r, dissolvedOxygenPpb: 6 }));
    const steady = judgeAirLeaks(await measureDailyCleanliness({ model: MODEL, dayOf, pluggedTubesOn: plugged, samples: [quiet] }), []);
    expect(steady.suspectedDays.size).toBe(0);
    expect(steady.periods).toEqual([]);

    const leakFrom = addDays(START, 30);
    const leaking = quiet.map((r) => (dayOf(r.ts.getTime()) >= leakFrom ? stored(dayOf(r.ts.getTime()), 0.8, { dissolvedOxygenPpb: 30 }) : r));
    const v = judgeAirLeaks(await measureDailyCleanliness({ model: MODEL, dayOf, pluggedTubesOn: plugged, samples: [leaking] }), []);
    expect(v.suspectedDays.has(leakFrom)).toBe(true);
    expect(v.periods[0]?.from).toBe(leakFrom);
    expect(v.periods[0]?.evidence).toContain('dissolved-oxygen');
  });
});

describe('fouling cycles', () => {
  const daily = new Map(Array.from({ length: 60 }, (_, i) => [addDays(START, i), 0.9 - 0.002 * (i % 30)] as [string, number]));

  it('a cleaning starts a new cycle from the day it ended', () => {
    const cycles = fitCycles(daily, [{ date: addDays(START, 30), cleanlinessAfter: null }], new Set());
    expect(cycles.map((c) => [c.startDay, c.endDay])).toEqual([
      [START, addDays(START, 30)],
      [addDays(START, 30), null],
    ]);
    expect(cycles.every((c) => c.result.status === 'fitted')).toBe(true);
    expect(trendCleanlinessOn(cycles, addDays(START, 29))!).toBeLessThan(trendCleanlinessOn(cycles, addDays(START, 31))!);
  });

  it('days suspected of air in-leakage stay out of the fit', () => {
    const all = fitCycles(daily, [], new Set());
    const without = fitCycles(daily, [], new Set([...daily.keys()].slice(0, 50)));
    expect(all[0]?.result.status).toBe('fitted');
    expect(without[0]?.result.status).not.toBe('fitted');
  });
});

describe('per-sample analysis', () => {
  it('an accepted point is ok with its analysis; a rejected one records the model’s reason and no figures', () => {
    const good = stored(START, 0.85);
    const wild = stored(START, 0.85, { backpressureKpa: 60 });
    const [a, b] = analyseSamples({ model: MODEL, dayOf, pluggedTubesOn: plugged, cycles: [] }, [good, wild]);
    expect(a).toMatchObject({ id: good.id, validity: 'ok' });
    expect(a?.analysis?.cleanliness).toBeCloseTo(0.85, 3);
    expect(b?.id).toBe(wild.id);
    expect(b?.validity).toMatch(/^model:[a-z-]+$/);
    expect(b?.analysis).toBeNull();
  });
});

describe('the unit’s events as the steps read them', () => {
  const ev = (kind: string, startDate: string, endDate: string | null, o: { pluggedTubesAfter?: number; cleanlinessAfter?: number } = {}) => ({
    kind: kind as never,
    startDate,
    endDate,
    pluggedTubesAfter: o.pluggedTubesAfter ?? null,
    cleanlinessAfter: o.cleanlinessAfter ?? null,
  });
  const events = [
    ev('tube-plugging', '2025-03-01', null, { pluggedTubesAfter: 200 }),
    ev('cleaning', '2025-04-01', '2025-04-05', { cleanlinessAfter: 0.88 }),
    ev('outage', '2025-06-01', '2025-06-10'),
    ev('outage', '2025-09-01', null),
  ];

  it('plugged tubes follow the latest plugging event on or before the day, else the setup', () => {
    const on = pluggedTubesOn(events, 120);
    expect(on('2025-02-28')).toBe(120);
    expect(on('2025-03-01')).toBe(200);
  });

  it('a cleaning marks the day it ended; only outages with an end are planned', () => {
    expect(cleaningMarks(events)).toEqual([{ date: '2025-04-05', cleanlinessAfter: 0.88 }]);
    expect(plannedOutages(events)).toEqual([{ from: '2025-06-01', to: '2025-06-10' }]);
  });
});

describe('which samples count', () => {
  it('only an analysed ok row is valid for the calculations; the others are counted by reason', () => {
    expect(validForCalculations({ validity: 'ok', cleanliness: 0.8 })).toBe(true);
    expect(validForCalculations({ validity: 'ok', cleanliness: null })).toBe(false);
    expect(validForCalculations({ validity: 'model:cleanliness-out-of-range', cleanliness: null })).toBe(false);
    expect(reasonLeftOut({ validity: 'ok' })).toBe('not-analysed');
    expect(reasonLeftOut({ validity: 'low-load' })).toBe('low-load');
  });

  it('a model rejection fits the 32-character validity column', () => {
    expect(modelRejection(null)).toBe('model:error');
    expect(modelRejection('a-very-long-reason-that-goes-on-and-on')).toHaveLength(32);
  });
});
