/**
 * The needs between work items ("B needs A": B may be chosen only with A) as index lists, and which items can never
 * be chosen: those that need an id that is not among the items, those whose needs go round in a circle, and,
 * transitively, those that need such an item or an item left out by hand.
 */
import type { ScopeItem } from './scope-problem.js';

/** Why an item can never be chosen. `via` points at a direct need that cannot be chosen or that was left out by hand. */
export type Blocker = { kind: 'unknown'; needId: string } | { kind: 'circle'; members: number[] } | { kind: 'via'; need: number };

export interface NeedsGraph {
  /** direct needs that name a known item, as indexes */
  needs: number[][];
  /** direct dependents */
  neededBy: number[][];
  /** per item, the needed ids that are not among the items */
  unknownNeeds: string[][];
  /** groups of items whose needs go round in a circle (an item needing itself is a group of one) */
  circles: number[][];
  /** per item, why it can never be chosen, or null */
  blocker: (Blocker | null)[];
  /** per item, the item itself and everything it needs, transitively */
  closure: Int32Array[];
  /** per item, the item itself and everything that needs it, transitively */
  dependents: Int32Array[];
}

export function needsGraph(items: ScopeItem[], index: Map<string, number>, outByYou: boolean[]): NeedsGraph {
  const n = items.length;
  const needs: number[][] = items.map(() => []);
  const neededBy: number[][] = items.map(() => []);
  const unknownNeeds: string[][] = items.map(() => []);
  items.forEach((item, i) => {
    for (const id of new Set(item.needs)) {
      const j = index.get(id);
      if (j === undefined) unknownNeeds[i]!.push(id);
      else {
        needs[i]!.push(j);
        neededBy[j]!.push(i);
      }
    }
  });
  const circles = circlesOf(needs);
  const blocker: (Blocker | null)[] = new Array(n).fill(null);
  const queue: number[] = [];
  for (let i = 0; i < n; i++) {
    if (unknownNeeds[i]!.length) blocker[i] = { kind: 'unknown', needId: unknownNeeds[i]![0]! };
  }
  for (const members of circles) for (const i of members) blocker[i] ??= { kind: 'circle', members };
  for (let i = 0; i < n; i++) if (blocker[i] || outByYou[i]) queue.push(i);
  // Whatever needs an item that cannot be chosen cannot be chosen either (breadth first: the shortest explanation).
  for (let q = 0; q < queue.length; q++) {
    const j = queue[q]!;
    for (const d of neededBy[j]!) {
      if (blocker[d] || outByYou[d]) continue;
      blocker[d] = { kind: 'via', need: j };
      queue.push(d);
    }
  }
  return {
    needs,
    neededBy,
    unknownNeeds,
    circles,
    blocker,
    closure: needs.map((_, i) => reach(i, needs)),
    dependents: needs.map((_, i) => reach(i, neededBy)),
  };
}

/** The item and everything reachable from it along `edges`, the item first. */
function reach(start: number, edges: number[][]): Int32Array {
  const seen = new Set<number>([start]);
  const order = [start];
  for (let k = 0; k < order.length; k++) {
    for (const j of edges[order[k]!]!) {
      if (!seen.has(j)) {
        seen.add(j);
        order.push(j);
      }
    }
  }
  return Int32Array.from(order);
}

/** Strongly connected groups of more than one item, and items that need themselves (Tarjan's algorithm, iterative). */
function circlesOf(needs: number[][]): number[][] {
  const n = needs.length;
  const order = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const onStack = new Uint8Array(n);
  const stack: number[] = [];
  const out: number[][] = [];
  let counter = 0;
  for (let root = 0; root < n; root++) {
    if (order[root] !== -1) continue;
    const frames: { v: number; next: number }[] = [{ v: root, next: 0 }];
    order[root] = low[root] = counter++;
    stack.push(root);
    onStack[root] = 1;
    while (frames.length) {
      const frame = frames[frames.length - 1]!;
      const { v } = frame;
      const edges = needs[v]!;
      if (frame.next < edges.length) {
        const w = edges[frame.next++]!;
        if (order[w] === -1) {
          order[w] = low[w] = counter++;
          stack.push(w);
          onStack[w] = 1;
          frames.push({ v: w, next: 0 });
        } else if (onStack[w]) low[v] = Math.min(low[v]!, order[w]!);
        continue;
      }
      frames.pop();
      const parent = frames[frames.length - 1];
      if (parent) low[parent.v] = Math.min(low[parent.v]!, low[v]!);
      if (low[v] !== order[v]) continue;
      const group: number[] = [];
      let w: number;
      do {
        w = stack.pop()!;
        onStack[w] = 0;
        group.push(w);
      } while (w !== v);
      if (group.length > 1 || needs[v]!.includes(v)) out.push(group.sort((a, b) => a - b));
    }
  }
  return out.sort((a, b) => a[0]! - b[0]!);
}
