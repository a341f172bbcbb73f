/** `calc fouling-fit` contract (our design, documented in the README): fouling trend since the last cleaning. */
import { z } from 'zod';

export const calcFoulingFitInput = z
  .object({
    points: z
      .array(
        z
          .object({
            day: z.number({ error: 'day must be a number (days since the cleaning)' }).finite().min(0, 'day cannot be negative'),
            cleanliness: z
              .number({ error: 'cleanliness must be a number (fraction)' })
              .finite()
              .gt(0, 'cleanliness must be above 0')
              .max(1.5, 'cleanliness is a fraction, at most 1.5'),
          })
          .strict(),
      )
      .max(20_000, 'at most 20,000 points'),
    cleanlinessAfterCleaning: z.number().finite().gt(0).max(1.5).optional(),
    uCleanWm2K: z.number().finite().positive('uCleanWm2K must be above 0 (W/(m²·K))').optional(),
    excludedPeriods: z
      .array(
        z
          .object({ fromDay: z.number().finite(), toDay: z.number().finite() })
          .strict()
          .refine((r) => r.toDay >= r.fromDay, 'toDay must not be before fromDay'),
      )
      .max(1000)
      .optional(),
    forecastDays: z.number().int().min(0).max(1830).optional(),
    bandProbability: z.number().min(0.5).max(0.999).optional(),
    outlierThreshold: z.number().min(1).max(50).optional(),
  })
  .strict();

const modelSummary = z
  .object({
    model: z.enum(['linear', 'asymptotic', 'falling-rate']),
    parameters: z.record(z.string(), z.number()),
    foulingResistance: z.record(z.string(), z.number()).optional(),
    cleanlinessAfterCleaning: z.number(),
    aic: z.number(),
    rSquared: z.number(),
    residualStdCleanliness: z.number(),
  })
  .strict();

export const calcFoulingFitOutput = z.discriminatedUnion('status', [
  z
    .object({
      status: z.literal('fitted'),
      chosen: modelSummary,
      models: z.array(modelSummary),
      pointsUsed: z.number(),
      excludedDays: z.array(z.number()),
      outlierDays: z.array(z.number()),
      bandProbability: z.number(),
      forecast: z.array(z.object({ day: z.number(), cleanliness: z.number(), low: z.number(), high: z.number().nullable() }).strict()),
      warnings: z.array(z.string()).optional(),
    })
    .strict(),
  z
    .object({
      status: z.literal('not-enough-data'),
      reason: z.string(),
      minimumPoints: z.number(),
      minimumSpanDays: z.number(),
      usablePoints: z.number(),
      spanDays: z.number(),
    })
    .strict(),
]);

export type CalcFoulingFitInput = z.infer<typeof calcFoulingFitInput>;
export type CalcFoulingFitOutput = z.infer<typeof calcFoulingFitOutput>;
