/** `calc condenser-point` contract (ENGINEERING.md §8). */
import { z } from 'zod';
import { TUBE_MATERIALS } from '../domain/condenser/hei-tables.js';

/** A number field with messages that name the unit. */
const num = (unit: string) => z.number({ error: (iss) => (iss.input === undefined ? `required (${unit})` : `must be a number (${unit})`) });

const positive = (name: string, unit: string) => num(unit).positive(`${name} must be positive (${unit})`);

export const calcCondenserPointInput = z
  .object({
    backpressureKpa: positive('backpressureKpa', 'kPa absolute'),
    cwInletC: num('°C'),
    cwOutletC: num('°C'),
    cwFlowM3s: positive('cwFlowM3s', 'm³/s'),
    surfaceM2: positive('surfaceM2', 'outside surface, m²'),
    tubeCount: num('count').int('tubeCount must be a whole number').positive('tubeCount must be positive'),
    passes: num('count').int('passes must be a whole number').min(1, 'passes must be 1 to 4').max(4, 'passes must be 1 to 4'),
    tubeOdMm: positive('tubeOdMm', 'mm'),
    tubeBwg: num('BWG').int('tubeBwg must be a whole gauge number').min(12, 'tubeBwg must be 12 to 24').max(24, 'tubeBwg must be 12 to 24'),
    tubeMaterial: z.enum(TUBE_MATERIALS, { error: `tubeMaterial must be one of ${TUBE_MATERIALS.join(', ')}` }),
    pluggedTubes: num('count').int('pluggedTubes must be a whole number').min(0, 'pluggedTubes cannot be negative'),
    referenceCleanliness: num('fraction').positive('referenceCleanliness must be positive').max(1.5, 'referenceCleanliness is a fraction, at most 1.5'),
    uCleanWm2K: positive('uCleanWm2K', 'W/(m²·K)').optional(),
  })
  .strict();

export const calcCondenserPointOutput = z
  .object({
    saturationC: z.number(),
    dutyMw: z.number(),
    riseK: z.number(),
    itdK: z.number(),
    ttdK: z.number(),
    lmtdK: z.number(),
    velocityMs: z.number(),
    uWm2K: z.number(),
    uCleanWm2K: z.number(),
    cleanliness: z.number(),
    expectedBackpressureKpa: z.number(),
    warnings: z.array(z.string()).optional(),
  })
  .strict();

export type CalcCondenserPointInput = z.infer<typeof calcCondenserPointInput>;
export type CalcCondenserPointOutput = z.infer<typeof calcCondenserPointOutput>;
