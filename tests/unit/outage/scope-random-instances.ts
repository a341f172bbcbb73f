/** Seeded random outage-scope problems for the optimiser tests (fictional items; a fixed-seed PRNG, mulberry32). */
import type { ScopeItem, ScopeProblem } from '@shared/domain/outage/scope-problem.js';

export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const LANES = ['Tube crew', 'Waterbox crew', 'Inspection team'];

/**
 * n items in up to three lanes; about one in five needs another item (now and then an id that does not exist, and
 * needs may go round in a circle); a few are forced in or left out; a budget of 30–70 % of the total cost; some
 * benefits zero or negative; costs whole or with cents, durations in whole or half days.
 */
export function randomScopeProblem(seed: number, n: number): ScopeProblem {
  const r = seededRandom(seed);
  const pick = <T>(xs: T[]): T => xs[Math.floor(r() * xs.length)]!;
  const laneCount = 1 + Math.floor(r() * 3);
  const items: ScopeItem[] = [];
  for (let i = 0; i < n; i++) {
    const cost = r() < 0.8 ? 1 + Math.floor(r() * 100) : Math.round(r() * 10_000) / 100;
    const roll = r();
    const benefit = roll < 0.1 ? 0 : roll < 0.2 ? -Math.round(r() * 40) : Math.round(cost * (0.2 + r() * 2.5));
    items.push({
      id: `item-${String(i).padStart(2, '0')}`,
      title: `Work ${i}`,
      cost,
      durationDays: Math.floor(r() * 13) / 2,
      lane: LANES[Math.floor(r() * laneCount)]!,
      benefit,
      needs: [],
    });
  }
  for (const item of items) {
    if (n > 1 && r() < 0.2) item.needs.push(pick(items.filter((o) => o !== item)).id);
    if (r() < 0.02) item.needs.push('no-such-item');
  }
  const total = items.reduce((s, it) => s + it.cost, 0);
  const forcedIn = items.filter(() => r() < 0.06).map((it) => it.id);
  const forcedOut = items.filter(() => r() < 0.06).map((it) => it.id);
  return { items, budget: Math.round(total * (0.3 + r() * 0.4)), windowDays: 2 + Math.floor(r() * 9), forcedIn, forcedOut, currency: 'EUR' };
}
