/**
 * The plant-local calendar day ('YYYY-MM-DD') of an instant: the day on the plant's clock, which is the day
 * its data are grouped by. Day arithmetic on the result is in plant-date.ts.
 */

const dayFormat = (timeZone: string) => new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });

/** Plant-local days for many UTC instants, cached by quarter hour (every zone offset is a multiple of 15 min). */
export function plantDayFormatter(timeZone: string): (timestampMs: number) => string {
  const fmt = dayFormat(timeZone);
  const cache = new Map<number, string>();
  return (ts) => {
    const bucket = Math.floor(ts / 900_000);
    let day = cache.get(bucket);
    if (day === undefined) {
      day = fmt.format(new Date(bucket * 900_000));
      if (cache.size > 200_000) cache.clear();
      cache.set(bucket, day);
    }
    return day;
  };
}

/** The plant-local day of one instant. */
export function plantDayOf(timestampMs: number, timeZone: string): string {
  return dayFormat(timeZone).format(new Date(timestampMs));
}
