import { z } from 'zod';

const isoDate = z.iso.date('Use a date like 2026-05-14');

export const healthQuery = z
  .object({
    from: isoDate.optional(),
    to: isoDate.optional(),
    /** bars of the deviation breakdown: one per week or per month */
    breakdownBy: z.enum(['week', 'month']).default('month'),
  })
  .strict()
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'The period ends before it starts', path: ['to'] });
export type HealthQuery = z.infer<typeof healthQuery>;

export const samplesQuery = z
  .object({
    from: isoDate,
    to: isoDate,
    quantity: z.enum(['backpressure', 'cleanliness', 'ttd', 'cwInlet', 'load']).default('backpressure'),
  })
  .strict();

export const exportQuery = z
  .object({
    dataset: z.enum(['daily', 'breakdown']).default('daily'),
    format: z.enum(['csv', 'xlsx']).default('csv'),
    from: isoDate.optional(),
    to: isoDate.optional(),
  })
  .strict();

/** Causes of the deviation breakdown in the stacked bars, in the fixed order of the calculation. */
export const BREAKDOWN_CAUSES = ['cwInletKpa', 'cwFlowKpa', 'loadKpa', 'pluggingKpa', 'foulingKpa', 'unexplainedKpa'] as const;
export type BreakdownCause = (typeof BREAKDOWN_CAUSES)[number];
