/**
 * Cash-flow metrics of a business case (ENGINEERING.md §7), in decimal.js: values[0] falls at t = 0 and
 * values[k] at the end of year k (year-end discounting).
 */
import Decimal from 'decimal.js';

/** Extra digits for root finding; money itself is rounded to cents only at the edges. */
const Precise = Decimal.clone({ precision: 50 });

export type MoneyInput = Decimal.Value;

export function npv(rate: MoneyInput, values: readonly MoneyInput[]): Decimal {
  const onePlus = new Precise(rate).plus(1);
  if (onePlus.lte(0)) throw new Error('the discount rate must be above −1');
  let sum = new Precise(0);
  let factor = new Precise(1);
  for (const v of values) {
    sum = sum.plus(new Precise(v).div(factor));
    factor = factor.times(onePlus);
  }
  return new Decimal(sum);
}

export interface IrrResult {
  /** null unless exactly one rate above −1 makes the NPV zero */
  irr: Decimal | null;
  reason?: string;
}

type Poly = Decimal[]; // coefficients, lowest order first

function trim(p: Poly, tolerance: Decimal): Poly {
  const out = [...p];
  while (out.length > 0 && out[out.length - 1]!.abs().lte(tolerance)) out.pop();
  return out;
}

function derivative(p: Poly): Poly {
  return p.slice(1).map((c, i) => c.times(i + 1));
}

/** Remainder of a ÷ b (b trimmed, non-empty). */
function remainder(a: Poly, b: Poly, tolerance: Decimal): Poly {
  const r = [...a];
  const lead = b[b.length - 1]!;
  for (let shift = r.length - b.length; shift >= 0; shift--) {
    const q = r[shift + b.length - 1]!.div(lead);
    for (let i = 0; i < b.length; i++) r[shift + i] = r[shift + i]!.minus(q.times(b[i]!));
  }
  return trim(r.slice(0, b.length - 1), tolerance);
}

function signAtZeroPlus(p: Poly): number {
  const c = p.find((v) => !v.isZero());
  return c ? c.s : 0;
}

function signAtInfinity(p: Poly): number {
  return p.length ? p[p.length - 1]!.s : 0;
}

function signChanges(signs: number[]): number {
  const s = signs.filter((v) => v !== 0);
  let n = 0;
  for (let i = 1; i < s.length; i++) if (s[i] !== s[i - 1]) n++;
  return n;
}

/** Number of distinct real roots of p in (0, ∞) by Sturm's theorem. */
function distinctPositiveRoots(p: Poly, tolerance: Decimal): number {
  const seq: Poly[] = [p, derivative(p)];
  while (seq[seq.length - 1]!.length > 1) {
    const r = remainder(seq[seq.length - 2]!, seq[seq.length - 1]!, tolerance);
    if (r.length === 0) break;
    seq.push(r.map((c) => c.neg()));
  }
  return signChanges(seq.map(signAtZeroPlus)) - signChanges(seq.map(signAtInfinity));
}

function evaluate(p: Poly, x: Decimal): Decimal {
  let s = new Precise(0);
  for (let i = p.length - 1; i >= 0; i--) s = s.times(x).plus(p[i]!);
  return s;
}

/**
 * Internal rate of return. With x = 1/(1 + r) the NPV is the polynomial Σ values[k]·x^k on x > 0 (r > −1).
 * One sign change in the flows means one root (Descartes' rule of signs); otherwise Sturm's theorem counts the
 * distinct positive roots. Reported only when there is exactly one.
 */
export function irr(values: readonly MoneyInput[]): IrrResult {
  let p: Poly = values.map((v) => new Precise(v));
  const scale = p.reduce((m, c) => Decimal.max(m, c.abs()), new Precise(0));
  if (scale.isZero()) return { irr: null, reason: 'all cash flows are zero' };
  const tolerance = scale.times('1e-40');
  p = trim(p, tolerance);
  while (p.length > 0 && p[0]!.isZero()) p = p.slice(1); // a zero at t = 0 only shifts the time origin
  const changes = signChanges(p.map((c) => c.s));
  if (changes === 0) return { irr: null, reason: 'the cash flows never change sign, so no rate makes the NPV zero' };
  if (changes > 1) {
    const roots = distinctPositiveRoots(p, tolerance);
    if (roots === 0) return { irr: null, reason: 'no rate above −100 % makes the NPV zero' };
    if (roots > 1) return { irr: null, reason: `${roots} different rates make the NPV zero, so no single IRR exists` };
  }
  const lo0 = signAtZeroPlus(p);
  if (lo0 === signAtInfinity(p)) return { irr: null, reason: 'the NPV touches zero without changing sign' };
  // Cauchy bound: every root has |x| < 1 + max|a_k / a_n|.
  const lead = p[p.length - 1]!.abs();
  let hi = p
    .slice(0, -1)
    .reduce((m, c) => Decimal.max(m, c.abs().div(lead)), new Precise(0))
    .plus(1);
  let lo = new Precise(0);
  for (let i = 0; i < 400; i++) {
    const mid = lo.plus(hi).div(2);
    if (evaluate(p, mid).s === lo0) lo = mid;
    else hi = mid;
    if (hi.minus(lo).lte(hi.times('1e-30'))) break;
  }
  const x = lo.plus(hi).div(2);
  return { irr: new Decimal(new Precise(1).div(x).minus(1)) };
}

/**
 * Time (years) after which the cumulative of the given flows stays ≥ 0, values[0] falling at t = 0 and each later
 * year's flow spread evenly through its year, so the cumulative is piecewise linear between year ends: 0 when it is
 * never negative, null when it ends negative, else the crossing in the year after its last negative year end.
 */
function cumulativeZeroCrossing(flows: readonly Decimal[]): number | null {
  let cumulative = new Precise(0);
  let lastNegative = -1;
  let atLastNegative = cumulative;
  flows.forEach((f, k) => {
    cumulative = cumulative.plus(f);
    if (cumulative.lt(0)) {
      lastNegative = k;
      atLastNegative = cumulative;
    }
  });
  if (lastNegative < 0) return 0;
  if (lastNegative === flows.length - 1) return null;
  return new Precise(lastNegative).plus(atLastNegative.neg().div(flows[lastNegative + 1]!)).toNumber();
}

export function paybackYears(values: readonly MoneyInput[]): number | null {
  return cumulativeZeroCrossing(values.map((v) => new Precise(v)));
}

export function discountedPaybackYears(rate: MoneyInput, values: readonly MoneyInput[]): number | null {
  const onePlus = new Precise(rate).plus(1);
  if (onePlus.lte(0)) throw new Error('the discount rate must be above −1');
  return cumulativeZeroCrossing(values.map((v, k) => new Precise(v).div(onePlus.pow(k))));
}

/** Present value of benefits over present value of costs; null when the costs are not positive. */
export function benefitCostRatio(presentBenefits: MoneyInput, presentCosts: MoneyInput): Decimal | null {
  const costs = new Decimal(presentCosts);
  return costs.gt(0) ? new Decimal(presentBenefits).div(costs) : null;
}

/** Rounds money to cents for output (half away from zero). */
export function toCents(value: MoneyInput): number {
  return new Decimal(value).toDecimalPlaces(2, Decimal.ROUND_HALF_UP).toNumber();
}
