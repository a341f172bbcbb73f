/** `calc condenser-point`: performance of one condenser data point (ENGINEERING.md §3). */
import type { CalcCommand } from '../run-calc.js';
import { calcCondenserPointInput, calcCondenserPointOutput, type CalcCondenserPointOutput } from '@shared/schemas/calc-condenser-point.js';
import { analyseCondenserPoint } from '@shared/domain/condenser/index.js';

const command: CalcCommand = {
  input: calcCondenserPointInput,
  output: calcCondenserPointOutput,
  run(input: unknown): CalcCondenserPointOutput {
    const v = calcCondenserPointInput.parse(input);
    const r = analyseCondenserPoint({
      backpressureKpa: v.backpressureKpa,
      cwInletC: v.cwInletC,
      cwOutletC: v.cwOutletC,
      cwFlowM3s: v.cwFlowM3s,
      pluggedTubes: v.pluggedTubes,
      referenceCleanliness: v.referenceCleanliness,
      uCleanWm2K: v.uCleanWm2K,
      geometry: {
        surfaceM2: v.surfaceM2,
        tubeCount: v.tubeCount,
        passes: v.passes,
        tubeOdMm: v.tubeOdMm,
        tubeBwg: v.tubeBwg,
        tubeMaterial: v.tubeMaterial,
      },
    });
    return {
      saturationC: r.saturationC,
      dutyMw: r.dutyMw,
      riseK: r.riseK,
      itdK: r.itdK,
      ttdK: r.ttdK,
      lmtdK: r.lmtdK,
      velocityMs: r.velocityMs,
      uWm2K: r.uWm2K,
      uCleanWm2K: r.uCleanWm2K,
      cleanliness: r.cleanliness,
      expectedBackpressureKpa: r.expectedBackpressureKpa,
      ...(r.warnings.length ? { warnings: r.warnings } : {}),
    };
  },
};

export default command;
