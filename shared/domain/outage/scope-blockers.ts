/**
 * Words for items that can never be chosen: a need on an id that is not among the items, needs that go round in a
 * circle, or a chain of needs ending at an item left out by hand. Used both in the per-item sentences and in the
 * problems the proposal lists.
 */
import { titleOf, type ScopeContext } from './scope-context.js';
import { quoted } from './scope-wording.js';

/** Why item i can never be chosen, as a clause: "it needs 'B', which needs 'A', which you left out". */
export function cannotBeChosenBecause(ctx: ScopeContext, i: number): string {
  const parts: string[] = [];
  const seen = new Set<number>();
  let at = i;
  for (;;) {
    seen.add(at);
    const first = at === i;
    const b = ctx.graph.blocker[at];
    if (!b) return parts.join('');
    if (b.kind === 'unknown') {
      parts.push(
        first
          ? `it needs an item with id ${quoted(b.needId)}, which is not among the items`
          : `, which needs an item with id ${quoted(b.needId)} that is not among the items`,
      );
      return parts.join('');
    }
    if (b.kind === 'circle') {
      parts.push(first ? `its needs go round in a circle (${circleWords(ctx, b.members)})` : ', whose needs go round in a circle');
      return parts.join('');
    }
    parts.push(`${first ? 'it needs' : ', which needs'} ${quoted(titleOf(ctx, b.need))}`);
    if (ctx.outByYou[b.need]) {
      parts.push(', which you left out');
      return parts.join('');
    }
    if (seen.has(b.need)) return parts.join('');
    at = b.need;
  }
}

/** The problems every proposal lists whatever was forced: needs on unknown ids and circles of needs. */
export function needsProblems(ctx: ScopeContext): string[] {
  const out: string[] = [];
  ctx.graph.unknownNeeds.forEach((ids, i) => {
    for (const id of ids)
      out.push(`${quoted(titleOf(ctx, i))} needs an item with id ${quoted(id)}, which is not among the items; it cannot be chosen until that is fixed.`);
  });
  for (const members of ctx.graph.circles) {
    out.push(
      members.length === 1
        ? `${quoted(titleOf(ctx, members[0]!))} needs itself; it cannot be chosen until that is fixed.`
        : `The needs of ${listWords(members.map((m) => quoted(titleOf(ctx, m))))} go round in a circle (${circleWords(ctx, members)}); none of them can be chosen until that is fixed.`,
    );
  }
  return out;
}

/** "'A' needs 'B', 'B' needs 'A'": the needs inside one circle, in item order. */
function circleWords(ctx: ScopeContext, members: number[]): string {
  const inCircle = new Set(members);
  const pairs: string[] = [];
  for (const m of members) {
    for (const j of ctx.graph.needs[m]!) if (inCircle.has(j)) pairs.push(`${quoted(titleOf(ctx, m))} needs ${quoted(titleOf(ctx, j))}`);
  }
  return pairs.join(', ');
}

/** "a", "a and b", "a, b and c". */
export function listWords(words: string[]): string {
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}
