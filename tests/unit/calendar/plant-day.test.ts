import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { plantDayFormatter, plantDayOf } from '@shared/domain/calendar/plant-day.js';

describe('plant-local day of an instant', () => {
  it('05:30 UTC on 2 Dec 2026 is still 1 Dec in Chicago (UTC−6) and already 2 Dec in Berlin (UTC+1)', () => {
    const t = Date.parse('2026-12-02T05:30:00Z');
    expect(plantDayOf(t, 'America/Chicago')).toBe('2026-12-01');
    expect(plantDayOf(t, 'Europe/Berlin')).toBe('2026-12-02');
  });

  it.each(['America/Chicago', 'Europe/Berlin', 'Australia/Lord_Howe', 'Asia/Kathmandu'])(
    'in %s, the formatter gives every quarter hour around the clock changes the day the time-zone database gives',
    (zone) => {
      const dayOf = plantDayFormatter(zone);
      for (const around of ['2025-03-09', '2025-03-30', '2025-04-06', '2025-10-05', '2025-10-26', '2025-11-02']) {
        const start = Date.parse(`${around}T00:00:00Z`) - 2 * 86_400_000;
        for (let t = start; t < start + 4 * 86_400_000; t += 7 * 60_000) {
          expect(dayOf(t)).toBe(DateTime.fromMillis(t, { zone }).toISODate());
        }
      }
    },
  );
});
