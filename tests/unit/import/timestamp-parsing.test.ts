import { describe, expect, it } from 'vitest';
import { TimestampParser } from '@backend/import/timestamp-parsing.js';
import { importTimestampSchema } from '@shared/schemas/import-mapping.js';

const parser = (spec: Record<string, unknown>) => new TimestampParser(importTimestampSchema.parse({ column: 'T', ...spec }));
const iso = (ms: number) => new Date(ms).toISOString();

describe('ISO 8601 timestamps with an offset', () => {
  const p = parser({ format: 'iso-8601-offset' });
  it('reads offsets, Z and fractional seconds to the exact instant', () => {
    expect(iso(p.parse('2024-03-10T14:00:00-05:00'))).toBe('2024-03-10T19:00:00.000Z');
    expect(iso(p.parse('2024-03-10 14:00+0100'))).toBe('2024-03-10T13:00:00.000Z');
    expect(iso(p.parse('2024-03-10T14:00:05.250Z'))).toBe('2024-03-10T14:00:05.250Z');
  });
  it('refuses a time without an offset and says what to do', () => {
    expect(p.parse('2024-03-10T14:00:00')).toBeNaN();
    expect(p.error).toMatch(/without an offset/);
  });
  it('refuses impossible dates', () => {
    expect(p.parse('2023-02-29T00:00Z')).toBeNaN();
    expect(p.parse('2024-13-01T00:00Z')).toBeNaN();
    expect(p.parse('2024-02-29T00:00Z')).not.toBeNaN(); // 2024 is a leap year
  });
});

