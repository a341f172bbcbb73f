/** Small statistics helpers for monitoring and the decision engine (pure, deterministic). */

/** The middle value (the mean of the two middle ones for an even count); null when there are no values. */
export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/** Quantile with linear interpolation between order statistics (type 7, as in R's default). Input must be sorted. */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) throw new Error('quantile of no values');
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

/** Median absolute deviation from the median (unscaled). */
export function medianAbsoluteDeviation(values: readonly number[]): number {
  const m = median(values);
  if (m === null) throw new Error('median absolute deviation of no values');
  return median(values.map((v) => Math.abs(v - m)))!;
}

/**
 * Inverse of the standard normal CDF (P. J. Acklam's rational approximation, relative error below 1.15e-9).
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) throw new Error('normal quantile needs 0 < p < 1');
  const a = [-39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239] as const;
  const b = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572] as const;
  const c = [-0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783] as const;
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416] as const;
  const plow = 0.02425;
  let x: number;
  if (p < plow) {
    const q = Math.sqrt(-2 * Math.log(p));
    x = (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  } else if (p <= 1 - plow) {
    const q = p - 0.5;
    const r = q * q;
    x = ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) / (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
  } else {
    const q = Math.sqrt(-2 * Math.log(1 - p));
    x = -(((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  }
  return x;
}

/**
 * Student's t distribution function for a whole number of degrees of freedom, from the exact finite series of
 * P(|T| ≤ t) with θ = atan(t/√ν) [pub: Abramowitz & Stegun, Handbook of Mathematical Functions, 26.7.3–26.7.4]:
 * ν odd: (2/π)(θ + sinθ(cosθ + ⅔cos³θ + … )); ν even: sinθ(1 + ½cos²θ + (1·3)/(2·4)cos⁴θ + … ).
 */
export function studentTCdf(t: number, dof: number): number {
  if (!(Number.isInteger(dof) && dof >= 1)) throw new Error("Student's t needs a whole number of degrees of freedom, at least 1");
  const theta = Math.atan(Math.abs(t) / Math.sqrt(dof));
  const sin = Math.sin(theta);
  const cos2 = Math.cos(theta) ** 2;
  let within: number;
  if (dof % 2 === 1) {
    let term = Math.cos(theta);
    let sum = dof > 1 ? term : 0;
    for (let j = 1; 2 * j <= dof - 3; j++) {
      term *= (cos2 * (2 * j)) / (2 * j + 1);
      sum += term;
    }
    within = (2 / Math.PI) * (theta + sin * sum);
  } else {
    let term = 1;
    let sum = 1;
    for (let j = 1; 2 * j <= dof - 2; j++) {
      term *= (cos2 * (2 * j - 1)) / (2 * j);
      sum += term;
    }
    within = sin * sum;
  }
  return t >= 0 ? 0.5 + within / 2 : 0.5 - within / 2;
}

/**
 * Quantile of Student's t with `dof` degrees of freedom, by bisection on the distribution function to full
 * double precision. For prediction bands from few points, where the normal quantile would be too narrow.
 */
export function studentTQuantile(p: number, dof: number): number {
  if (!(p > 0 && p < 1)) throw new Error("Student's t quantile needs 0 < p < 1");
  if (!(Number.isInteger(dof) && dof >= 1)) throw new Error("Student's t quantile needs a whole number of degrees of freedom, at least 1");
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentTQuantile(1 - p, dof);
  let lo = 0;
  let hi = 1;
  while (studentTCdf(hi, dof) < p) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-14 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (studentTCdf(mid, dof) < p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Solves the small dense system A·x = b by Gaussian elimination with partial pivoting; null when singular. */
export function solveLinear(a: readonly number[][], b: readonly number[]): number[] | null {
  const n = b.length;
  // augmented rows [A | b]; every index below is within the n × (n + 1) matrix
  const m = a.map((row, i) => [...row, b[i]!]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r]![col]!) > Math.abs(m[pivot]![col]!)) pivot = r;
    const scale = Math.max(...m.map((row) => Math.abs(row[col]!)));
    const pivotRow = m[pivot]!;
    if (Math.abs(pivotRow[col]!) <= 1e-14 * (scale || 1)) return null;
    m[pivot] = m[col]!;
    m[col] = pivotRow;
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const row = m[r]!;
      const f = row[col]! / pivotRow[col]!;
      for (let c = col; c <= n; c++) row[c]! -= f * pivotRow[c]!;
    }
  }
  return m.map((row, i) => row[n]! / row[i]!);
}

/** Inverse of a small symmetric positive-definite matrix (column by column); null when singular. */
export function invertMatrix(a: readonly number[][]): number[][] | null {
  const n = a.length;
  const cols: number[][] = [];
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0);
    e[j] = 1;
    const x = solveLinear(a, e);
    if (!x) return null;
    cols.push(x);
  }
  return Array.from({ length: n }, (_, i) => cols.map((col) => col[i]!));
}
