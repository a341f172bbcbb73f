/**
 * Shape-preserving piecewise cubic Hermite interpolation (PCHIP: Fritsch–Carlson monotonicity with
 * the Fritsch–Butland weighted-harmonic slopes and the three-point end slopes, as in SciPy's
 * PchipInterpolator). Monotone data give a monotone interpolant, with no overshoot.
 */
export interface MonotoneCubic {
  xs: Float64Array;
  ys: Float64Array;
  slopes: Float64Array;
}

const sign = (v: number): number => (v > 0 ? 1 : v < 0 ? -1 : 0);

export function buildMonotoneCubic(xs: readonly number[], ys: readonly number[]): MonotoneCubic {
  const n = xs.length;
  if (n < 2 || ys.length !== n) throw new RangeError('a monotone cubic needs at least two points with one value each');
  for (let i = 1; i < n; i++) {
    if (!(xs[i]! > xs[i - 1]!)) throw new RangeError(`points must be in strictly increasing order of x (x[${i}] = ${xs[i]} ≤ ${xs[i - 1]})`);
  }
  const h = new Float64Array(n - 1);
  const d = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) {
    h[i] = xs[i + 1]! - xs[i]!;
    d[i] = (ys[i + 1]! - ys[i]!) / h[i]!;
  }
  const m = new Float64Array(n);
  if (n === 2) {
    m[0] = d[0]!;
    m[1] = d[0]!;
  } else {
    for (let k = 1; k < n - 1; k++) {
      if (sign(d[k - 1]!) * sign(d[k]!) <= 0) {
        m[k] = 0;
      } else {
        const w1 = 2 * h[k]! + h[k - 1]!;
        const w2 = h[k]! + 2 * h[k - 1]!;
        m[k] = (w1 + w2) / (w1 / d[k - 1]! + w2 / d[k]!);
      }
    }
    m[0] = endSlope(h[0]!, h[1]!, d[0]!, d[1]!);
    m[n - 1] = endSlope(h[n - 2]!, h[n - 3]!, d[n - 2]!, d[n - 3]!);
  }
  return { xs: Float64Array.from(xs), ys: Float64Array.from(ys), slopes: m };
}

function endSlope(h0: number, h1: number, d0: number, d1: number): number {
  const m = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
  if (sign(m) !== sign(d0)) return 0;
  if (sign(d0) !== sign(d1) && Math.abs(m) > Math.abs(3 * d0)) return 3 * d0;
  return m;
}

/**
 * Value at x. Below the first point: the first value (flat, e.g. below a turbine's choke point).
 * Above the last point: straight-line continuation with the end slope.
 */
export function evaluateMonotoneCubic(c: MonotoneCubic, x: number): number {
  const { xs, ys, slopes } = c;
  const n = xs.length;
  if (x <= xs[0]!) return ys[0]!;
  if (x >= xs[n - 1]!) return ys[n - 1]! + slopes[n - 1]! * (x - xs[n - 1]!);
  let i = 0;
  while (x > xs[i + 1]!) i++;
  const h = xs[i + 1]! - xs[i]!;
  const t = (x - xs[i]!) / h;
  const t2 = t * t;
  const t3 = t2 * t;
  return (2 * t3 - 3 * t2 + 1) * ys[i]! + (t3 - 2 * t2 + t) * h * slopes[i]! + (-2 * t3 + 3 * t2) * ys[i + 1]! + (t3 - t2) * h * slopes[i + 1]!;
}