describe('local wall-clock text in a plant time zone', () => {
  it('reads US, day-first and year-first dates, with AM/PM and two-digit years', () => {
    expect(iso(parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy' }).parse('07/04/2024 14:30'))).toBe('2024-07-04T19:30:00.000Z');
    expect(iso(parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy' }).parse('7/4/24 2:30 PM'))).toBe('2024-07-04T19:30:00.000Z');
    expect(iso(parser({ format: 'local-text', timeZone: 'Europe/Berlin', dateOrder: 'dmy' }).parse('04.07.2024 14:30:00'))).toBe('2024-07-04T12:30:00.000Z');
    expect(iso(parser({ format: 'local-text', timeZone: 'Europe/Berlin', dateOrder: 'ymd' }).parse('2024-01-15 08:00'))).toBe('2024-01-15T07:00:00.000Z');
  });

  it('treats 12 AM as midnight and 12 PM as noon', () => {
    const p = parser({ format: 'local-text', timeZone: 'UTC', dateOrder: 'mdy' });
    expect(iso(p.parse('1/1/2024 12:00 AM'))).toBe('2024-01-01T00:00:00.000Z');
    expect(iso(p.parse('1/1/2024 12:00 PM'))).toBe('2024-01-01T12:00:00.000Z');
  });

  // US daylight saving time 2024: starts Sunday 10 March 02:00 (clocks to 03:00), ends Sunday 3 November 02:00 (clocks to 01:00)
  // [pub: US Energy Policy Act of 2005, second Sunday in March / first Sunday in November]
  it('rejects a time inside the spring-forward gap as a bad timestamp', () => {
    const p = parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy' });
    expect(p.parse('03/10/2024 02:30')).toBeNaN();
    expect(p.error).toMatch(/does not exist in America\/Chicago/);
    expect(iso(p.parse('03/10/2024 01:59'))).toBe('2024-03-10T07:59:00.000Z'); // CST, UTC−6
    expect(iso(p.parse('03/10/2024 03:00'))).toBe('2024-03-10T08:00:00.000Z'); // CDT, UTC−5
  });

  it('reads the repeated autumn hour in file order: first pass daylight time, the repeat standard time', () => {
    const p = parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy' });
    const walls = ['11/03/2024 00:30', '11/03/2024 01:00', '11/03/2024 01:30', '11/03/2024 01:00', '11/03/2024 01:30', '11/03/2024 02:00'];
    expect(walls.map((w) => iso(p.parse(w)))).toEqual([
      '2024-11-03T05:30:00.000Z',
      '2024-11-03T06:00:00.000Z', // 01:00 CDT
      '2024-11-03T06:30:00.000Z',
      '2024-11-03T07:00:00.000Z', // 01:00 CST
      '2024-11-03T07:30:00.000Z',
      '2024-11-03T08:00:00.000Z',
    ]);
  });

  it('applies the chosen rule for the repeated hour: earlier, later or reject', () => {
    const wall = '11/03/2024 01:30';
    expect(iso(parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy', repeatedHour: 'earlier' }).parse(wall))).toBe(
      '2024-11-03T06:30:00.000Z',
    );
    expect(iso(parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy', repeatedHour: 'later' }).parse(wall))).toBe(
      '2024-11-03T07:30:00.000Z',
    );
    const strict = parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy', repeatedHour: 'reject' });
    expect(strict.parse(wall)).toBeNaN();
    expect(strict.error).toMatch(/occurs twice/);
  });

  // EU summer time 2024 ends Sunday 27 October 03:00 CEST → 02:00 CET [pub: Directive 2000/84/EC, last Sunday in October 01:00 UTC]
  it('handles the European change at 03:00 local', () => {
    const p = parser({ format: 'local-text', timeZone: 'Europe/Berlin', dateOrder: 'dmy', repeatedHour: 'later' });
    expect(iso(p.parse('27.10.2024 02:30'))).toBe('2024-10-27T01:30:00.000Z');
    expect(iso(p.parse('27.10.2024 03:30'))).toBe('2024-10-27T02:30:00.000Z');
  });

  it('refuses text in the wrong date order or form', () => {
    const p = parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'ymd' });
    expect(p.parse('07/04/2024 14:30')).toBeNaN();
    expect(p.parse('yesterday')).toBeNaN();
    expect(parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy' }).parse('13/04/2024 14:30')).toBeNaN();
  });
});

describe('Excel serial dates', () => {
  // 1900 date system, epoch 1899-12-30 for serials ≥ 61 [from memory: Excel / ECMA-376 date systems]; serial 25569 = 1970-01-01,
  // and 2024-01-01 is 19,723 days later (54 years, 13 of them leap years: 54·365 + 13) → 45292 [derived]
  it('reads the serial as local wall-clock time in the plant zone', () => {
    expect(iso(parser({ format: 'excel-serial', timeZone: 'UTC' }).parse('45292'))).toBe('2024-01-01T00:00:00.000Z');
    expect(iso(parser({ format: 'excel-serial', timeZone: 'America/New_York' }).parse('45292.5'))).toBe('2024-01-01T17:00:00.000Z');
  });
  it('rounds binary fractions to the nearest second', () => {
    // 13:37:00 is 0.5673611111… of a day; a float stored to 10 digits must still give :00 seconds
    expect(iso(parser({ format: 'excel-serial', timeZone: 'UTC' }).parse('45292.5673611111'))).toBe('2024-01-01T13:37:00.000Z');
  });
  it('refuses serials outside the 1900 system range and text', () => {
    const p = parser({ format: 'excel-serial', timeZone: 'UTC' });
    expect(p.parse('12')).toBeNaN();
    expect(p.parse('3000000')).toBeNaN();
    expect(p.parse('1/1/2024')).toBeNaN();
  });
});

describe('local time round trip (property)', () => {
  // Independent reference: luxon formats each instant as wall-clock text in the zone; reading it back
  // must give the instant itself (in a repeated hour, one of the two readings does).
  const zones = ['America/Chicago', 'Europe/Berlin', 'Australia/Lord_Howe', 'Asia/Kolkata', 'America/St_Johns', 'Pacific/Chatham'];
  it('reads back any instant from 2000 to 2040 written as local text, in zones with whole, half-hour and 30-min DST offsets', async () => {
    const fc = await import('fast-check');
    const { DateTime } = await import('luxon');
    fc.assert(
      fc.property(fc.constantFrom(...zones), fc.integer({ min: 946_684_800, max: 2_208_988_800 }), (zone, seconds) => {
        const t = seconds * 1000;
        const text = DateTime.fromMillis(t, { zone }).toFormat('yyyy-MM-dd HH:mm:ss');
        const earlier = parser({ format: 'local-text', timeZone: zone, dateOrder: 'ymd', repeatedHour: 'earlier' }).parse(text);
        const later = parser({ format: 'local-text', timeZone: zone, dateOrder: 'ymd', repeatedHour: 'later' }).parse(text);
        return earlier === t || later === t;
      }),
      { numRuns: 3000, seed: 20240310 },
    );
  });

  it('reads back instants within three hours of clock changes', async () => {
    const fc = await import('fast-check');
    const { DateTime } = await import('luxon');
    // clock-change instants (UTC) [from memory of the zone rules]; the loop below confirms each one really changes the offset
    const changes: [string, number][] = [
      ['America/Chicago', Date.UTC(2024, 2, 10, 8)],
      ['America/Chicago', Date.UTC(2024, 10, 3, 7)],
      ['Europe/Berlin', Date.UTC(2024, 2, 31, 1)],
      ['Europe/Berlin', Date.UTC(2024, 9, 27, 1)],
      ['Australia/Lord_Howe', Date.UTC(2024, 3, 6, 15)],
      ['America/St_Johns', Date.UTC(2024, 10, 3, 4, 30)],
    ];
    for (const [zone, at] of changes)
      expect(DateTime.fromMillis(at - 3_600_000, { zone }).offset).not.toBe(DateTime.fromMillis(at + 3_600_000, { zone }).offset);
    fc.assert(
      fc.property(fc.constantFrom(...changes), fc.integer({ min: -3 * 3600, max: 3 * 3600 }), ([zone, at], seconds) => {
        const t = at + seconds * 1000;
        const text = DateTime.fromMillis(t, { zone }).toFormat('yyyy-MM-dd HH:mm:ss');
        const earlier = parser({ format: 'local-text', timeZone: zone, dateOrder: 'ymd', repeatedHour: 'earlier' }).parse(text);
        const later = parser({ format: 'local-text', timeZone: zone, dateOrder: 'ymd', repeatedHour: 'later' }).parse(text);
        return earlier === t || later === t;
      }),
      { numRuns: 3000, seed: 20241103 },
    );
  });
});

describe('repeated hour in a newest-first file', () => {
  it('reads the first pass through the hour as standard time and the repeat as daylight time', () => {
    const p = parser({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy' });
    const walls = ['11/03/2024 02:00', '11/03/2024 01:30', '11/03/2024 01:00', '11/03/2024 01:30', '11/03/2024 01:00', '11/03/2024 00:30'];
    expect(walls.map((w) => iso(p.parse(w)))).toEqual([
      '2024-11-03T08:00:00.000Z',
      '2024-11-03T07:30:00.000Z', // 01:30 CST
      '2024-11-03T07:00:00.000Z',
      '2024-11-03T06:30:00.000Z', // 01:30 CDT
      '2024-11-03T06:00:00.000Z',
      '2024-11-03T05:30:00.000Z',
    ]);
  });
});
