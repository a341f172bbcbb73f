/** Student's t quantile for the forecast band with few points. */
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { normalQuantile, studentTQuantile } from '@shared/domain/statistics.js';

/** jstat (an independent implementation, installed with the project) as a cross-check. */
const jStat = createRequire(import.meta.url)('jstat') as { studentt: { inv(p: number, dof: number): number } };

describe("Student's t quantile", () => {
  it('matches the published table of critical values to the table’s 3 decimals', () => {
    // pub: NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2, upper critical values of Student's t.
    const table: [p: number, dof: number, t: number][] = [
      [0.95, 10, 1.812],
      [0.95, 1, 6.314],
      [0.975, 5, 2.571],
      [0.975, 10, 2.228],
      [0.975, 30, 2.042],
      [0.99, 7, 2.998],
      [0.995, 2, 9.925],
      [0.9995, 20, 3.85],
    ];
    for (const [p, dof, t] of table) expect(studentTQuantile(p, dof), `t(${p}, ${dof})`).toBeCloseTo(t, 3);
  });

  it('equals the closed forms for 1 and 2 degrees of freedom to 1e-12', () => {
    // derived: ν = 1 is the Cauchy distribution, t = tan(π(p − ½)); ν = 2 gives t = (2p − 1)/√(2p(1 − p)).
    for (const p of [0.6, 0.9, 0.95, 0.975, 0.999]) {
      expect(studentTQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 10);
      expect(studentTQuantile(p, 2)).toBeCloseTo((2 * p - 1) / Math.sqrt(2 * p * (1 - p)), 12);
    }
  });

  it('agrees with jstat to its precision (1e-6) and is antisymmetric about the median', () => {
    for (const dof of [1, 2, 3, 7, 12, 40, 200]) {
      for (const p of [0.6, 0.9, 0.95, 0.975, 0.999]) {
        expect(studentTQuantile(p, dof)).toBeCloseTo(jStat.studentt.inv(p, dof), 6);
        expect(studentTQuantile(1 - p, dof)).toBeCloseTo(-studentTQuantile(p, dof), 10);
      }
    }
    expect(studentTQuantile(0.5, 9)).toBe(0);
  });

  it('tends to the normal quantile as the degrees of freedom grow', () => {
    expect(studentTQuantile(0.95, 20_000)).toBeCloseTo(normalQuantile(0.95), 3);
    expect(studentTQuantile(0.95, 20_000)).toBeGreaterThan(normalQuantile(0.95));
  });

  it('refuses a probability outside (0, 1) or degrees of freedom that are not a whole number from 1', () => {
    expect(() => studentTQuantile(1, 5)).toThrow(/0 < p < 1/);
    expect(() => studentTQuantile(0.9, 0)).toThrow(/degrees of freedom/);
    expect(() => studentTQuantile(0.9, 2.5)).toThrow(/whole number of degrees of freedom/);
  });
});
