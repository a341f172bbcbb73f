/** `calc penalty` contract (ENGINEERING.md §8). */
import { z } from 'zod';
import { BACKPRESSURE_BOUNDS_KPA } from '../domain/validity/rejection-reasons.js';

/** A number field with messages that name the unit. */
const num = (unit: string) => z.number({ error: (iss) => (iss.input === undefined ? `required (${unit})` : `must be a number (${unit})`) });

export const correctionCurveSchema = z
  .object({
    basis: z.enum(['heat-rate', 'output'], { error: 'curve.basis must be "heat-rate" or "output"' }),
    label: z.string().min(1).max(200),
    isGeneric: z.boolean().default(false),
    curves: z
      .array(
        z
          .object({
            loadFraction: num('fraction of rating').positive('loadFraction must be positive').max(1.2, 'loadFraction is a fraction of rating, at most 1.2'),
            points: z
              .array(z.object({ backpressureKpa: num('kPa absolute').positive(), changePct: num('%') }).strict())
              .min(2, 'each load curve needs at least two points'),
          })
          .strict(),
      )
      .min(1, 'a curve needs at least one load curve'),
  })
  .strict();

/** A backpressure a condenser may read: 0.7–50 kPa(a), the bounds of a measured point (BACKPRESSURE_BOUNDS_KPA). */
const backpressure = (name: string) =>
  num('kPa absolute')
    .min(
      BACKPRESSURE_BOUNDS_KPA.min,
      `${name} must be ${BACKPRESSURE_BOUNDS_KPA.min}–${BACKPRESSURE_BOUNDS_KPA.max} kPa absolute, the range a condenser may read`,
    )
    .max(
      BACKPRESSURE_BOUNDS_KPA.max,
      `${name} must be ${BACKPRESSURE_BOUNDS_KPA.min}–${BACKPRESSURE_BOUNDS_KPA.max} kPa absolute, the range a condenser may read`,
    );

export const calcPenaltyInput = z
  .object({
    loadFraction: num('fraction of rating').positive('loadFraction must be positive').max(1.2, 'loadFraction is a fraction of rating, at most 1.2'),
    ratingMw: num('MW').positive('ratingMw must be positive (MW)'),
    backpressureKpa: backpressure('backpressureKpa'),
    referenceBackpressureKpa: backpressure('referenceBackpressureKpa'),
    heatRateBtuKwh: num('Btu/kWh').positive('heatRateBtuKwh must be positive (Btu/kWh)'),
    fuelPricePerMmbtu: num('per MMBtu').min(0, 'fuelPricePerMmbtu cannot be negative'),
    replacementPricePerMwh: num('per MWh'),
    co2PricePerTonne: num('per tonne').min(0, 'co2PricePerTonne cannot be negative'),
    co2KgPerMmbtu: num('kg/MMBtu').min(0, 'co2KgPerMmbtu cannot be negative'),
    curve: correctionCurveSchema.optional(),
  })
  .strict();

export const calcPenaltyOutput = z
  .object({
    heatRatePenaltyPct: z.number(),
    outputPenaltyPct: z.number(),
    fuelCostPerHour: z.number(),
    co2CostPerHour: z.number(),
    capacityCostPerHour: z.number(),
    warnings: z.array(z.string()).optional(),
  })
  .strict();

export type CalcPenaltyInput = z.infer<typeof calcPenaltyInput>;
export type CalcPenaltyOutput = z.infer<typeof calcPenaltyOutput>;
