/**
 * Timestamps of a historian export → UTC milliseconds. Three forms:
 * - ISO 8601 with an offset or Z ("2024-03-10T02:30:00-06:00"): exact, no zone needed;
 * - local wall-clock text in the plant's IANA zone ("03/10/2024 14:00", "10.03.2024 14:00:00", "2024-03-10 2:00 PM");
 *   two-digit years are read as 20yy;
 * - Excel serial dates (days since 1899-12-30, the 1900 date system) holding local wall-clock time,
 *   rounded to the nearest second (serials are binary fractions).
 * Daylight-saving changes for local times: a wall time inside the spring-forward gap does not exist and
 * is a file error; a wall time in the repeated autumn hour is read by the mapping's `repeatedHour` rule
 * (default by-file-order: in an oldest-first file the first pass through the hour is daylight time and the
 * repeat standard time, in a newest-first file the reverse; this needs the file in time order, either way,
 * through that hour).
 * Zone offsets come from the runtime's time-zone database through luxon, cached per local day.
 */
import { IANAZone } from 'luxon';
import type { ImportTimestamp } from '@shared/schemas/import-mapping.js';

const MS_PER_MIN = 60_000;
const MS_PER_DAY = 86_400_000;
/** Excel serial of 1970-01-01 in the 1900 date system (epoch 1899-12-30). */
const EXCEL_SERIAL_UNIX_EPOCH = 25_569;
/** Serial 61 is 1900-03-01; below it Excel's fictitious 1900-02-29 shifts every date. */
const EXCEL_SERIAL_MIN = 61;
const EXCEL_SERIAL_MAX = 2_958_465; // 9999-12-31

