import { describe, expect, it } from 'vitest';
import { optimiseScope } from '@shared/domain/outage/scope-optimiser.js';
import type { ScopeProblem, ScopeProposal } from '@shared/domain/outage/scope-problem.js';
import { randomScopeProblem } from './scope-random-instances.js';

const SLACK = 1e-6;

/** Items that can never be chosen: a need on an unknown id, on a circle of needs, or (transitively) on such an item. */
function neverChosen(p: ScopeProblem): Set<string> {
  const byId = new Map(p.items.map((it) => [it.id, it]));
  const reaches = (from: string, target: string): boolean => {
    const seen = new Set<string>();
    const stack = [...(byId.get(from)?.needs ?? [])];
    while (stack.length) {
      const id = stack.pop()!;
      if (id === target) return true;
      if (seen.has(id)) continue;
      seen.add(id);
      stack.push(...(byId.get(id)?.needs ?? []));
    }
    return false;
  };
  const bad = new Set(p.items.filter((it) => it.needs.some((id) => !byId.has(id)) || reaches(it.id, it.id)).map((it) => it.id));
  for (let changed = true; changed;) {
    changed = false;
    for (const it of p.items) {
      if (!bad.has(it.id) && it.needs.some((id) => bad.has(id))) {
        bad.add(it.id);
        changed = true;
      }
    }
  }
  return bad;
}

/** Every rule a scope must keep: budget, each lane's window, needs, forced in and out, never-chosen items. */
function breaches(p: ScopeProblem, chosen: Set<string>): string[] {
  const out: string[] = [];
  const items = p.items.filter((it) => chosen.has(it.id));
  const cost = items.reduce((s, it) => s + it.cost, 0);
  if (cost > p.budget + SLACK) out.push(`cost ${cost} over budget ${p.budget}`);
  const lanes = new Map<string, number>();
  for (const it of items) lanes.set(it.lane, (lanes.get(it.lane) ?? 0) + it.durationDays);
  for (const [lane, d] of lanes) if (d > p.windowDays + SLACK) out.push(`lane ${lane} ${d} days`);
  for (const it of items) for (const need of it.needs) if (!chosen.has(need)) out.push(`${it.id} lacks ${need}`);
  for (const id of p.forcedIn) if (!chosen.has(id)) out.push(`forced ${id} missing`);
  for (const id of p.forcedOut) if (chosen.has(id)) out.push(`left-out ${id} chosen`);
  const never = neverChosen(p);
  for (const it of items) if (never.has(it.id)) out.push(`${it.id} can never be chosen`);
  return out;
}

interface Best {
  /** benefit less cost: what the scope is chosen for */
  value: number;
  benefit: number;
  cost: number;
  days: number;
}

/** Best (value = benefit less cost, then lower cost, then fewer days) over all 2^n subsets; null when no subset keeps every rule. */
function bruteForce(p: ScopeProblem): Best | null {
  const n = p.items.length;
  const bit = new Map(p.items.map((it, i) => [it.id, 1 << i]));
  const never = neverChosen(p);
  const maskOf = (ids: string[]) => ids.reduce((m, id) => m | (bit.get(id) ?? 0), 0);
  const needs = p.items.map((it) => maskOf(it.needs));
  const forcedIn = maskOf(p.forcedIn);
  const banned = maskOf(p.forcedOut) | maskOf([...never]);
  const lanes = [...new Set(p.items.map((it) => it.lane))];
  const laneOf = p.items.map((it) => lanes.indexOf(it.lane));
  let best: Best | null = null;
  for (let mask = 0; mask < 1 << n; mask++) {
    if ((mask & forcedIn) !== forcedIn || mask & banned) continue;
    let benefit = 0;
    let cost = 0;
    let days = 0;
    const laneDays = lanes.map(() => 0);
    let ok = true;
    for (let i = 0; i < n && ok; i++) {
      if (!(mask & (1 << i))) continue;
      if ((mask & needs[i]!) !== needs[i]) ok = false;
      const it = p.items[i]!;
      benefit += it.benefit;
      cost += it.cost;
      days += it.durationDays;
      laneDays[laneOf[i]!]! += it.durationDays;
    }
    if (!ok || cost > p.budget + SLACK || laneDays.some((d) => d > p.windowDays + SLACK)) continue;
    const value = benefit - cost;
    const better =
      !best ||
      value > best.value + SLACK ||
      (Math.abs(value - best.value) <= SLACK && (cost < best.cost - SLACK || (Math.abs(cost - best.cost) <= SLACK && days < best.days - SLACK)));
    if (better) best = { value, benefit, cost, days };
  }
  return best;
}

