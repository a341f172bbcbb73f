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
  if (points.length < 2 || points.some((p, i) => i > 0 && !(p.x > points[i - 1].x))) return asEntered;
  const cubic = buildMonotoneCubic(
    points.map((p) => p.x),
    points.map((p) => p.y),
  );
  const line: CurveLinePoint[] = [];
  for (let i = 0; i < points.length - 1; i++) {
    line.push(asEntered[i]);
    const from = points[i].x;
    const step = (points[i + 1].x - from) / samplesPerSegment;
    for (let k = 1; k < samplesPerSegment; k++) {
      const x = from + k * step;
      line.push({ x, y: evaluateMonotoneCubic(cubic, x), entered: false });
    }
  }
  line.push(asEntered[points.length - 1]);
  return line;
}
