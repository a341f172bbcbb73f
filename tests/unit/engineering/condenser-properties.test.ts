/** Property-based checks of the condenser model (fast-check, seeded by vitest's run). */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { backpressureAtCleanlinessKpa } from '@shared/domain/condenser/index.js';
import condenserPointCommand from '@backend/cli/commands/condenser-point.js';
import saturationCommand from '@backend/cli/commands/saturation.js';
import penaltyCommand from '@backend/cli/commands/penalty.js';
import { runCalc } from '@backend/cli/run-calc.js';
import { GEOMETRY } from './condenser-fixture.js';

const state = fc.record({
  cwInletC: fc.double({ min: 1, max: 38, noNaN: true }),
  cwFlowM3s: fc.double({ min: 8, max: 22, noNaN: true }),
  dutyMw: fc.double({ min: 200, max: 700, noNaN: true }),
  pluggedTubes: fc.integer({ min: 0, max: 6000 }),
});

describe('expected backpressure (properties)', () => {
  it('lower cleanliness never lowers expected backpressure', () => {
    fc.assert(
      fc.property(state, fc.double({ min: 0.3, max: 1.1, noNaN: true }), fc.double({ min: 0, max: 0.25, noNaN: true }), (s, cf, drop) => {
        const hi = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...s, cleanliness: cf });
        const lo = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...s, cleanliness: Math.max(cf - drop, 0.05) });
        // 1e-12 relative: two cleanliness values one ulp apart may round either way
        expect(lo).toBeGreaterThanOrEqual(hi * (1 - 1e-12));
      }),
      { numRuns: 300 },
    );
  });

  it('a warmer CW inlet never lowers it when U is held fixed', () => {
    fc.assert(
      fc.property(
        state,
        fc.double({ min: 1500, max: 4000, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0.3, max: 1.0, noNaN: true }),
        (s, uClean, dt, cf) => {
          const base = { geometry: GEOMETRY, ...s, cleanliness: cf, uCleanWm2K: uClean };
          const cold = backpressureAtCleanlinessKpa(base);
          const warm = backpressureAtCleanlinessKpa({ ...base, cwInletC: s.cwInletC + dt });
          expect(warm).toBeGreaterThanOrEqual(cold * (1 - 1e-12));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('with the HEI Fw factor a warmer inlet CAN lower it at low NTU (cold water, low U): real, not a bug', () => {
    // Fw rises about 3.5 %/K between 40 and 50 °F; when Q/(U·A) is large (≈ 30 K or more) the gain in U
    // outweighs the warmer water. Documented so nobody "fixes" it.
    const s = { geometry: GEOMETRY, cwFlowM3s: 15, dutyMw: 625, pluggedTubes: 0, cleanliness: 0.2 };
    const at5 = backpressureAtCleanlinessKpa({ ...s, cwInletC: 5 });
    const at6 = backpressureAtCleanlinessKpa({ ...s, cwInletC: 6 });
    expect(at6).toBeLessThan(at5);
    // at ordinary cleanliness the usual direction holds
    expect(backpressureAtCleanlinessKpa({ ...s, cleanliness: 0.85, cwInletC: 6 })).toBeGreaterThan(
      backpressureAtCleanlinessKpa({ ...s, cleanliness: 0.85, cwInletC: 5 }),
    );
  });

  it('more plugged tubes never lower it (total flow held)', () => {
    fc.assert(
      fc.property(state, fc.integer({ min: 1, max: 3000 }), fc.double({ min: 0.4, max: 1, noNaN: true }), (s, more, cf) => {
        const a = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...s, cleanliness: cf });
        const b = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...s, pluggedTubes: s.pluggedTubes + more, cleanliness: cf });
        expect(b).toBeGreaterThanOrEqual(a);
      }),
      { numRuns: 200 },
    );
  });
});

describe('invalid input always gets a clear error', () => {
  const anyValue = fc.oneof(
    fc.double({ noNaN: true, noDefaultInfinity: true }),
    fc.integer({ min: -100, max: 40000 }),
    fc.string({ maxLength: 5 }),
    fc.constant(null),
    fc.boolean(),
    fc.constant(undefined),
  );
  const keys = [
    'backpressureKpa',
    'cwInletC',
    'cwOutletC',
    'cwFlowM3s',
    'surfaceM2',
    'tubeCount',
    'passes',
    'tubeOdMm',
    'tubeBwg',
    'tubeMaterial',
    'pluggedTubes',
    'referenceCleanliness',
    'uCleanWm2K',
    'pressureKpa',
    'temperatureC',
    'loadFraction',
  ];
  const valid = {
    backpressureKpa: 6.5,
    cwInletC: 22,
    cwOutletC: 31,
    cwFlowM3s: 15,
    surfaceM2: 28500,
    tubeCount: 31200,
    passes: 2,
    tubeOdMm: 25.4,
    tubeBwg: 22,
    tubeMaterial: 'titanium',
    pluggedTubes: 0,
    referenceCleanliness: 0.85,
  };

  it.each([
    ['condenser-point', condenserPointCommand],
    ['saturation', saturationCommand],
    ['penalty', penaltyCommand],
  ] as const)('%s: every input yields either finite numbers or an error message (never NaN, never a crash)', (_name, command) => {
    fc.assert(
      fc.property(fc.dictionary(fc.constantFrom(...keys), anyValue, { maxKeys: 6 }), fc.boolean(), (patch, startValid) => {
        const input = JSON.parse(JSON.stringify(startValid ? { ...valid, ...patch } : patch)) as unknown;
        const { output } = runCalc(command, JSON.stringify(input));
        const result = JSON.parse(output) as Record<string, unknown>;
        if ('error' in result) {
          expect(typeof result.error).toBe('string');
          expect((result.error as string).length).toBeGreaterThan(8);
          expect(result.error).not.toMatch(/undefined is not|cannot read|NaN/i);
        } else {
          for (const v of Object.values(result)) if (typeof v === 'number') expect(Number.isFinite(v)).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });
});
