import { buildMonotoneCubic, evaluateMonotoneCubic } from '@shared/domain/turbine/monotone-cubic';

export interface CurveLinePoint {
  x: number;
  y: number;
  /** one of the points the person entered (drawn as a dot); the others only shape the line */
  entered: boolean;
}

/**
 * The line to draw for one load's correction curve: the shared monotone cubic (PCHIP) that the costs evaluate,
 * sampled densely between the entered points and joined by straight segments, so the chart shows the very curve
 * behind the figures rather than a smoothing of its own. PCHIP is unchanged by a linear change of the pressure
 * unit, so the entered points may be in the person's unit. Points the engine cannot take (two at one pressure)
 * are drawn as entered, joined straight.
 */
export function engineCurveLine(entered: readonly { x: number; y: number }[], samplesPerSegment = 32): CurveLinePoint[] {
  const points = [...entered].sort((a, b) => a.x - b.x);
  const asEntered = points.map((p) => ({ x: p.x, y: p.y, entered: true }));
  const rising = points.every((p, i) => {
    const before = points[i - 1];
    return before === undefined || p.x > before.x;
  });
  if (points.length < 2 || !rising) return asEntered;
  const cubic = buildMonotoneCubic(
    points.map((p) => p.x),
    points.map((p) => p.y),
  );
  const line: CurveLinePoint[] = [];
  for (const [i, point] of asEntered.entries()) {
    line.push(point);
    const next = points[i + 1];
    if (!next) break;
    const step = (next.x - point.x) / samplesPerSegment;
    for (let k = 1; k < samplesPerSegment; k++) {
      const x = point.x + k * step;
      line.push({ x, y: evaluateMonotoneCubic(cubic, x), entered: false });
    }
  }
  return line;
}
