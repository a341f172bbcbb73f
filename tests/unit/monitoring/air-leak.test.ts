/**
 * Suspected air in-leakage from daily figures (ENGINEERING.md §3): a sudden cleanliness loss with rising
 * subcooling, dissolved oxygen or air-removal flow, against fouling, which trends over weeks and leaves the
 * witnesses alone [pub: Putman & Harpster, EPRI condenser conference papers, as ENGINEERING.md §3 cites].
 */
import { describe, expect, it } from 'vitest';
import { airLeakPeriods, DEFAULT_AIR_LEAK_SETTINGS, judgeAirLeakDays, type AirLeakDay, type AirLeakDayVerdict } from '@shared/domain/monitoring/index.js';
import { addDays } from '@shared/domain/calendar/plant-date.js';

const START = '2024-03-01';

interface Witnesses {
  subcoolingK: number | null;
  dissolvedOxygenPpb: number | null;
  airRemovalKgS: number | null;
}

/** Quiet witnesses of a tight condenser (values made up, of the usual order). */
const NORMAL: Witnesses = { subcoolingK: 0.6, dissolvedOxygenPpb: 6, airRemovalKgS: 0.012 };
const UNMEASURED: Witnesses = { subcoolingK: null, dissolvedOxygenPpb: null, airRemovalKgS: null };

/** Days of a slowly fouling condenser: 0.90 falling by `ratePerDay`, with an extra loss and witnesses per day. */
function series(n: number, o: { ratePerDay?: number; loss?: (i: number) => number; witnesses?: (i: number) => Witnesses } = {}): AirLeakDay[] {
  const rate = o.ratePerDay ?? 0.0005;
  return Array.from({ length: n }, (_, i) => ({
    day: addDays(START, i),
    cleanliness: 0.9 - rate * i - (o.loss?.(i) ?? 0),
    ...(o.witnesses?.(i) ?? NORMAL),
  }));
}

const inside = (i: number, from: number, days: number) => i >= from && i < from + days;
const suspectedDays = (v: AirLeakDayVerdict[]) => v.filter((d) => d.suspected).map((d) => d.day);