function checkAgainstBruteForce(p: ScopeProblem, proposal: ScopeProposal): 'feasible' | 'infeasible' {
  const chosen = new Set(proposal.selectedItemIds);
  expect(Object.keys(proposal.reasons).sort()).toEqual(p.items.map((it) => it.id).sort());
  for (const it of p.items) expect(proposal.reasons[it.id]!.startsWith('In')).toBe(chosen.has(it.id));
  const best = bruteForce(p);
  if (!best) {
    expect(proposal.feasible).toBe(false);
    expect(proposal.problems.length).toBeGreaterThan(0);
    // Nothing beyond what was forced in and what that needs.
    const forcedClosure = new Set<string>();
    const stack = [...p.forcedIn];
    while (stack.length) {
      const id = stack.pop()!;
      if (forcedClosure.has(id)) continue;
      forcedClosure.add(id);
      stack.push(...(p.items.find((it) => it.id === id)?.needs ?? []));
    }
    for (const id of chosen) expect(forcedClosure.has(id)).toBe(true);
    return 'infeasible';
  }
  expect(proposal.feasible).toBe(true);
  expect(breaches(p, chosen)).toEqual([]);
  const items = p.items.filter((it) => chosen.has(it.id));
  expect(proposal.totalBenefit).toBeCloseTo(best.benefit, 6);
  expect(proposal.totalCost).toBeCloseTo(best.cost, 6);
  expect(items.reduce((s, it) => s + it.durationDays, 0)).toBeCloseTo(best.days, 6);
  // An item that brings no more than it costs is in only when forced or needed by a chosen item.
  for (const it of items) {
    if (it.benefit > it.cost || p.forcedIn.includes(it.id)) continue;
    expect(items.some((o) => o.needs.includes(it.id))).toBe(true);
  }
  return 'feasible';
}

describe('outage-scope optimiser against every subset', () => {
  it('on 240 seeded random problems of 1 to 16 items it finds the most value, benefit less cost (then lowest cost, then fewest days), and keeps every rule', () => {
    const seen = { feasible: 0, infeasible: 0 };
    for (let n = 1; n <= 16; n++) {
      for (let k = 0; k < 15; k++) {
        const p = randomScopeProblem(1000 * n + k, n);
        seen[checkAgainstBruteForce(p, optimiseScope(p))]++;
      }
    }
    expect(seen.feasible + seen.infeasible).toBe(240);
    // Both kinds occur, so both branches of the check ran.
    expect(seen.feasible).toBeGreaterThan(150);
    expect(seen.infeasible).toBeGreaterThan(5);
  });

  it('gives the same scope whatever order the items come in', () => {
    for (let k = 0; k < 20; k++) {
      const p = randomScopeProblem(77_000 + k, 12);
      const reversed = { ...p, items: [...p.items].reverse() };
      expect([...optimiseScope(reversed).selectedItemIds].sort()).toEqual([...optimiseScope(p).selectedItemIds].sort());
    }
  });

  it('finishes a 60-item problem with a scope that keeps every rule', () => {
    const p = randomScopeProblem(60_060, 60);
    const proposal = optimiseScope(p);
    expect(proposal.problems.filter((s) => s.includes('search stopped'))).toEqual([]);
    if (proposal.feasible) expect(breaches(p, new Set(proposal.selectedItemIds))).toEqual([]);
    expect(Object.keys(proposal.reasons)).toHaveLength(60);
  });
});
