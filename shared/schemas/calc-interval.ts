/** `calc interval` contract (ENGINEERING.md §8): optimal interval of a repeating cleaning cycle (§6). */
import { z } from 'zod';

const money = (name: string) =>
  z
    .number({ error: `${name} must be a number (money)` })
    .finite()
    .min(0, `${name} cannot be negative`);

export const calcIntervalInput = z
  .object({
    cleaningCost: money('cleaningCost'),
    downtimeCost: money('downtimeCost'),
    downtimeDays: z.number({ error: 'downtimeDays must be a number (days)' }).finite().min(0, 'downtimeDays cannot be negative'),
    penalty: z.discriminatedUnion(
      'model',
      [
        z
          .object({
            model: z.literal('linear'),
            slopePerDay2: z.number({ error: 'slopePerDay2 must be a number (money per day per day)' }).finite().min(0, 'slopePerDay2 cannot be negative'),
          })
          .strict(),
        z
          .object({
            model: z.literal('asymptotic'),
            maxPerDay: z.number({ error: 'maxPerDay must be a number (money per day)' }).finite().min(0, 'maxPerDay cannot be negative'),
            timeConstantDays: z.number({ error: 'timeConstantDays must be a number (days)' }).finite().positive('timeConstantDays must be above 0'),
          })
          .strict(),
      ],
      { error: 'penalty.model must be "linear" or "asymptotic"' },
    ),
  })
  .strict();

export const calcIntervalOutput = z
  .object({
    optimalIntervalDays: z.number().nullable(),
    averageCostPerDay: z.number(),
    warnings: z.array(z.string()).optional(),
  })
  .strict();

export type CalcIntervalInput = z.infer<typeof calcIntervalInput>;
export type CalcIntervalOutput = z.infer<typeof calcIntervalOutput>;
