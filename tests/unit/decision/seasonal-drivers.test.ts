import { describe, expect, it } from 'vitest';
import { expandDriver, expandMonthly, monthlyProfilesFromHistory } from '@shared/domain/decision/drivers/seasonal-drivers.js';
import { addDays } from '@shared/domain/calendar/plant-date.js';

const months = [5, 6, 9, 13, 18, 23, 27, 28, 24, 18, 11, 7];

describe('seasonal drivers', () => {
  it('with step interpolation every day carries its month’s value', () => {
    const v = expandMonthly(months, '2027-01-01', 365, 'step');
    expect(v[0]).toBe(5);
    expect(v[30]).toBe(5);
    expect(v[31]).toBe(6); // 1 February
    expect(v[364]).toBe(7);
  });
  it('with mid-month interpolation the value at a month’s centre is the month’s value and changes smoothly', () => {
    const v = expandMonthly(months, '2027-01-01', 365, 'mid-month');
    // January has 31 days; its centre is day 15.5, the centre of 16 January (index 15)
    expect(v[15]).toBeCloseTo(5, 12);
    let maxStep = 0;
    for (let d = 1; d < 365; d++) maxStep = Math.max(maxStep, Math.abs(v[d]! - v[d - 1]!));
    expect(maxStep).toBeLessThan(0.25); // largest monthly change is 5 K over ~30 days
    // continuity across the year end: 31 December and 1 January (next year) lie between December and January
    const w = expandMonthly(months, '2027-12-31', 2, 'mid-month');
    expect(w[0]).toBeGreaterThan(5);
    expect(w[0]).toBeLessThan(7);
    expect(w[1]).toBeLessThan(w[0]!);
  });
  it('a constant driver fills the horizon and a daily driver must cover it', () => {
    expect(Array.from(expandDriver(3.5, '2027-01-01', 3))).toEqual([3.5, 3.5, 3.5]);
    expect(() => expandDriver({ daily: [1, 2] }, '2027-01-01', 3)).toThrow(/needs 3 values/);
  });
  it('monthly profiles from history are monthly means, with missing months filled from their neighbours', () => {
    const history = [];
    for (let d = 0; d < 730; d++) {
      const date = addDays('2025-01-01', d);
      const month = Number(date.slice(5, 7));
      if (month === 4) continue; // no April data at all
      history.push({ date, cwInletC: months[month - 1]!, loadFraction: month === 7 ? 0.9 : 0.8 });
    }
    const p = monthlyProfilesFromHistory(history);
    expect(p.cwInletC[0]).toBeCloseTo(5, 12);
    expect(p.loadFraction[6]).toBeCloseTo(0.9, 12);
    expect(p.filledMonths).toEqual([4]);
    expect(p.cwInletC[3]).toBeCloseTo((9 + 18) / 2, 12); // halfway between March and May
  });
});
