/** `calc saturation` contract (ENGINEERING.md §8). */
import { z } from 'zod';

/** A number field with messages that name the unit. */
const num = (unit: string) => z.number({ error: (iss) => (iss.input === undefined ? `required (${unit})` : `must be a number (${unit})`) });

export const calcSaturationInput = z
  .object({
    pressureKpa: num('kPa absolute').positive('pressureKpa must be positive (kPa absolute)').optional(),
    temperatureC: num('°C').optional(),
  })
  .strict()
  .refine((v) => (v.pressureKpa === undefined) !== (v.temperatureC === undefined), {
    message: 'give exactly one of pressureKpa or temperatureC',
  });

export const calcSaturationOutput = z
  .object({
    pressureKpa: num('kPa absolute'),
    temperatureC: num('°C'),
    hfKjKg: z.number(),
    hgKjKg: z.number(),
  })
  .strict();

export type CalcSaturationInput = z.infer<typeof calcSaturationInput>;
export type CalcSaturationOutput = z.infer<typeof calcSaturationOutput>;
