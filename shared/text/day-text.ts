/**
 * A calendar day as a person types it, read in the same form the app shows days ("14 Mar 2026", any case, the
 * month short or in full) or as an ISO day ("2026-03-14"). Days written only in numbers with slashes or dots are
 * refused: 03/04/2026 is March or April depending on who typed it.
 */
export type DayText = { kind: 'blank' } | { kind: 'day'; day: string } | { kind: 'invalid'; message: string };

/** A stored calendar day's shape ("2026-03-14"). */
export const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

const MONTH_NAMES = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];
/** Month words people write: the full name, its first three letters, and "sept". */
const MONTH_OF_WORD = new Map<string, number>([...MONTH_NAMES.flatMap((name, i) => [[name, i + 1] as const, [name.slice(0, 3), i + 1] as const]), ['sept', 9]]);
const HOW = 'Write the day as 14 Mar 2026 (or 2026-03-14)';

function isoDay(year: number, month: number, day: number): string | null {
  if (year < 1900 || year > 2200 || month < 1 || month > 12 || day < 1) return null;
  const daysInMonth = new Date(Date.UTC(year, month, 0)).getUTCDate();
  if (day > daysInMonth) return null;
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

export function readDayText(text: string): DayText {
  const t = text.trim();
  if (t === '') return { kind: 'blank' };
  const iso = /^(\d{4})-(\d{2})-(\d{2})$/.exec(t);
  if (iso) {
    const day = isoDay(Number(iso[1]), Number(iso[2]), Number(iso[3]));
    return day ? { kind: 'day', day } : { kind: 'invalid', message: `There is no such day. ${HOW}.` };
  }
  const named = /^(\d{1,2})\s+([A-Za-z]+)\.?,?\s+(\d{4})$/.exec(t);
  if (named) {
    const month = MONTH_OF_WORD.get(named[2]!.toLowerCase());
    if (month === undefined) return { kind: 'invalid', message: `“${named[2]}” is not a month. ${HOW}.` };
    const day = isoDay(Number(named[3]), month, Number(named[1]));
    return day ? { kind: 'day', day } : { kind: 'invalid', message: `There is no such day. ${HOW}.` };
  }
  if (/^\d{1,4}[/.]\d{1,2}[/.]\d{1,4}$/.test(t))
    return { kind: 'invalid', message: `Numbers alone leave the day and month in doubt. ${HOW}, with the month as a word.` };
  return { kind: 'invalid', message: `This is not a day. ${HOW}.` };
}
