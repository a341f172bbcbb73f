import { describe, expect, it } from 'vitest';
import { optimiseScope } from '@shared/domain/outage/scope-optimiser.js';
import type { ScopeItem, ScopeProblem } from '@shared/domain/outage/scope-problem.js';

const item = (id: string, title: string, cost: number, durationDays: number, lane: string, benefit: number, needs: string[] = []): ScopeItem => ({
  id,
  title,
  cost,
  durationDays,
  lane,
  benefit,
  needs,
});
const problem = (items: ScopeItem[], budget: number, windowDays: number, more: Partial<ScopeProblem> = {}): ScopeProblem => ({
  items,
  budget,
  windowDays,
  forcedIn: [],
  forcedOut: [],
  currency: 'USD',
  ...more,
});

describe('outage-scope sentences, worked by hand', () => {
  // Budget 110 USD, window 8 days; the scope is chosen for its value, benefit less cost. Worked by hand: {eddy, retube,
  // waterbox} brings 265 USD for 100 USD, 165 USD of value (Tube crew 7 days, Waterbox crew 3 days); air leak would take
  // the cost to 130 USD; plugging fits the budget (105 USD) but would take the Tube crew to 10 days. No other feasible
  // set reaches 165 USD of value (e.g. eddy+retube+air leak: 160 USD).
  const outage = problem(
    [
      item('eddy', 'Eddy-current inspection', 10, 2, 'Tube crew', 5),
      item('retube', 'Partial retubing', 50, 5, 'Tube crew', 200, ['eddy']),
      item('waterbox', 'Waterbox repair', 40, 3, 'Waterbox crew', 60),
      item('air', 'Air in-leakage repair', 30, 2, 'Waterbox crew', 45),
      item('plug', 'Tube plugging', 5, 3, 'Tube crew', 20),
      item('paint', 'Waterbox coating touch-up', 5, 1, 'Waterbox crew', 0),
      item('clean', 'High-pressure water cleaning', 20, 2, 'Tube crew', 90),
      item('balls', 'Sponge-ball refill', 4, 1, 'Tube crew', 15, ['clean']),
    ],
    110,
    8,
    { forcedOut: ['clean'] },
  );
  const proposal = optimiseScope(outage);

  it('chooses the hand-worked best scope with its totals and lane days', () => {
    expect(proposal.selectedItemIds).toEqual(['eddy', 'retube', 'waterbox']);
    expect(proposal.totalBenefit).toBe(265);
    expect(proposal.totalCost).toBe(100);
    expect(proposal.laneDays).toEqual({ 'Tube crew': 7, 'Waterbox crew': 3 });
    expect(proposal.feasible).toBe(true);
    expect(proposal.problems).toEqual([]);
  });

  it('says for each item why it is in or out', () => {
    expect(proposal.reasons).toEqual({
      eddy: "In: needed by 'Partial retubing', which is chosen.",
      retube: "In: it adds 150 USD of value (benefit less cost), no item left out adds more per USD, and it fits the budget and lane 'Tube crew'.",
      waterbox:
        "In: it adds 20 USD of value (benefit less cost); others add more per USD, but with it the budget and lane 'Waterbox crew' give the most value in total.",
      air: 'Left out: what is left of the budget (10 USD) does not cover its 30 USD, and its value per USD is the lowest of those left.',
      plug: "Left out: lane 'Tube crew' would need 10 days in an 8-day window.",
      paint: 'Left out: it brings no benefit.',
      clean: 'Left out by you.',
      balls: "Left out: it needs 'High-pressure water cleaning', which you left out.",
    });
  });

  it('leaves out an item whose need is left out, naming what the pair would break', () => {
    // Worked by hand (value = benefit less cost): waterbox alone adds 30 USD; eddy alone 20 USD; eddy + retube would add
    // 40 USD but cost 110 USD > 100 USD; all three cost 170 USD.
    const p = problem(
      [
        item('eddy', 'Eddy-current inspection', 80, 2, 'Inspection team', 100),
        item('retube', 'Partial retubing', 30, 5, 'Tube crew', 50, ['eddy']),
        item('waterbox', 'Waterbox repair', 60, 3, 'Waterbox crew', 90),
      ],
      100,
      8,
    );
    const out = optimiseScope(p);
    expect(out.selectedItemIds).toEqual(['waterbox']);
    expect(out.reasons.retube).toBe("Left out: it needs 'Eddy-current inspection', which is left out, and together they would go 70 USD over the budget.");
    expect(out.reasons.eddy).toBe(
      'Left out: what is left of the budget (40 USD) does not cover its 80 USD, and its value per USD is the lowest of those left.',
    );
  });

  it('when the budget is spent exactly, the lowest value per money left out says so', () => {
    // Worked by hand: a + b add 80 USD of value for exactly 100 USD; a + d add 75 USD; c is worst per USD (0.2).
    const items = [
      item('a', 'Waterbox repair', 60, 1, 'Crew', 120),
      item('b', 'Tube plugging', 40, 1, 'Crew', 60),
      item('c', 'Air in-leakage repair', 50, 1, 'Crew', 60),
    ];
    const out = optimiseScope(problem([...items, item('d', 'Eddy-current inspection', 30, 1, 'Crew', 45)], 100, 8));
    expect(out.selectedItemIds).toEqual(['a', 'b']);
    expect(out.reasons.c).toBe('Left out: the budget is spent and its value per USD is the lowest of those left.');
    expect(out.reasons.d).toBe('Left out: the budget is spent, and making room for its 30 USD would give up at least as much value as it adds.');
    // Alone among those left out, it is not "the lowest of those left".
    expect(optimiseScope(problem(items, 100, 8)).reasons.c).toBe(
      'Left out: the budget is spent, and making room for its 50 USD would give up at least as much value as it adds.',
    );
  });

  it('leaves out work that brings no more than it costs, saying so with its figures', () => {
    // Capital rationing: a project is worth doing only when it brings more than it costs (common practice).
    const out = optimiseScope(
      problem([item('a', 'Expansion joint', 42_000, 6, 'Crew', 34_514.4), item('b', 'Tube plugging', 18_000, 2, 'Crew', 35_000)], 160_000, 21),
    );
    expect(out.selectedItemIds).toEqual(['b']);
    expect(out.reasons.a).toBe('Left out: it brings 34,514 USD for 42,000 USD, no more than it costs.');
  });

  it('names items that cost more than the whole budget or take longer than the whole window', () => {
    const out = optimiseScope(problem([item('a', 'Full retubing', 500, 3, 'Crew', 900), item('b', 'Waterbox relining', 50, 12, 'Crew', 100)], 200, 8));
    expect(out.selectedItemIds).toEqual([]);
    expect(out.reasons.a).toBe('Left out: it costs 500 USD, more than the whole budget of 200 USD.');
    expect(out.reasons.b).toBe('Left out: it takes 12 days, longer than the whole window of 8 days.');
  });

  it('an item forced in and what it needs are in, whatever their benefit', () => {
    const out = optimiseScope(
      problem([item('eddy', 'Eddy-current inspection', 10, 2, 'Tube crew', -5), item('retube', 'Partial retubing', 50, 5, 'Tube crew', 0, ['eddy'])], 100, 8, {
        forcedIn: ['retube'],
      }),
    );
    expect(out.selectedItemIds).toEqual(['eddy', 'retube']);
    expect(out.reasons).toEqual({ eddy: "In: needed by 'Partial retubing', which you forced in.", retube: 'In: forced by you.' });
  });

  it('of two equal scopes it keeps the cheaper, then the shorter, then the one with the earlier id', () => {
    const cheaper = optimiseScope(problem([item('a', 'Plugging A', 8, 1, 'Crew', 10), item('b', 'Plugging B', 5, 1, 'Crew', 10)], 10, 8));
    expect(cheaper.selectedItemIds).toEqual(['b']);
    const shorter = optimiseScope(problem([item('a', 'Plugging A', 5, 3, 'Crew', 10), item('b', 'Plugging B', 5, 2, 'Crew', 10)], 5, 8));
    expect(shorter.selectedItemIds).toEqual(['b']);
    const byId = optimiseScope(problem([item('y', 'Plugging Y', 5, 2, 'Crew', 10), item('x', 'Plugging X', 5, 2, 'Crew', 10)], 5, 8));
    expect(byId.selectedItemIds).toEqual(['x']);
  });
});

