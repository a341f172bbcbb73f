/**
 * Outage-scope optimiser speed on 60 candidate items (fictional work items from a fixed-seed PRNG): 20 mixed problems
 * (five crew lanes, about one item in seven needing another, some items without benefit, one forced in and one left
 * out on half of them, a budget of 30–50 % of the total cost) and 20 tight-budget ones (15 % of the total cost,
 * benefits within ±10 % of cost, so many items rank almost alike). The figure is the worst of the 40 median times
 * (median of 3 runs each, after warm-up runs). One core.
 */
import type { BenchRow } from '../run.js';
import { optimiseScope } from '../../shared/domain/outage/scope-optimiser.js';
import type { ScopeItem, ScopeProblem } from '../../shared/domain/outage/scope-problem.js';

function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const LANES = ['Tube crew', 'Waterbox crew', 'Air-leak team', 'Inspection team', 'Contractor'];

function sixtyItems(seed: number, tightBudget: boolean): ScopeProblem {
  const r = seededRandom(seed);
  const items: ScopeItem[] = [];
  for (let i = 0; i < 60; i++) {
    const cost = Math.round(5000 + r() * 200_000);
    const benefit = tightBudget ? Math.round(cost * (0.9 + 0.2 * r())) : Math.round(cost * (r() < 0.08 ? -0.2 : 0.3 + r() * 2.5));
    const needs = i > 3 && r() < 0.15 ? [`w${Math.floor(r() * i)}`] : [];
    items.push({ id: `w${i}`, title: `Work ${i}`, cost, durationDays: 1 + Math.floor(r() * 8), lane: LANES[Math.floor(r() * LANES.length)]!, benefit, needs });
  }
  const total = items.reduce((s, it) => s + it.cost, 0);
  return {
    items,
    budget: Math.round(total * (tightBudget ? 0.15 : 0.3 + r() * 0.2)),
    windowDays: 21 + Math.floor(r() * 14),
    forcedIn: r() < 0.5 ? ['w2'] : [],
    forcedOut: r() < 0.5 ? ['w5'] : [],
    currency: 'USD',
  };
}

function medianMs(runs: number, f: () => unknown): number {
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    f();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[runs >> 1]!;
}

export default async (): Promise<BenchRow[]> => {
  const problems = [...Array.from({ length: 20 }, (_, k) => sixtyItems(k + 1, false)), ...Array.from({ length: 20 }, (_, k) => sixtyItems(k + 101, true))];
  // Warm-up, as in the app's server process.
  for (let k = 0; k < 3; k++) for (const p of problems.slice(0, 10)) optimiseScope(p);
  const times = problems.map((p) => medianMs(3, () => optimiseScope(p)));
  return [
    {
      name: 'outage optimiser, 60 items',
      value: Math.max(...times),
      unit: 'ms',
      target: { value: 500, higherIsBetter: false },
    },
  ];
};
