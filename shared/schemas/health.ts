import { z } from 'zod';
import { airLeakPeriod, cleaningOutlook, fittedCycle, unfittedCycle } from './unit-analysis.js';
import { unitEventView } from './unit-event.js';
import { physicalCostPair } from './physical-cost.js';

const isoDate = z.iso.date('Use a date like 2026-05-14');

/** The quantities the hourly-points view can draw. */
export const SAMPLE_QUANTITIES = ['backpressure', 'cleanliness', 'ttd', 'cwInlet', 'load'] as const;

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
    quantity: z.enum(SAMPLE_QUANTITIES).default('backpressure'),
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

const num = z.number().nullable();

export const healthDay = z
  .object({
    day: z.iso.date(),
    cleanliness: num,
    trendCleanliness: num,
    backpressureKpa: num,
    expectedBackpressureKpa: num,
    excessBackpressureKpa: num,
    ttdK: num,
    cwInletC: num,
    loadMw: num,
    foulingCost: num,
    unexplainedCost: num,
    cumulativeFoulingCost: z.number(),
    /** the CO2 of the extra fuel and the output lost that the day's fouling cost stands for (physical-cost.ts) */
    foulingCo2Tonnes: num,
    foulingLostMwh: num,
    airLeakSuspected: z.boolean(),
  })
  .strict();
export type HealthDay = z.infer<typeof healthDay>;

export const breakdownBar = z
  .object({
    /** ISO week start (Monday) or calendar month */
    period: z.string(),
    ...(Object.fromEntries(BREAKDOWN_CAUSES.map((c) => [c, num])) as Record<BreakdownCause, typeof num>),
    meanExcessBackpressureKpa: num,
    foulingCost: z.number(),
    unexplainedCost: z.number(),
    /** the CO2 and lost output behind the period's fouling cost (null without economics) */
    foulingCo2Tonnes: num,
    foulingLostMwh: num,
  })
  .strict();
export type BreakdownBar = z.infer<typeof breakdownBar>;

export const healthHeadline = z
  .object({
    asOf: z.iso.date().nullable(),
    cleanliness: num,
    trendCleanliness: num,
    referenceCleanliness: num,
    designCleanliness: num,
    excessBackpressureKpa: num,
    foulingCostPerDay: num,
    unexplainedCostPerDay: num,
    foulingCostSinceCleaning: num,
    lastCleaning: z.object({ date: z.iso.date(), notes: z.string().nullable(), cleanlinessAfter: num }).strict().nullable(),
    lastSampleUtc: z.iso.datetime().nullable(),
    nextCleaning: cleaningOutlook.nullable(),
    averagingNote: z.string(),
    costBasis: z.string().nullable(),
    /** the MW and t CO2 behind the fouling cost per day and since the last cleaning (null without economics) */
    foulingPhysical: physicalCostPair.nullable(),
  })
  .strict();
export type HealthHeadline = z.infer<typeof healthHeadline>;

/** The latest cycle's trend; when it is redrawn with the forecast, the band's probability too. */
export const healthTrend = z.discriminatedUnion('status', [fittedCycle.extend({ bandProbability: z.number().optional() }).strict(), unfittedCycle]);
export type HealthTrend = z.infer<typeof healthTrend>;

export const unitHealthResponse = z
  .object({
    unit: z
      .object({
        id: z.string(),
        name: z.string(),
        plant: z.object({ id: z.string(), name: z.string(), timeZone: z.string() }).strict(),
        setupComplete: z.boolean(),
      })
      .strict(),
    period: z.object({ from: z.iso.date().nullable(), to: z.iso.date().nullable(), breakdownBy: z.enum(['week', 'month']) }).strict(),
    analysedAt: z.iso.datetime().nullable(),
    headline: healthHeadline,
    design: z.object({ datasheetBackpressureKpa: z.number(), modelBackpressureKpa: num, modelOffsetKpa: num }).strict().nullable(),
    trend: healthTrend.nullable(),
    forecast: z.array(z.object({ day: z.iso.date(), cleanliness: z.number(), low: z.number(), high: z.number() }).strict()),
    series: z.array(healthDay),
    seriesDownsampled: z.boolean(),
    breakdown: z.array(breakdownBar),
    events: z.array(unitEventView),
    airLeakPeriods: z.array(airLeakPeriod.extend({ note: z.string() }).strict()),
    /** what in the stored setup or data keeps figures out (implausible results, a design point the model cannot reach) */
    warnings: z.array(z.string()),
    dataQuality: z
      .object({
        daysInPeriod: z.number().int(),
        daysWithValidData: z.number().int(),
        pointsUsed: z.number().int(),
        pointsDropped: z.number().int(),
        droppedByReason: z.record(z.string(), z.number()),
        dutyGap: z.object({ meanPct: num, daysOver5Pct: z.number().int(), note: z.string() }).strict(),
        stuckSensors: z.array(z.object({ sensor: z.string(), days: z.number().int(), lastDay: z.iso.date() }).strict()),
      })
      .strict(),
  })
  .strict();
export type UnitHealthResponse = z.infer<typeof unitHealthResponse>;

export const SAMPLE_COLUMNS = ['backpressureKpa', 'expectedBackpressureKpa', 'cleanliness', 'ttdK', 'cwInletC', 'loadMw'] as const;

/** Hourly points of one quantity; each point carries only the columns of that quantity. */
export const samplesResponse = z
  .object({
    quantity: z.enum(SAMPLE_QUANTITIES),
    columns: z.array(z.enum(SAMPLE_COLUMNS)),
    /** points in the period before downsampling */
    total: z.number().int(),
    points: z.array(
      z
        .object({
          t: z.iso.datetime(),
          valid: z.boolean(),
          ...(Object.fromEntries(SAMPLE_COLUMNS.map((c) => [c, num.optional()])) as Record<(typeof SAMPLE_COLUMNS)[number], z.ZodOptional<typeof num>>),
        })
        .strict(),
    ),
  })
  .strict();
export type SamplesResponse = z.infer<typeof samplesResponse>;

/** One plant-local day of a unit as stored: medians and means of the valid points, deviation parts, costs summed. */
export const dailyFigure = z
  .object({
    day: z.iso.date(),
    pointsUsed: z.number().int(),
    pointsDropped: z.number().int(),
    droppedByReason: z.record(z.string(), z.number()).nullable(),
    medianCleanliness: num,
    trendCleanliness: num,
    medianTtdK: num,
    meanBackpressureKpa: num,
    meanExpectedBackpressureKpa: num,
    meanExcessBackpressureKpa: num,
    meanCwInletC: num,
    meanLoadMw: num,
    meanHeatRatePenaltyPct: num,
    cwInletKpa: num,
    cwFlowKpa: num,
    loadKpa: num,
    pluggingKpa: num,
    foulingKpa: num,
    unexplainedKpa: num,
    foulingCost: num,
    unexplainedCost: num,
    meanSubcoolingK: num,
    meanDissolvedOxygenPpb: num,
    meanAirRemovalKgS: num,
    airLeakSuspected: z.boolean(),
    meanDutyMw: num,
    heatBalanceDutyMw: num,
    stuckSensors: z.array(z.string()).nullable(),
  })
  .strict();
export type DailyFigure = z.infer<typeof dailyFigure>;

export const dailyFiguresResponse = z.object({ days: z.array(dailyFigure) }).strict();
export type DailyFiguresResponse = z.infer<typeof dailyFiguresResponse>;
