import { describe, expect, it } from 'vitest';
import { averageCostPerDay, optimalInterval } from '@shared/domain/decision/interval/cleaning-interval.js';
import runCalcCommand from '@backend/cli/commands/interval.js';

// Check values of ENGINEERING.md §6 [derived; classic result, cf. Kern, Process Heat Transfer (1950);
// Casado, Hydrocarbon Processing 1990]: closed forms T* = √(2C/k) and T* = −τ + √(τ² + 2(C + D)/k) for p = k·t,
// and the asymptotic p = p∞(1 − e^(−t/θ)) case solved numerically.
describe('optimal cleaning interval against the closed-form check values', () => {
  it('with a linear fouling cost and no downtime, the optimum is √(2C/k) = 77.460 days at $3,872.98/day', () => {
    const r = optimalInterval({ cleaningCost: 150_000, downtimeCost: 0, downtimeDays: 0, penalty: { model: 'linear', slopePerDay2: 50 } });
    expect(r.optimalIntervalDays).toBeCloseTo(Math.sqrt((2 * 150_000) / 50), 9);
    expect(r.optimalIntervalDays).toBeCloseTo(77.46, 3);
    expect(r.averageCostPerDay).toBeCloseTo(3872.98, 2);
  });

  it('with 5 days of downtime per cleaning, the optimum shortens to 72.621 days at $3,631.04/day', () => {
    const r = optimalInterval({ cleaningCost: 150_000, downtimeCost: 0, downtimeDays: 5, penalty: { model: 'linear', slopePerDay2: 50 } });
    expect(r.optimalIntervalDays).toBeCloseTo(72.621, 3);
    expect(r.averageCostPerDay).toBeCloseTo(3631.04, 2);
  });

  it('with an asymptotic fouling cost (p∞ = $3,000/day, θ = 60 days), the optimum is 194.11 days at $2,881.94/day', () => {
    const r = optimalInterval({
      cleaningCost: 150_000,
      downtimeCost: 0,
      downtimeDays: 0,
      penalty: { model: 'asymptotic', maxPerDay: 3000, timeConstantDays: 60 },
    });
    expect(r.optimalIntervalDays).toBeCloseTo(194.11, 2);
    expect(r.averageCostPerDay).toBeCloseTo(2881.94, 2);
    // invariant [derived]: at the optimum the fouling cost rate equals the average cost
    const t = r.optimalIntervalDays as number;
    expect(3000 * (1 - Math.exp(-t / 60))).toBeCloseTo(r.averageCostPerDay, 6);
  });

  it('when C + D ≥ p∞·(θ + τ) there is no finite optimum and the long-run cost is p∞', () => {
    // boundary [derived]: 3000 × (60 + 0) = 180,000
    const at = optimalInterval({
      cleaningCost: 180_000,
      downtimeCost: 0,
      downtimeDays: 0,
      penalty: { model: 'asymptotic', maxPerDay: 3000, timeConstantDays: 60 },
    });
    expect(at.optimalIntervalDays).toBeNull();
    expect(at.averageCostPerDay).toBe(3000);
    const below = optimalInterval({
      cleaningCost: 170_000,
      downtimeCost: 0,
      downtimeDays: 0,
      penalty: { model: 'asymptotic', maxPerDay: 3000, timeConstantDays: 60 },
    });
    expect(below.optimalIntervalDays).not.toBeNull();
    expect(below.averageCostPerDay).toBeLessThan(3000);
    // with downtime the threshold moves to p∞·(θ + τ) = 3000 × 70 = 210,000
    const withDowntime = optimalInterval({
      cleaningCost: 150_000,
      downtimeCost: 50_000,
      downtimeDays: 10,
      penalty: { model: 'asymptotic', maxPerDay: 3000, timeConstantDays: 60 },
    });
    expect(withDowntime.optimalIntervalDays).not.toBeNull();
    expect(
      averageCostPerDay(
        { cleaningCost: 150_000, downtimeCost: 50_000, downtimeDays: 10, penalty: { model: 'asymptotic', maxPerDay: 3000, timeConstantDays: 60 } },
        withDowntime.optimalIntervalDays as number,
      ),
    ).toBeLessThan(3000);
  });

  it('the interval command prints the check values to the cent and 2e-3 relative in days', () => {
    const out = runCalcCommand.run({ cleaningCost: 150_000, downtimeCost: 0, downtimeDays: 5, penalty: { model: 'linear', slopePerDay2: 50 } }) as {
      optimalIntervalDays: number;
      averageCostPerDay: number;
    };
    expect(Math.abs(out.optimalIntervalDays / 72.621 - 1)).toBeLessThan(2e-3);
    expect(out.averageCostPerDay).toBe(3631.04);
    const none = runCalcCommand.run({
      cleaningCost: 200_000,
      downtimeCost: 0,
      downtimeDays: 0,
      penalty: { model: 'asymptotic', maxPerDay: 3000, timeConstantDays: 60 },
    });
    expect(none).toMatchObject({ optimalIntervalDays: null, averageCostPerDay: 3000 });
  });
});
