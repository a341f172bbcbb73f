import { describe, expect, it } from 'vitest';
import { formatDay } from '../../../shared/text/display-format';
import { readDayText } from '../../../shared/text/day-text';

describe('a calendar day typed as text', () => {
  it('reads the format the app shows (14 Mar 2026), with the month in full or in any case, and ISO days', () => {
    expect(readDayText('14 Mar 2026')).toEqual({ kind: 'day', day: '2026-03-14' });
    expect(readDayText(' 4 march 2026 ')).toEqual({ kind: 'day', day: '2026-03-04' });
    expect(readDayText('1 SEPT 2025')).toEqual({ kind: 'day', day: '2025-09-01' });
    expect(readDayText('2026-03-14')).toEqual({ kind: 'day', day: '2026-03-14' });
  });

  it('reads back every day it formats (a year of days)', () => {
    for (let t = Date.UTC(2028, 0, 1); t < Date.UTC(2029, 0, 1); t += 86_400_000) {
      const iso = new Date(t).toISOString().slice(0, 10);
      expect(readDayText(formatDay(iso))).toEqual({ kind: 'day', day: iso });
    }
  });

  it('refuses days that do not exist and says how to write one', () => {
    for (const text of ['31 Feb 2026', '2026-02-29', '0 Jan 2026', '32 Jan 2026', '2026-13-01']) {
      const read = readDayText(text);
      expect(read.kind, text).toBe('invalid');
      expect(read.kind === 'invalid' && read.message).toMatch(/14 Mar 2026/);
    }
    expect(readDayText('29 Feb 2028')).toEqual({ kind: 'day', day: '2028-02-29' });
  });

  it('refuses all-number days whose order is ambiguous (03/04/2026) instead of guessing', () => {
    const read = readDayText('03/04/2026');
    expect(read.kind).toBe('invalid');
    expect(read.kind === 'invalid' && read.message).toMatch(/month/);
  });

  it('reads blank as no day', () => {
    expect(readDayText('   ')).toEqual({ kind: 'blank' });
  });
});
