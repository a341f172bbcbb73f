/** Time on the screens: one day format, a named zone on every timestamp, one naming style for zones, months that cannot be read as days. */
import { describe, expect, it } from 'vitest';
import { timeTicks } from '@frontend/lib/chart-palette';
import { formatDate, formatDateTime, formatMonth, formatPlantDate, formatPlantTime, zoneName } from '@frontend/lib/format';
import { formatDay } from '@shared/text/display-format';

describe('time on the screens', () => {
  it('names every zone the same way, as an offset from UTC, whether the plant is in Chicago or in Berlin', () => {
    // January: Chicago is six hours behind UTC, Berlin one ahead (IANA tz database, standard time in winter)
    expect(formatPlantTime('2026-01-15T12:00:00Z', 'America/Chicago')).toBe('15 Jan 2026, 06:00 UTC−6');
    expect(formatPlantTime('2026-01-15T12:00:00Z', 'Europe/Berlin')).toBe('15 Jan 2026, 13:00 UTC+1');
    // July: both on summer time
    expect(formatPlantTime('2026-07-15T12:00:00Z', 'America/Chicago')).toBe('15 Jul 2026, 07:00 UTC−5');
    expect(zoneName(new Date('2026-07-15T12:00:00Z'), 'Asia/Kolkata')).toBe('UTC+5:30');
    expect(zoneName(new Date('2026-07-15T12:00:00Z'), 'UTC')).toBe('UTC');
  });

  it('gives every timestamp of the records (imports, figures computed, audit log) a zone', () => {
    expect(formatDateTime('2026-03-14T09:05:00Z', 'UTC')).toBe('14 Mar 2026, 09:05 UTC');
    expect(formatDateTime('2026-03-14T09:05:00Z', 'America/Chicago')).toBe('14 Mar 2026, 04:05 UTC−5');
    // without a zone, the reader's own, still named
    expect(formatDateTime('2026-03-14T09:05:00Z')).toMatch(/^\d{1,2} Mar 2026, \d\d:\d\d UTC([+−]\d{1,2}(:\d\d)?)?$/);
  });

  it('writes a day one way everywhere: "14 Mar 2026"', () => {
    expect(formatDay('2026-03-14')).toBe('14 Mar 2026');
    expect(formatDate('2026-03-14T12:00:00Z')).toBe('14 Mar 2026');
    expect(formatPlantDate('2026-03-14T03:00:00Z', 'America/Chicago')).toBe('13 Mar 2026');
  });

  it('labels months on chart axes with the full year, so "Sep 2025" cannot be read as the 25th of September', () => {
    expect(formatMonth('2025-09')).toBe('Sep 2025');
    expect(formatMonth('2025-09-01')).toBe('Sep 2025');
    for (const span of [60, 200, 400, 700]) expect(timeTicks(span).format).not.toMatch(/%y/);
    expect(timeTicks(200).format).toBe('%b %Y');
  });
});
