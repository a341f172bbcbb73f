/**
 * Optimal interval of a repeating cleaning cycle (ENGINEERING.md §6):
 * J(T) = (C + D + ∫₀ᵀ p(t) dt) / (T + τ), T = operating days between cleanings, τ = downtime days per cleaning
 * (no fouling cost accrues during it), C = cleaning cost, D = downtime cost per cleaning, p = fouling cost rate.
 * With p non-decreasing, dJ/dT = 0 ⇔ g(T) = p(T)·(T + τ) − ∫₀ᵀ p − (C + D) = 0, and then p(T*) = J*.
 */

export type FoulingCostRate =
  | { model: 'linear'; slopePerDay2: number }
  | { model: 'asymptotic'; maxPerDay: number; timeConstantDays: number }
  /** cost per day on days 0, 1, 2, … of a cycle, linear in between and held after the last value */
  | { model: 'tabulated'; costPerDay: readonly number[] };

export interface CleaningCycle {
  cleaningCost: number;
  downtimeCost: number;
  downtimeDays: number;
  penalty: FoulingCostRate;
}

export interface IntervalOptimum {
  /** null when there is no finite optimum */
  optimalIntervalDays: number | null;
  /** J* at the optimum, or the long-run cost per day of never cleaning */
  averageCostPerDay: number;
  reason?: string;
}

export interface IntervalCurvePoint {
  intervalDays: number;
  averageCostPerDay: number;
}

function rate(p: FoulingCostRate, t: number): number {
  switch (p.model) {
    case 'linear':
      return p.slopePerDay2 * t;
    case 'asymptotic':
      return p.maxPerDay * (1 - Math.exp(-t / p.timeConstantDays));
    case 'tabulated': {
      const v = p.costPerDay;
      if (t >= v.length - 1) return v[v.length - 1]!;
      const i = Math.floor(t);
      return v[i]! + (t - i) * (v[i + 1]! - v[i]!);
    }
  }
}

/** ∫₀ᵀ p(t) dt */
function accumulated(p: FoulingCostRate, T: number): number {
  switch (p.model) {
    case 'linear':
      return (p.slopePerDay2 * T * T) / 2;
    case 'asymptotic':
      return p.maxPerDay * (T - p.timeConstantDays * -Math.expm1(-T / p.timeConstantDays));
    case 'tabulated': {
      const v = p.costPerDay;
      let sum = 0;
      const whole = Math.min(Math.floor(T), v.length - 1);
      for (let i = 0; i < whole; i++) sum += (v[i]! + v[i + 1]!) / 2;
      const rest = T - whole;
      if (rest > 0) sum += ((rate(p, whole) + rate(p, T)) / 2) * rest;
      return sum;
    }
  }
}

function validate(c: CleaningCycle): void {
  if (!(c.cleaningCost >= 0 && c.downtimeCost >= 0 && c.downtimeDays >= 0)) throw new Error('costs and downtime must be 0 or more');
  if (c.cleaningCost + c.downtimeCost + c.downtimeDays <= 0) throw new Error('a cleaning that costs nothing and takes no time has no optimal interval');
  const p = c.penalty;
  if (p.model === 'linear' && !(p.slopePerDay2 >= 0)) throw new Error('slopePerDay2 must be 0 or more');
  if (p.model === 'asymptotic' && !(p.maxPerDay >= 0 && p.timeConstantDays > 0)) throw new Error('maxPerDay must be 0 or more and timeConstantDays above 0');
  if (p.model === 'tabulated' && (p.costPerDay.length < 2 || p.costPerDay.some((v) => !Number.isFinite(v))))
    throw new Error('a tabulated penalty needs at least two finite values');
}

export function averageCostPerDay(c: CleaningCycle, intervalDays: number): number {
  return (c.cleaningCost + c.downtimeCost + accumulated(c.penalty, intervalDays)) / (intervalDays + c.downtimeDays);
}

function bisect(g: (t: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200 && hi - lo > 1e-12 * Math.max(1, hi); i++) {
    const mid = (lo + hi) / 2;
    if (g(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

function goldenMinimum(f: (t: number) => number, a: number, b: number): number {
  const r = (Math.sqrt(5) - 1) / 2;
  let c = b - r * (b - a);
  let d = a + r * (b - a);
  for (let i = 0; i < 200 && b - a > 1e-10 * Math.max(1, b); i++) {
    if (f(c) < f(d)) b = d;
    else a = c;
    c = b - r * (b - a);
    d = a + r * (b - a);
  }
  return (a + b) / 2;
}

export function optimalInterval(c: CleaningCycle): IntervalOptimum {
  validate(c);
  const fixed = c.cleaningCost + c.downtimeCost;
  const tau = c.downtimeDays;
  const p = c.penalty;

  if (p.model === 'linear') {
    if (p.slopePerDay2 === 0) return { optimalIntervalDays: null, averageCostPerDay: 0, reason: 'fouling costs nothing: never clean' };
    const t = -tau + Math.sqrt(tau * tau + (2 * fixed) / p.slopePerDay2);
    return { optimalIntervalDays: t, averageCostPerDay: averageCostPerDay(c, t) };
  }

  if (p.model === 'asymptotic') {
    const longRun = p.maxPerDay;
    if (fixed >= longRun * (p.timeConstantDays + tau)) {
      return {
        optimalIntervalDays: null,
        averageCostPerDay: longRun,
        reason: 'cleaning cost plus downtime cost is at least the long-run fouling cost times (time constant + downtime): never cleaning is cheapest',
      };
    }
    const g = (t: number) => rate(p, t) * (t + tau) - accumulated(p, t) - fixed;
    let hi = Math.max(1, p.timeConstantDays);
    while (g(hi) < 0) hi *= 2;
    const t = bisect(g, 0, hi);
    return { optimalIntervalDays: t, averageCostPerDay: averageCostPerDay(c, t) };
  }

  // Tabulated: scan whole days over the table, refine around the best, compare with the plateau after the table.
  const last = p.costPerDay.length - 1;
  const longRun = p.costPerDay[last]!;
  const j = (t: number) => averageCostPerDay(c, t);
  let bestDay = 1;
  for (let t = 2; t <= last; t++) if (j(t) < j(bestDay)) bestDay = t;
  const t = goldenMinimum(j, Math.max(tau > 0 ? 0 : 1e-9, bestDay - 1), Math.min(last, bestDay + 1));
  if (j(t) >= longRun) {
    return {
      optimalIntervalDays: null,
      averageCostPerDay: longRun,
      reason: 'the average cost keeps falling towards the long-run fouling cost: never cleaning is cheapest',
    };
  }
  return { optimalIntervalDays: t, averageCostPerDay: j(t) };
}

/** Average cost per day against the interval, for T = step, 2·step, … ≤ maxDays. */
export function costVersusInterval(c: CleaningCycle, maxDays: number, stepDays = 1): IntervalCurvePoint[] {
  validate(c);
  const out: IntervalCurvePoint[] = [];
  for (let t = stepDays; t <= maxDays + 1e-9; t += stepDays) out.push({ intervalDays: t, averageCostPerDay: averageCostPerDay(c, t) });
  return out;
}