describe('outage-scope problems the proposal reports', () => {
  const three = [
    item('p', 'Partial retubing', 80, 5, 'Tube crew', 300),
    item('q', 'Waterbox repair', 50, 6, 'Tube crew', 100),
    item('r', 'Tube plugging', 5, 1, 'Waterbox crew', 40),
  ];

  it('forced items over the budget: infeasible, by how much, and nothing else chosen', () => {
    const out = optimiseScope(problem(three, 100, 20, { forcedIn: ['p', 'q'] }));
    expect(out.feasible).toBe(false);
    expect(out.problems).toEqual(['The forced items and what they need cost 130 USD, 30 USD over the budget of 100 USD.']);
    expect(out.selectedItemIds).toEqual(['p', 'q']);
    expect(out.reasons.r).toBe('Left out: what you forced in already breaks the budget, so nothing else was added.');
    expect(out.reasons.p).toBe('In: forced by you.');
  });

  it('forced items over a lane window: infeasible, by how many days', () => {
    const out = optimiseScope(problem(three, 1000, 8, { forcedIn: ['p', 'q'] }));
    expect(out.feasible).toBe(false);
    expect(out.problems).toEqual(["Lane 'Tube crew' has 11 days of forced work in an 8-day window: 3 days too many."]);
    expect(out.selectedItemIds).toEqual(['p', 'q']);
    expect(out.reasons.r).toBe("Left out: what you forced in already breaks lane 'Tube crew', so nothing else was added.");
  });

  it('an item forced in that needs an item left out: infeasible, naming the need', () => {
    const out = optimiseScope(
      problem([item('eddy', 'Eddy-current inspection', 10, 2, 'Tube crew', 5), item('retube', 'Partial retubing', 50, 5, 'Tube crew', 200, ['eddy'])], 100, 8, {
        forcedIn: ['retube'],
        forcedOut: ['eddy'],
      }),
    );
    expect(out.feasible).toBe(false);
    expect(out.problems).toEqual(["'Partial retubing' is forced in but cannot be chosen: it needs 'Eddy-current inspection', which you left out."]);
    expect(out.selectedItemIds).toEqual([]);
    expect(out.reasons.retube).toBe("Left out although you forced it in: it needs 'Eddy-current inspection', which you left out.");
    expect(out.reasons.eddy).toBe('Left out by you.');
  });

  it('an item both forced in and left out: infeasible, left out until settled', () => {
    const out = optimiseScope(problem(three, 1000, 20, { forcedIn: ['r'], forcedOut: ['r'] }));
    expect(out.feasible).toBe(false);
    expect(out.problems).toEqual(["'Tube plugging' is both forced in and left out by you; it stays out until that is settled."]);
    expect(out.selectedItemIds).toEqual([]);
  });

  it('a circle of needs and a need on an unknown id are reported, not a crash, and those items stay out', () => {
    const out = optimiseScope(
      problem(
        [
          item('a', 'Waterbox repair', 10, 1, 'Crew', 50, ['b']),
          item('b', 'Air in-leakage repair', 10, 1, 'Crew', 50, ['a']),
          item('c', 'Tube plugging', 10, 1, 'Crew', 50, ['ghost']),
          item('d', 'Eddy-current inspection', 10, 1, 'Crew', 50, ['a']),
          item('e', 'Partial retubing', 10, 1, 'Crew', 50),
        ],
        1000,
        20,
      ),
    );
    expect(out.feasible).toBe(true);
    expect(out.selectedItemIds).toEqual(['e']);
    expect(out.problems).toEqual([
      "'Tube plugging' needs an item with id 'ghost', which is not among the items; it cannot be chosen until that is fixed.",
      "The needs of 'Waterbox repair' and 'Air in-leakage repair' go round in a circle ('Waterbox repair' needs 'Air in-leakage repair', 'Air in-leakage repair' needs 'Waterbox repair'); none of them can be chosen until that is fixed.",
    ]);
    expect(out.reasons.a).toBe(
      "Left out: its needs go round in a circle ('Waterbox repair' needs 'Air in-leakage repair', 'Air in-leakage repair' needs 'Waterbox repair').",
    );
    expect(out.reasons.c).toBe("Left out: it needs an item with id 'ghost', which is not among the items.");
    expect(out.reasons.d).toBe("Left out: it needs 'Waterbox repair', whose needs go round in a circle.");
  });

  it('figures that cannot be weighed give problems and choose nothing', () => {
    const out = optimiseScope(problem([item('a', 'Waterbox repair', -10, 1, 'Crew', 50), item('a', 'Tube plugging', 10, Number.NaN, 'Crew', 50)], 100, 8));
    expect(out.feasible).toBe(false);
    expect(out.selectedItemIds).toEqual([]);
    expect(out.problems).toEqual([
      "'Waterbox repair' needs a cost of zero or more.",
      "The id 'a' is used by more than one item.",
      "'Tube plugging' needs a duration of zero days or more.",
    ]);
  });
});
