/** The fouling cost by cleaning cycle, and the shaded gap between actual and expected backpressure. */
import { describe, expect, it } from 'vitest';
import { costCycles, gapShapes } from '@frontend/lib/chart-cycles';

const day = (n: number) => `2025-03-${String(n).padStart(2, '0')}`;

describe('fouling cost by cleaning cycle', () => {
  const days = Array.from({ length: 10 }, (_, i) => ({ day: day(i + 1), foulingCost: 100 }));

  it('restarts the running cost at zero on each cleaning day and gives each cycle its own total', () => {
    const cycles = costCycles(days, [day(4), day(8)]);
    expect(cycles.map((c) => [c.from, c.to, c.cost, c.startsAtCleaning])).toEqual([
      [day(1), day(3), 300, false],
      [day(4), day(7), 400, true],
      [day(8), day(10), 300, true],
    ]);
    expect(cycles[1]?.running.map((r) => r.y)).toEqual([100, 200, 300, 400]);
  });

  it('adds up to the period total, whatever the cleanings, and counts a missing day as nothing', () => {
    const gappy = days.map((d, i) => (i === 5 ? { ...d, foulingCost: null } : d));
    const cycles = costCycles(gappy, [day(2), day(6)]);
    expect(cycles.reduce((a, c) => a + c.cost, 0)).toBe(900);
  });

  it('keeps one cycle when no cleaning falls in the period, and ignores cleanings before it', () => {
    const cycles = costCycles(days, ['2025-01-10']);
    expect(cycles).toHaveLength(1);
    expect(cycles[0]?.startsAtCleaning).toBe(false);
    expect(cycles[0]?.cost).toBe(1000);
  });

  it('marks the first cycle as starting at a cleaning when the period opens on a cleaning day', () => {
    expect(costCycles(days, [day(1)])[0]?.startsAtCleaning).toBe(true);
  });
});

describe('gap between actual and expected backpressure', () => {
  it('shades above the expected line where actual is higher, below where lower', () => {
    const shapes = gapShapes([
      { x: 0, actual: 10, expected: 8 },
      { x: 1, actual: 11, expected: 8 },
      { x: 2, actual: 6, expected: 8 },
    ]);
    expect(shapes.map((s) => s.side)).toEqual(['above', 'above', 'below']);
  });

  it('splits a day pair where the lines cross, at the crossing point', () => {
    // actual falls from +2 above to −2 below expected: they meet halfway (closed-form linear interpolation)
    const shapes = gapShapes([
      { x: 0, actual: 10, expected: 8 },
      { x: 10, actual: 6, expected: 8 },
    ]);
    expect(shapes).toHaveLength(2);
    expect(shapes[0]?.points[1]).toEqual([5, 8]);
  });

  it('leaves a gap where either value is missing', () => {
    expect(
      gapShapes([
        { x: 0, actual: 10, expected: null },
        { x: 1, actual: 11, expected: 8 },
      ]),
    ).toEqual([]);
  });
});