const ISO_OFFSET = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?\s*(Z|z|[+-]\d{2}(?::?\d{2})?)$/;
const LOCAL_TEXT = /^(\d{1,4})[-/.](\d{1,2})[-/.](\d{1,4})(?:(?:T|\s+)(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?\s*([AaPp][Mm])?)?$/;

const daysInMonth = (y: number, m: number): number => new Date(Date.UTC(y, m, 0)).getUTCDate();

/** Wall-clock fields → milliseconds as if the wall clock were UTC ("naive"); NaN when a field is out of range. */
function naiveMs(y: number, mo: number, d: number, h: number, mi: number, s: number, frac: string | undefined): number {
  if (!(mo >= 1 && mo <= 12) || !(d >= 1 && d <= daysInMonth(y, mo)) || h > 23 || mi > 59 || s > 59) return Number.NaN;
  const ms = frac ? Math.round(Number(`0.${frac}`) * 1000) : 0;
  return Date.UTC(y, mo - 1, d, h, mi, s) + ms;
}

type DayResolution =
  { kind: 'single'; offsetMin: number } | { kind: 'gap' } | { kind: 'overlap'; earlierUtcShiftMin: number; laterUtcShiftMin: number } | { kind: 'mixed' };

/** UTC instants whose wall clock in `zone` equals `naive` (0 in a gap, 2 in a repeated hour). */
function resolveWallClock(zone: IANAZone, naive: number): Exclude<DayResolution, { kind: 'mixed' }> {
  const candidates = new Set([zone.offset(naive - MS_PER_DAY), zone.offset(naive), zone.offset(naive + MS_PER_DAY)]);
  const valid: number[] = [];
  for (const o of candidates) if (zone.offset(naive - o * MS_PER_MIN) === o) valid.push(o);
  if (valid.length === 0) return { kind: 'gap' };
  if (valid.length === 1) return { kind: 'single', offsetMin: valid[0]! };
  // the larger offset gives the earlier instant
  return { kind: 'overlap', earlierUtcShiftMin: Math.max(...valid), laterUtcShiftMin: Math.min(...valid) };
}

const sameResolution = (a: DayResolution, b: DayResolution): boolean =>
  a.kind === b.kind &&
  (a.kind !== 'single' || a.offsetMin === (b as typeof a).offsetMin) &&
  (a.kind !== 'overlap' || (a.earlierUtcShiftMin === (b as typeof a).earlierUtcShiftMin && a.laterUtcShiftMin === (b as typeof a).laterUtcShiftMin));

export class TimestampParser {
  /** Why the last parse returned NaN. */
  error = '';
  private readonly zone?: IANAZone;
  private readonly dayCache = new Map<number, DayResolution>();
  private lastDay = Number.NaN;
  private lastResolution?: DayResolution;
  private previousNaive = Number.NaN;
  private overlapDay = Number.NaN;
  private overlapDescending = false;
  /** Latest (ascending) or earliest (descending) wall time seen in the first pass through the repeated hour. */
  private overlapEdge = Number.NaN;
  private overlapRepeating = false;

  constructor(private readonly spec: ImportTimestamp) {
    if (spec.format !== 'iso-8601-offset') {
      const zone = IANAZone.create(spec.timeZone ?? '');
      if (!zone.isValid) throw new RangeError(`unknown time zone "${spec.timeZone}"`);
      this.zone = zone;
    }
  }

  /** UTC milliseconds, or NaN with `error` set. */
  parse(text: string): number {
    const t = text.trim();
    if (t === '') return this.fail('timestamp is missing');
    switch (this.spec.format) {
      case 'iso-8601-offset':
        return this.parseIso(t);
      case 'local-text':
        return this.parseLocalText(t);
      case 'excel-serial':
        return this.parseExcelSerial(t);
    }
  }

  private fail(message: string): number {
    this.error = message;
    return Number.NaN;
  }

  private parseIso(t: string): number {
    const m = ISO_OFFSET.exec(t);
    if (!m) {
      if (/^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?$/.test(t)) {
        return this.fail('ISO 8601 timestamp without an offset: map it as local time with the plant time zone, or export with an offset');
      }
      return this.fail('not an ISO 8601 timestamp with offset (e.g. 2024-03-10T14:00:00-05:00)');
    }
    // groups 1–5 and 8 are not optional in ISO_OFFSET
    const naive = naiveMs(+m[1]!, +m[2]!, +m[3]!, +m[4]!, +m[5]!, m[6] ? +m[6] : 0, m[7]);
    if (Number.isNaN(naive)) return this.fail('date or time field out of range');
    let offsetMin = 0;
    const off = m[8]!;
    if (off !== 'Z' && off !== 'z') {
      const digits = off.slice(1).replace(':', '');
      const hh = +digits.slice(0, 2);
      const mm = digits.length > 2 ? +digits.slice(2) : 0;
      if (hh > 18 || mm > 59) return this.fail(`offset ${off} is out of range`);
      offsetMin = (off[0] === '-' ? -1 : 1) * (hh * 60 + mm);
    }
    return naive - offsetMin * MS_PER_MIN;
  }

  private parseLocalText(t: string): number {
    const m = LOCAL_TEXT.exec(t);
    if (!m) return this.fail(`not a date and time in the stated order (${this.spec.dateOrder})`);
    let y: number, mo: number, d: number;
    const [a, b, c] = [m[1]!, m[2]!, m[3]!]; // the three date groups are not optional in LOCAL_TEXT
    if (this.spec.dateOrder === 'ymd') {
      if (a.length !== 4) return this.fail('expected a four-digit year first (year-month-day)');
      [y, mo, d] = [+a, +b, +c];
    } else {
      if (c.length !== 4 && c.length !== 2) return this.fail('expected the year last, with two or four digits');
      y = c.length === 2 ? 2000 + +c : +c;
      [mo, d] = this.spec.dateOrder === 'mdy' ? [+a, +b] : [+b, +a];
    }
    let h = m[4] ? +m[4] : 0;
    const ampm = m[8]?.toLowerCase();
    if (ampm) {
      if (h < 1 || h > 12) return this.fail('hour must be 1 to 12 with AM/PM');
      h = (h % 12) + (ampm === 'pm' ? 12 : 0);
    }
    const naive = naiveMs(y, mo, d, h, m[5] ? +m[5] : 0, m[6] ? +m[6] : 0, m[7]);
    if (Number.isNaN(naive)) return this.fail('date or time field out of range');
    return this.wallClockToUtc(naive, t);
  }

  private parseExcelSerial(t: string): number {
    const serial = Number(t);
    if (!/^\d+(\.\d+)?$/.test(t) || !Number.isFinite(serial)) return this.fail('not an Excel serial date (a positive number of days)');
    if (serial < EXCEL_SERIAL_MIN || serial > EXCEL_SERIAL_MAX) return this.fail('Excel serial date outside 1900-03-01 to 9999-12-31');
    const naive = Math.round((serial - EXCEL_SERIAL_UNIX_EPOCH) * 86_400) * 1000;
    return this.wallClockToUtc(naive, t);
  }

  private wallClockToUtc(naive: number, text: string): number {
    const previous = this.previousNaive;
    this.previousNaive = naive;
    const zone = this.zone!;
    // a day whose first and last minute resolve alike has no clock change in it (real zones change at most once a day)
    const day = Math.floor(naive / MS_PER_DAY);
    let r: DayResolution | undefined = day === this.lastDay ? this.lastResolution : this.dayCache.get(day);
    if (!r) {
      const start = resolveWallClock(zone, day * MS_PER_DAY);
      const end = resolveWallClock(zone, day * MS_PER_DAY + MS_PER_DAY - 1);
      r = sameResolution(start, end) ? start : { kind: 'mixed' };
      if (this.dayCache.size > 20_000) this.dayCache.clear();
      this.dayCache.set(day, r);
    }
    this.lastDay = day;
    this.lastResolution = r;
    const resolved = r.kind === 'mixed' ? resolveWallClock(zone, naive) : r;
    if (resolved.kind === 'single') return naive - resolved.offsetMin * MS_PER_MIN;
    if (resolved.kind === 'gap') {
      return this.fail(`${text} does not exist in ${zone.name}: the clocks went forward at that time (daylight saving time began)`);
    }
    const earlier = naive - resolved.earlierUtcShiftMin * MS_PER_MIN;
    const later = naive - resolved.laterUtcShiftMin * MS_PER_MIN;
    switch (this.spec.repeatedHour) {
      case 'earlier':
        return earlier;
      case 'later':
        return later;
      case 'reject':
        return this.fail(`${text} occurs twice in ${zone.name} (the clocks went back): choose how to read the repeated hour`);
      default: {
        // A file in ascending order passes through the hour first in daylight time, then again in standard
        // time; a newest-first file the other way round. The direction is taken from the row before the hour.
        if (day !== this.overlapDay) {
          this.overlapDay = day;
          this.overlapDescending = naive < previous;
          this.overlapEdge = naive;
          this.overlapRepeating = false;
        } else if (!this.overlapRepeating) {
          const turnedBack = this.overlapDescending ? naive >= this.overlapEdge : naive <= this.overlapEdge;
          if (turnedBack) this.overlapRepeating = true;
          else this.overlapEdge = naive;
        }
        const firstPassIsEarlier = !this.overlapDescending;
        return this.overlapRepeating === firstPassIsEarlier ? later : earlier;
      }
    }
  }
}

/** Describes how times were read, for the import's list of assumptions. */
export function describeTimestampRule(spec: ImportTimestamp): string {
  if (spec.format === 'iso-8601-offset') return 'timestamps are ISO 8601 with their own UTC offset';
  const what = spec.format === 'excel-serial' ? 'Excel serial dates (1900 system) in local time' : `local time text (${spec.dateOrder})`;
  const repeated = {
    'by-file-order':
      'the repeated hour when clocks go back is read in file order (oldest-first: first pass daylight time, the repeat standard time; newest-first: the reverse)',
    earlier: 'the repeated hour when clocks go back is read as daylight time (the earlier instant)',
    later: 'the repeated hour when clocks go back is read as standard time (the later instant)',
    reject: 'times in the repeated hour when clocks go back are rejected',
  }[spec.repeatedHour];
  return `timestamps are ${what} in ${spec.timeZone}; times inside the spring-forward gap are rejected; ${repeated}`;
}
