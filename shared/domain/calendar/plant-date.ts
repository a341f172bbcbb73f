/**
 * Plant-local calendar dates as 'YYYY-MM-DD' strings, with arithmetic on day numbers.
 * No clock and no time zone: the caller passes dates already expressed in the plant's local calendar.
 * Day numbers count days since 1970-01-01 in the proleptic Gregorian calendar
 * (civil-date algorithms after H. Hinnant, "chrono-compatible low-level date algorithms").
 */

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

export interface CivilDate {
  year: number;
  /** 1..12 */
  month: number;
  /** 1..31 */
  day: number;
}

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  return [31, isLeapYear(year) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1]!;
}

export function parsePlantDate(text: string): CivilDate {
  const m = ISO_DATE.exec(text);
  if (!m) throw new Error(`"${text}" is not a date in the form YYYY-MM-DD`);
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) throw new Error(`"${text}" is not a calendar date`);
  return { year, month, day };
}

export function dayNumberFromCivil({ year, month, day }: CivilDate): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

export function civilFromDayNumber(dayNumber: number): CivilDate {
  const z = dayNumber + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

export function dayNumber(date: string): number {
  return dayNumberFromCivil(parsePlantDate(date));
}

export function formatPlantDate({ year, month, day }: CivilDate): string {
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

export function dateFromDayNumber(n: number): string {
  return formatPlantDate(civilFromDayNumber(n));
}

export function addDays(date: string, days: number): string {
  return dateFromDayNumber(dayNumber(date) + days);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

/** Same month and day `years` later; 29 February falls back to 28 February in a common year. */
export function addYears(date: string, years: number): string {
  const c = parsePlantDate(date);
  const year = c.year + years;
  return formatPlantDate({ year, month: c.month, day: Math.min(c.day, daysInMonth(year, c.month)) });
}

/**
 * Index (0-based) of the horizon year each day of the horizon falls in, years counted from the start date's
 * anniversaries. Used for year-end discounting of daily costs and for yearly cash flows.
 */
export function horizonYearIndex(startDate: string, horizonDays: number): Int32Array {
  const out = new Int32Array(horizonDays);
  const start = dayNumber(startDate);
  let year = 0;
  let nextAnniversary = dayNumber(addYears(startDate, 1)) - start;
  for (let d = 0; d < horizonDays; d++) {
    while (d >= nextAnniversary) {
      year++;
      nextAnniversary = dayNumber(addYears(startDate, year + 1)) - start;
    }
    out[d] = year;
  }
  return out;
}
