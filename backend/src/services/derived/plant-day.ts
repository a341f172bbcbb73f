/** Plant-local calendar days for UTC instants, cached by quarter hour (every zone offset is a multiple of 15 min). */
export function plantDayFormatter(timeZone: string): (timestampMs: number) => string {
  const fmt = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
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

/** Whole days from a to b ('YYYY-MM-DD'). */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

export function median(values: number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}
