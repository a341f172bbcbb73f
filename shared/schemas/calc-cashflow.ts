/** `calc cashflow` contract (ENGINEERING.md §8): NPV, IRR and paybacks of yearly cash flows (§7). */
import { z } from 'zod';

export const calcCashflowInput = z
  .object({
    rate: z.number({ error: 'rate must be a number (a fraction, 0.08 for 8 %)' }).finite().gt(-1, 'rate must be above −1'),
    cashflows: z
      .array(z.number({ error: 'each cash flow must be a number (money)' }).finite(), { error: 'cashflows must be an array of numbers' })
      .min(1, 'cashflows needs at least one value (values[0] falls at t = 0)')
      .max(200, 'at most 200 cash flows'),
  })
  .strict();

export const calcCashflowOutput = z
  .object({
    npv: z.number(),
    irr: z.number().nullable(),
    paybackYears: z.number().nullable(),
    discountedPaybackYears: z.number().nullable(),
    warnings: z.array(z.string()).optional(),
  })
  .strict();

export type CalcCashflowInput = z.infer<typeof calcCashflowInput>;
export type CalcCashflowOutput = z.infer<typeof calcCashflowOutput>;