describe('suspected air in-leakage', () => {
  it('finds nothing in steady fouling with quiet witnesses', () => {
    const v = judgeAirLeakDays(series(120));
    expect(suspectedDays(v)).toEqual([]);
    expect(airLeakPeriods(v)).toEqual([]);
  });

  it('finds nothing in fast steady fouling (CF falling 0.009 per day) when subcooling, oxygen and air removal are measured and flat', () => {
    const v = judgeAirLeakDays(series(60, { ratePerDay: 0.009 }));
    expect(suspectedDays(v)).toEqual([]);
  });

  it('finds nothing in fouling linear in resistance (0.90 to 0.45 in 90 days, ENGINEERING.md §5) with flat witnesses', () => {
    // derived (§5): CF(t) = 1/(1/CF0 + k·t), k chosen so CF(89) = 0.45.
    const k = (1 / 0.45 - 1 / 0.9) / 89;
    const days = Array.from({ length: 90 }, (_, i) => ({ day: addDays(START, i), cleanliness: 1 / (1 / 0.9 + k * i), ...NORMAL }));
    expect(suspectedDays(judgeAirLeakDays(days))).toEqual([]);
  });

  it('finds nothing in steady fouling without any witness measured, since it is no step against the recent trend', () => {
    expect(suspectedDays(judgeAirLeakDays(series(60, { ratePerDay: 0.009, witnesses: () => UNMEASURED })))).toEqual([]);
  });

  it('still finds a 0.06 step with subcooling +2 K in the middle of fast fouling, and only its days', () => {
    const v = judgeAirLeakDays(
      series(60, {
        ratePerDay: 0.009,
        loss: (i) => (inside(i, 30, 8) ? 0.06 : 0),
        witnesses: (i) => (inside(i, 30, 8) ? { ...NORMAL, subcoolingK: 2.6 } : NORMAL),
      }),
    );
    expect(airLeakPeriods(v).map((p) => [p.from, p.to])).toEqual([[addDays(START, 30), addDays(START, 37)]]);
  });

  it('takes a large sudden drop with measured, unmoved witnesses for fouling or an instrument, not a leak', () => {
    const v = judgeAirLeakDays(series(60, { loss: (i) => (inside(i, 30, 5) ? 0.12 : 0) }));
    expect(suspectedDays(v)).toEqual([]);
    expect(v[31]?.drop).toBeCloseTo(0.12, 6);
  });

  it('does not let a flagged period freeze the reference: once the witnesses settle, fouling after a leak is not flagged', () => {
    // A 10-day leak with subcooling +2 K, then 50 more days of fast fouling with quiet witnesses.
    const v = judgeAirLeakDays(
      series(90, {
        ratePerDay: 0.004,
        loss: (i) => (inside(i, 30, 10) ? 0.06 : 0),
        witnesses: (i) => (inside(i, 30, 10) ? { ...NORMAL, subcoolingK: 2.6 } : NORMAL),
      }),
    );
    expect(airLeakPeriods(v).map((p) => [p.from, p.to])).toEqual([[addDays(START, 30), addDays(START, 39)]]);
  });

  it('judges a long-lasting witness rise against recent days after at most 60 days, so the reference moves on', () => {
    // Subcooling and oxygen up for good from day 20 (e.g. a changed instrument): flagged at first, not for ever.
    const v = judgeAirLeakDays(
      series(120, { loss: (i) => (i >= 20 ? 0.05 : 0), witnesses: (i) => (i >= 20 ? { ...NORMAL, subcoolingK: 2.6, dissolvedOxygenPpb: 20 } : NORMAL) }),
    );
    expect(v[20]?.suspected).toBe(true);
    expect(v.slice(90).some((d) => d.suspected)).toBe(false);
  });

  it('finds one period with its dates and evidence for a sudden 0.06 cleanliness loss over 10 days with subcooling +2 K and oxygen ×3', () => {
    const from = 40;
    const v = judgeAirLeakDays(
      series(90, {
        loss: (i) => (inside(i, from, 10) ? 0.06 : 0),
        witnesses: (i) =>
          inside(i, from, 10) ? { ...NORMAL, subcoolingK: NORMAL.subcoolingK! + 2, dissolvedOxygenPpb: NORMAL.dissolvedOxygenPpb! * 3 } : NORMAL,
      }),
    );
    const periods = airLeakPeriods(v);
    expect(periods).toHaveLength(1);
    expect(periods[0]?.from).toBe(addDays(START, from));
    expect(periods[0]?.to).toBe(addDays(START, from + 9));
    expect(periods[0]?.evidence).toEqual(expect.arrayContaining(['cleanliness-drop', 'subcooling', 'dissolved-oxygen']));
    expect(periods[0]?.evidence).not.toContain('air-removal');
    // derived: judged against the straight fouling trend of the days before, the drop is the step itself.
    expect(periods[0]?.maxDrop).toBeCloseTo(0.06, 6);
    expect(suspectedDays(v)).toHaveLength(10);
  });

  it('finds nothing when the same 0.06 loss comes gradually over 60 days (fouling trends over weeks)', () => {
    // pub: Putman & Harpster (EPRI condenser conference papers, as ENGINEERING.md §3 cites): fouling trends over weeks.
    const v = judgeAirLeakDays(series(120, { loss: (i) => 0.06 * Math.min(1, Math.max(0, i - 30) / 60) }));
    expect(airLeakPeriods(v)).toEqual([]);
  });

  it('finds a leak that opens over three weeks (CF −0.06, subcooling +2 K, oxygen ×3, air removal ×2), which the recent reference follows', () => {
    // The witnesses more than double while fouling leaves them alone (ENGINEERING.md §3): held against days 30–45 back.
    const ramp = (i: number) => (i < 80 ? Math.min(1, Math.max(0, (i - 40) / 20)) : 0);
    const v = judgeAirLeakDays(
      series(140, {
        ratePerDay: 0.003,
        loss: (i) => 0.06 * ramp(i),
        witnesses: (i) => ({ subcoolingK: 0.6 + 2 * ramp(i), dissolvedOxygenPpb: 6 * (1 + 2 * ramp(i)), airRemovalKgS: 0.012 * (1 + ramp(i)) }),
      }),
    );
    const periods = airLeakPeriods(v);
    expect(periods).toHaveLength(1);
    expect(periods[0]!.from >= addDays(START, 45) && periods[0]!.from <= addDays(START, 55)).toBe(true);
    expect(periods[0]?.to).toBe(addDays(START, 79));
    expect(periods[0]?.evidence).toEqual(expect.arrayContaining(['subcooling', 'dissolved-oxygen']));
    expect(v.slice(82).some((d) => d.suspected)).toBe(false);
  });

  it('keeps a leak longer than the 14-day reference window as one period, judged against the days before it began', () => {
    expect(DEFAULT_AIR_LEAK_SETTINGS.baselineDays).toBe(14);
    const from = 30;
    const length = 35;
    const v = judgeAirLeakDays(
      series(100, {
        loss: (i) => (inside(i, from, length) ? 0.06 : 0),
        witnesses: (i) => (inside(i, from, length) ? { ...NORMAL, subcoolingK: 2.6, airRemovalKgS: 0.03 } : NORMAL),
      }),
    );
    const periods = airLeakPeriods(v);
    expect(periods).toHaveLength(1);
    expect(periods[0]).toMatchObject({ from: addDays(START, from), to: addDays(START, from + length - 1) });
    expect(periods[0]?.evidence).toEqual(expect.arrayContaining(['cleanliness-drop', 'subcooling', 'air-removal']));
    // Even on the leak's last day the reference is still the tight condenser before it, its trend carried forward.
    expect(v[from + length - 1]?.drop).toBeCloseTo(0.06, 6);
  });

  it('flags a drop without any witness measured only above the drop-alone threshold', () => {
    const { dropAlone } = DEFAULT_AIR_LEAK_SETTINGS;
    const run = (loss: number) =>
      airLeakPeriods(judgeAirLeakDays(series(60, { ratePerDay: 0, loss: (i) => (inside(i, 30, 5) ? loss : 0), witnesses: () => UNMEASURED })));
    expect(run(dropAlone - 0.005)).toEqual([]);
    expect(run(0.05)).toEqual([]);
    const flagged = run(dropAlone + 0.005);
    expect(flagged).toHaveLength(1);
    expect(flagged[0]).toMatchObject({ from: addDays(START, 30), to: addDays(START, 34), evidence: ['cleanliness-drop'] });
  });

  it('does not flag a drop that a single witness would need when the drop is below the evidence threshold', () => {
    const v = judgeAirLeakDays(
      series(60, {
        ratePerDay: 0,
        loss: (i) => (inside(i, 30, 5) ? 0.02 : 0),
        witnesses: (i) => (inside(i, 30, 5) ? { ...NORMAL, dissolvedOxygenPpb: 30 } : NORMAL),
      }),
    );
    expect(airLeakPeriods(v)).toEqual([]);
  });

  it('judges a day only once at least half a reference window (7 days) lies before the 2-day gap', () => {
    // A loss from day 5 on: day i has the days 0 … i − 3 behind the gap, 7 of them from day 9.
    const v = judgeAirLeakDays(series(20, { loss: (i) => (i >= 5 ? 0.1 : 0), witnesses: (i) => (i >= 5 ? { ...NORMAL, subcoolingK: 3 } : NORMAL) }));
    expect(v.slice(0, 9).map((d) => d.suspected)).toEqual(new Array(9).fill(false));
    expect(v.slice(0, 9).every((d) => d.drop === 0 && d.evidence.length === 0)).toBe(true);
    expect(v[9]?.suspected).toBe(true);
  });
});

