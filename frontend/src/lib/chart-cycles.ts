/**
 * Chart helpers that reshape daily figures: the fouling cost split into cleaning cycles, and the gap between
 * two daily lines as filled shapes. Pure, so they are tested without a browser.
 */

export interface CostCycle {
  /** first day of the cycle in the period: a cleaning day, or the period's first day */
  from: string;
  to: string;
  /** true when the cycle starts at a cleaning; false for the part of a cycle that began before the period */
  startsAtCleaning: boolean;
  cost: number;
  /** the cost since the cycle's start, day by day */
  running: { day: string; y: number }[];
}

/**
 * The period's days cut at each cleaning: each cycle's running cost restarts at zero on the cleaning day (the
 * cleaning day's own cost belongs to the new cycle, as the trend restarts there). Days without a cost add nothing.
 */
export function costCycles(days: { day: string; foulingCost: number | null }[], cleaningDays: string[]): CostCycle[] {
  const cuts = [...new Set(cleaningDays)].sort();
  const cycles: CostCycle[] = [];
  let current: CostCycle | null = null;
  let cut = 0;
  for (const d of days) {
    let startsAtCleaning = false;
    // the loop bound guarantees cuts[cut]
    while (cut < cuts.length && cuts[cut]! <= d.day) {
      startsAtCleaning = true;
      cut += 1;
    }
    if (!current || startsAtCleaning) {
      // the first cycle starts at a cleaning only when the period opens on one; cleanings before it only end earlier cycles
      current = { from: d.day, to: d.day, startsAtCleaning: current === null ? startsAtCleaning && cuts[cut - 1] === d.day : true, cost: 0, running: [] };
      cycles.push(current);
    }
    current.cost += d.foulingCost ?? 0;
    current.to = d.day;
    current.running.push({ day: d.day, y: current.cost });
  }
  return cycles;
}

export type GapSide = 'above' | 'below';

/**
 * The area between an upper-is-worse line (actual) and a baseline (expected), as polygons in chart
 * coordinates, each marked above or below the baseline; a day pair that crosses is split where the lines meet.
 */
export function gapShapes(points: { x: number; actual: number | null; expected: number | null }[]): { side: GapSide; points: [number, number][] }[] {
  const out: { side: GapSide; points: [number, number][] }[] = [];
  for (let i = 0; i + 1 < points.length; i += 1) {
    // the loop bound guarantees both days of the pair
    const a = points[i]!;
    const b = points[i + 1]!;
    if (a.actual === null || a.expected === null || b.actual === null || b.expected === null) continue;
    const da = a.actual - a.expected;
    const db = b.actual - b.expected;
    if (da === 0 && db === 0) continue;
    if (da * db >= 0) {
      out.push({
        side: da + db > 0 ? 'above' : 'below',
        points: [
          [a.x, a.actual],
          [b.x, b.actual],
          [b.x, b.expected],
          [a.x, a.expected],
        ],
      });
      continue;
    }
    // the lines cross between the two days: linear interpolation of both
    const t = da / (da - db);
    const cx = a.x + t * (b.x - a.x);
    const cy = a.expected + t * (b.expected - a.expected);
    out.push({
      side: da > 0 ? 'above' : 'below',
      points: [
        [a.x, a.actual],
        [cx, cy],
        [a.x, a.expected],
      ],
    });
    out.push({
      side: db > 0 ? 'above' : 'below',
      points: [
        [cx, cy],
        [b.x, b.actual],
        [b.x, b.expected],
      ],
    });
  }
  return out;
}
