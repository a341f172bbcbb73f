/** The MW and t CO2 behind a cost, as the views send them (shared/domain/turbine/physical-cost.ts computes them). */
import { z } from 'zod';

export const physicalCostView = z
  .object({
    penaltyMwh: z.number(),
    lostMwh: z.number(),
    lostMw: z.number().nullable(),
    extraFuelMmbtu: z.number(),
    co2Tonnes: z.number(),
  })
  .strict();
export type PhysicalCostView = z.infer<typeof physicalCostView>;

/** A cost's physical quantities per day and over a longer stretch, with the share of hours the unit is capacity-limited. */
export const physicalCostPair = z
  .object({
    capacityLimitedShare: z.number(),
    perDay: physicalCostView.nullable(),
    sinceCleaning: physicalCostView.nullable(),
  })
  .strict();
export type PhysicalCostPair = z.infer<typeof physicalCostPair>;
