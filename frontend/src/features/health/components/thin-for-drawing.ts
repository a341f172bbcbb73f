/** A point on the chart in screen pixels: [x, y]. */
export type ScreenPoint = readonly [number, number];

/**
 * A line's screen points (null where a day has no value) reduced to what the pixels can show: within each pixel
 * column at most its first, lowest, highest and last point, in drawing order, so every peak, dip and gap still shows
 * while a year of hours or several years of days costs no more to draw than the chart is wide. The exact values stay
 * in the chart's table.
 */
export function thinLine(points: readonly (ScreenPoint | null)[]): (ScreenPoint | null)[] {
  const out: (ScreenPoint | null)[] = [];
  let column: ScreenPoint[] = [];
  let columnX = NaN;
  const flush = () => {
    if (column.length <= 4) {
      out.push(...column);
    } else {
      let low = 0;
      let high = 0;
      column.forEach((p, i) => {
        if (p[1] < column[low]![1]) low = i;
        if (p[1] > column[high]![1]) high = i;
      });
      const keep = [...new Set([0, Math.min(low, high), Math.max(low, high), column.length - 1])];
      out.push(...keep.map((i) => column[i]!));
    }
    column = [];
  };
  for (const p of points) {
    if (p === null) {
      flush();
      if (out.length > 0 && out.at(-1) !== null) out.push(null);
      columnX = NaN;
      continue;
    }
    const x = Math.round(p[0]);
    if (x !== columnX) {
      flush();
      columnX = x;
    }
    column.push(p);
  }
  flush();
  return out;
}

/** Dots (null where a day has no value) reduced to one per pixel a dot falls on: the same picture, fewer shapes. */
export function thinDots(points: readonly (ScreenPoint | null)[]): ScreenPoint[] {
  const seen = new Set<string>();
  const out: ScreenPoint[] = [];
  for (const p of points) {
    if (p === null) continue;
    const key = `${Math.round(p[0])},${Math.round(p[1])}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push(p);
  }
  return out;
}