describe('air in-leakage periods from daily verdicts', () => {
  const verdicts = (pattern: string): AirLeakDayVerdict[] =>
    [...pattern].map((c, i) => ({
      day: addDays(START, i),
      suspected: c === 'x',
      drop: c === 'x' ? 0.05 + i / 1000 : 0,
      evidence: c === 'x' ? ['cleanliness-drop', i % 2 ? 'subcooling' : 'dissolved-oxygen'] : [],
    }));

  it('bridges up to two quiet days inside one period', () => {
    const p = airLeakPeriods(verdicts('...xxx..xx....'));
    expect(p).toHaveLength(1);
    expect(p[0]).toMatchObject({ from: addDays(START, 3), to: addDays(START, 9) });
    expect(p[0]?.maxDrop).toBeCloseTo(0.059, 12);
    expect(p[0]?.evidence.sort()).toEqual(['cleanliness-drop', 'dissolved-oxygen', 'subcooling']);
  });

  it('splits at three quiet days, and closes a period still open at the end', () => {
    const p = airLeakPeriods(verdicts('.xx...xxx'));
    expect(p.map((x) => [x.from, x.to])).toEqual([
      [addDays(START, 1), addDays(START, 2)],
      [addDays(START, 6), addDays(START, 8)],
    ]);
  });

  it('judges a leak that starts three days after a cleaning against the clean days since, not the fouled ones before', () => {
    // Fouled to 0.70 over 40 days, cleaned back to 0.90 on day 40, leak of 0.08 from day 43 with only oxygen raised.
    const cleanedOn = 40;
    const days = Array.from({ length: 70 }, (_, i) => ({
      day: addDays(START, i),
      cleanliness: (i < cleanedOn ? 0.9 - 0.005 * i : 0.9 - 0.0005 * (i - cleanedOn)) - (inside(i, cleanedOn + 3, 8) ? 0.08 : 0),
      ...NORMAL,
      dissolvedOxygenPpb: inside(i, cleanedOn + 3, 8) ? 24 : 6,
    }));
    const withCleaning = airLeakPeriods(judgeAirLeakDays(days, DEFAULT_AIR_LEAK_SETTINGS, [addDays(START, cleanedOn)]));
    expect(withCleaning).toHaveLength(1);
    expect(withCleaning[0]?.from).toBe(addDays(START, cleanedOn + 3));
    expect(withCleaning[0]?.evidence).toEqual(['cleanliness-drop', 'dissolved-oxygen']);
    // Without knowing of the cleaning, the fouled days before it hide the drop.
    const blind = airLeakPeriods(judgeAirLeakDays(days)).filter((p) => p.from >= addDays(START, cleanedOn));
    expect(blind.every((p) => p.from > addDays(START, cleanedOn + 3))).toBe(true);
  });
});
