/**
 * Engineering core speed on one core: saturation temperature, the full condenser point (duty, LMTD,
 * U, HEI U_clean, CF, expected backpressure), and the model P(t1, W, Q, Np, CF) the scheduler calls.
 */
import type { BenchRow } from '../run.js';
import { saturationTemperatureC } from '../../shared/domain/steam/index.js';
import { analyseCondenserPoint, backpressureAtCleanlinessKpa, type CondenserGeometry } from '../../shared/domain/condenser/index.js';

const GEOMETRY: CondenserGeometry = { surfaceM2: 28500, tubeCount: 31200, passes: 2, tubeOdMm: 25.4, tubeBwg: 22, tubeMaterial: 'titanium' };

/** Calls `body(i)` for about `seconds` after a warm-up; returns calls per second. */
function rate(body: (i: number) => number, seconds = 0.6): number {
  let sink = 0;
  for (let i = 0; i < 20_000; i++) sink += body(i);
  let n = 0;
  const batch = 10_000;
  const t0 = performance.now();
  let elapsed = 0;
  while (elapsed < seconds * 1000) {
    for (let k = 0; k < batch; k++) sink += body(n + k);
    n += batch;
    elapsed = performance.now() - t0;
  }
  if (!Number.isFinite(sink)) throw new Error('benchmark produced a non-finite result');
  return n / (elapsed / 1000);
}

export default async (): Promise<BenchRow[]> => {
  // The inputs cycle through tables of 1,024 and 256 values: `i & 1023` and `i & 255` always land inside them.
  const pressures = Float64Array.from({ length: 1024 }, (_, k) => 1 + (29 * k) / 1023);
  const tsat = rate((i) => saturationTemperatureC(pressures[i & 1023]!));

  const inlets = Float64Array.from({ length: 256 }, (_, k) => 10 + (20 * k) / 255);
  const point = rate((i) => {
    const t1 = inlets[i & 255]!;
    const r = analyseCondenserPoint({
      backpressureKpa: 4 + t1 * 0.15,
      cwInletC: t1,
      cwOutletC: t1 + 9,
      cwFlowM3s: 15,
      pluggedTubes: 300,
      geometry: GEOMETRY,
      referenceCleanliness: 0.85,
    });
    return r.expectedBackpressureKpa + r.cleanliness;
  });

  const model = rate((i) =>
    backpressureAtCleanlinessKpa({
      geometry: GEOMETRY,
      cwInletC: inlets[i & 255]!,
      cwFlowM3s: 15,
      dutyMw: 600,
      pluggedTubes: 300,
      cleanliness: 0.5 + (i & 63) / 128,
    }),
  );

  return [
    { name: 'IF97 saturation temperature', value: tsat, unit: 'evals/s', target: { value: 2_000_000, higherIsBetter: true } },
    { name: 'condenser point (U, U_clean, CF, expected p)', value: point, unit: 'points/s', target: { value: 500_000, higherIsBetter: true } },
    { name: 'expected backpressure model P(t1,W,Q,Np,CF)', value: model, unit: 'evals/s' },
  ];
};
