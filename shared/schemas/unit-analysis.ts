/**
 * The unit's stored analysis (the `analysis` JSON column of generating_unit), written by the recompute and
 * read by the health view: fouling cycles with their fitted trends, air in-leakage periods, cleaning outlook.
 */
import { z } from 'zod';
import { UNIT_DURING_CLEANING } from './cleaning-method.js';

const isoDate = z.iso.date();

export const foulingModel = z.discriminatedUnion('model', [
  z.object({ model: z.literal('linear'), ratePerDay: z.number() }).strict(),
  z.object({ model: z.literal('asymptotic'), maxIndex: z.number(), timeConstantDays: z.number() }).strict(),
  z.object({ model: z.literal('falling-rate'), coefficient: z.number(), exponent: z.number() }).strict(),
]);

/** One cleaning-to-cleaning cycle: its fitted trend, or why none could be fitted. */
export const fittedCycle = z
  .object({
    startDay: isoDate,
    endDay: isoDate.nullable(),
    status: z.literal('fitted'),
    model: foulingModel,
    cleanlinessAfterCleaning: z.number(),
    rSquared: z.number(),
    residualStdCleanliness: z.number(),
    aic: z.number(),
    pointsUsed: z.number().int(),
    outlierDays: z.number().int(),
    alternatives: z.array(z.object({ model: z.enum(['linear', 'asymptotic', 'falling-rate']), aic: z.number(), rSquared: z.number() }).strict()),
  })
  .strict();
export const unfittedCycle = z
  .object({
    startDay: isoDate,
    endDay: isoDate.nullable(),
    status: z.literal('not-enough-data'),
    reason: z.string(),
    usablePoints: z.number().int(),
    minimumPoints: z.number().int(),
    minimumSpanDays: z.number(),
  })
  .strict();
export const foulingCycleSummary = z.discriminatedUnion('status', [fittedCycle, unfittedCycle]);
export type FoulingCycleSummary = z.infer<typeof foulingCycleSummary>;

export const airLeakPeriod = z
  .object({
    from: isoDate,
    to: isoDate,
    /** largest cleanliness drop against the reference window's trend */
    maxDrop: z.number(),
    evidence: z.array(z.enum(['cleanliness-drop', 'subcooling', 'dissolved-oxygen', 'air-removal'])),
  })
  .strict();

const outlookCleaning = z
  .object({
    date: isoDate,
    endDate: isoDate,
    methodId: z.string(),
    methodName: z.string(),
    unitDuringCleaning: z.enum(UNIT_DURING_CLEANING),
  })
  .strict();

/** The best plan with one kind of method only: used while the unit runs (on line, derate) or in an outage. */
const outlookOption = z
  .object({
    kind: z.enum(['while-running', 'in-an-outage']),
    status: z.enum(['planned', 'none-needed', 'no-method']),
    first: outlookCleaning.optional(),
    cleaningsInHorizon: z.number().int(),
    savingsVersusNoCleaning: z.number(),
  })
  .strict();

/** Fields added later (dataTo, plan, options) are optional, so an analysis stored before them still reads. */
export const cleaningOutlook = z
  .object({
    status: z.enum(['planned', 'none-needed', 'not-available']),
    reason: z.string().optional(),
    planFrom: isoDate.optional(),
    /** the last day of data the plan was built on */
    dataTo: isoDate.optional(),
    plan: z.array(outlookCleaning).optional(),
    options: z.array(outlookOption).optional(),
    horizonDays: z.number().int().optional(),
    next: z
      .object({
        date: isoDate,
        endDate: isoDate,
        methodId: z.string(),
        methodName: z.string(),
        cleanlinessBefore: z.number(),
        cleanlinessAfter: z.number(),
        cleaningCost: z.number(),
        downtimeCost: z.number(),
        typicalValues: z.boolean(),
      })
      .strict()
      .optional(),
    cleaningsInHorizon: z.number().int().optional(),
    savingsVersusNoCleaning: z.number().optional(),
    methodsBasis: z.string(),
  })
  .strict();
export type CleaningOutlookView = z.infer<typeof cleaningOutlook>;

/** The latest cycle's forecast band as the recompute drew it (the health view's costliest figure, drawn once). */
export const storedForecast = z
  .object({
    /** the last day with valid data and the cycle the forecast continues: the view uses it only when both still hold */
    lastDay: isoDate,
    cycleStartDay: isoDate,
    status: z.enum(['fitted', 'not-fitted', 'failed']),
    bandProbability: z.number().optional(),
    points: z.array(z.object({ day: isoDate, cleanliness: z.number(), low: z.number(), high: z.number() }).strict()),
  })
  .strict();
export type StoredForecast = z.infer<typeof storedForecast>;

/** The unit's figures now (the health view's headline), drawn by the recompute for the portfolio. */
export const storedCurrentFigures = z
  .object({
    /** the last day with valid data */
    asOf: isoDate,
    cleanliness: z.number().nullable(),
    /** means of the last 7 days with valid data */
    excessBackpressureKpa: z.number().nullable(),
    foulingCostPerDay: z.number().nullable(),
    foulingCostSinceCleaning: z.number(),
    lastCleaningDate: isoDate.nullable(),
    /** of those 7 days, how many the air in-leakage verdicts flagged */
    airLeakSuspectedDaysInLastWeek: z.number().int(),
  })
  .strict();
export type StoredCurrentFigures = z.infer<typeof storedCurrentFigures>;

export const storedUnitAnalysis = z
  .object({
    computedAt: z.iso.datetime(),
    setupVersion: z.number().int(),
    lastDay: isoDate.nullable(),
    cycles: z.array(foulingCycleSummary),
    airLeakPeriods: z.array(airLeakPeriod),
    outlook: cleaningOutlook.nullable(),
    /** added later: an analysis stored before it reads without it (the view then draws the forecast itself) */
    forecast: storedForecast.nullable().optional(),
    /** added later, as the forecast */
    current: storedCurrentFigures.nullable().optional(),
  })
  .strict();
export type StoredUnitAnalysis = z.infer<typeof storedUnitAnalysis>;
