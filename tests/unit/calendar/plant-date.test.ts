import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DateTime } from 'luxon';
import { addDays, addYears, dateFromDayNumber, dayNumber, daysBetween, horizonYearIndex, parsePlantDate } from '@shared/domain/calendar/plant-date.js';

describe('plant-local date arithmetic', () => {
  it('counts days since 1970-01-01 the same way luxon does in UTC, over four centuries', () => {
    // reference: luxon (an independent calendar implementation)
    fc.assert(
      fc.property(fc.integer({ min: -150_000, max: 150_000 }), (n) => {
        const iso = DateTime.fromMillis(n * 86_400_000, { zone: 'utc' }).toISODate() as string;
        expect(dateFromDayNumber(n)).toBe(iso);
        expect(dayNumber(iso)).toBe(n);
      }),
      { numRuns: 2000, seed: 7 },
    );
  });
  it('knows leap days: 2028-02-28 + 1 day is 2028-02-29, 2100 is not a leap year', () => {
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2100-02-28', 1)).toBe('2100-03-01');
    expect(daysBetween('2027-01-01', '2028-01-01')).toBe(365);
    expect(daysBetween('2028-01-01', '2029-01-01')).toBe(366);
  });
  it('moves 29 February to 28 February in a common year', () => {
    expect(addYears('2028-02-29', 1)).toBe('2029-02-28');
  });
  it('rejects text that is not a calendar date', () => {
    expect(() => parsePlantDate('2027-02-30')).toThrow(/not a calendar date/);
    expect(() => parsePlantDate('27-1-1')).toThrow(/YYYY-MM-DD/);
  });
  it('splits a horizon into years at the start date’s anniversaries', () => {
    const y = horizonYearIndex('2027-07-01', 800);
    expect(y[0]).toBe(0);
    // the first year runs across 29 February 2028, so it has 366 days
    expect(y[365]).toBe(0); // 2028-06-30
    expect(y[366]).toBe(1); // 2028-07-01
    expect(y[366 + 364]).toBe(1); // 2029-06-30
    expect(y[366 + 365]).toBe(2); // 2029-07-01
  });
});
