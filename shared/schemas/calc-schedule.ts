/**
 * `calc schedule` contract (our design, documented in the README): least-cost cleaning calendar over a horizon,
 * its baseline, the business case and optionally sensitivity and Monte Carlo. Self-contained and short enough to
 * write by hand: drivers may be constants or 12 monthly values; methods may be ids of the typical library.
 */
import { z } from 'zod';
import { TUBE_MATERIALS } from '../domain/condenser/hei-tables.js';
import { UNCERTAIN_INPUTS } from '../domain/decision/uncertainty/schedule-uncertainty.js';
import { DEFAULT_POINT_RANGES } from '../domain/validity/point-validity.js';
import { correctionCurveSchema } from './calc-penalty.js';
import { cleaningMethodSchema } from './cleaning-method.js';

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'dates are YYYY-MM-DD (plant-local)');
const dateRange = z.object({ from: isoDate, to: isoDate }).strict();

/** A driver's value: a constant, 12 monthly values or one per day, each within the value's bounds. */
const driver = (value: z.ZodNumber, unit: string) =>
  z.union(
    [
      value,
      z.object({ monthly: z.array(value).length(12, 'monthly needs 12 values, January first') }).strict(),
      z.object({ daily: z.array(value).min(1).max(1830) }).strict(),
    ],
    { error: `a driver is a number (${unit}), {"monthly": [12 values]} or {"daily": [one per horizon day]}` },
  );

// The same bounds as the penalty command (calc-penalty.ts); a day at load 0 is a day off line. The CW inlet range is
// the one a measured point may have (DEFAULT_POINT_RANGES, common practice). Replacement prices may be negative.
const cwInlet = DEFAULT_POINT_RANGES.cwInletC;
const driverValues = {
  cwInletC: z.number().finite().min(cwInlet.min, `cwInletC must be ${cwInlet.min} °C or more`).max(cwInlet.max, `cwInletC is at most ${cwInlet.max} °C`),
  loadFraction: z.number().finite().min(0, 'loadFraction cannot be negative (0 = off line)').max(1.2, 'loadFraction is a fraction of rating, at most 1.2'),
  fuelPricePerMmbtu: z.number().finite().min(0, 'fuelPricePerMmbtu cannot be negative'),
  replacementPricePerMwh: z.number().finite(),
  co2PricePerTonne: z.number().finite().min(0, 'co2PricePerTonne cannot be negative'),
};

const foulingModel = z.discriminatedUnion(
  'model',
  [
    z.object({ model: z.literal('linear'), ratePerDay: z.number().finite().min(0) }).strict(),
    z.object({ model: z.literal('asymptotic'), maxIndex: z.number().finite().min(0), timeConstantDays: z.number().finite().positive() }).strict(),
    z.object({ model: z.literal('falling-rate'), coefficient: z.number().finite().min(0), exponent: z.number().finite().gt(0).max(1) }).strict(),
  ],
  { error: 'fouling.model must be "linear", "asymptotic" or "falling-rate"' },
);

const range = (value: z.ZodNumber) => z.object({ low: value, base: value, high: value }).strict();
const multiplier = z.number().finite().min(0, 'a multiplier cannot be negative');

export const calcScheduleInput = z
  .object({
    startDate: isoDate,
    horizonDays: z.number().int().min(1).max(1830, 'horizonDays is at most 1830 (five years)'),
    drivers: z
      .object({
        cwInletC: driver(driverValues.cwInletC, '°C'),
        loadFraction: driver(driverValues.loadFraction, 'fraction of rating'),
        fuelPricePerMmbtu: driver(driverValues.fuelPricePerMmbtu, 'money per MMBtu'),
        replacementPricePerMwh: driver(driverValues.replacementPricePerMwh, 'money per MWh'),
        co2PricePerTonne: driver(driverValues.co2PricePerTonne, 'money per tonne').default(0),
        interpolation: z.enum(['step', 'mid-month']).default('mid-month'),
      })
      .strict(),
    unit: z
      .object({
        ratingMw: z.number().finite().positive(),
        heatRateBtuKwh: z.number().finite().positive(),
        co2KgPerMmbtu: z.number().finite().min(0).default(0),
        capacityLimitedShare: z.number().min(0).max(1).default(0),
        /** tubes in service; default tubeCount − pluggedTubes of the condenser */
        activeTubes: z.number().int().min(0).optional(),
        condenser: z
          .object({
            surfaceM2: z.number().finite().positive(),
            tubeCount: z.number().int().positive(),
            passes: z.number().int().min(1).max(4),
            tubeOdMm: z.number().finite().positive(),
            tubeBwg: z.number().int(),
            tubeMaterial: z.enum(TUBE_MATERIALS),
            pluggedTubes: z.number().int().min(0).default(0),
            cwFlowM3s: z.number().finite().positive(),
            designDutyMw: z.number().finite().positive(),
          })
          .strict()
          .optional(),
        curve: correctionCurveSchema.optional(),
      })
      .strict(),
    directPenalty: z
      .object({
        points: z.array(z.object({ cleanliness: z.number().finite().gt(0), costPerDay: z.number().finite() }).strict()).min(2),
        monthlyFactors: z.array(z.number().finite().min(0)).length(12).optional(),
      })
      .strict()
      .optional(),
    fouling: foulingModel,
    initial: z
      .object({
        daysSinceCleaning: z.number().int().min(0),
        cleanlinessAfterCleaning: z.number().finite().gt(0).max(1.2),
        foulingRateMultiplier: z.number().finite().positive().default(1),
      })
      .strict(),
    methods: z.array(z.union([z.string(), cleaningMethodSchema])).min(1).max(12),
    plannedOutages: z.array(dateRange).max(100).optional(),
    windows: z.array(dateRange).max(500).optional(),
    methodWindows: z.record(z.string(), z.array(dateRange).max(500)).optional(),
    minSpacingDays: z.number().int().min(0).default(0),
    discountRate: z.number().finite().gt(-1),
    referenceCleanliness: z.number().finite().gt(0).max(1.2).optional(),
    baseline: z
      .discriminatedUnion('kind', [
        z.object({ kind: z.literal('never') }).strict(),
        z.object({ kind: z.literal('next-planned-outage'), methodId: z.string() }).strict(),
        z.object({ kind: z.literal('every-planned-outage'), methodId: z.string() }).strict(),
        z.object({ kind: z.literal('fixed'), cleanings: z.array(z.object({ date: isoDate, methodId: z.string() }).strict()).max(200) }).strict(),
      ])
      .default({ kind: 'never' }),
    upfrontCost: z.number().finite().min(0).default(0),
    uncertainty: z
      .object({
        trials: z.number().int().min(1000).max(20_000).default(5000),
        seed: z.number().int().min(0).max(4_294_967_295).default(1),
        ranges: z
          .object({
            foulingRate: range(multiplier),
            fuelPrice: range(multiplier),
            replacementPrice: range(multiplier),
            cleaningCost: range(multiplier),
            recoveredCleanliness: range(z.number().finite().min(-1, 'a cleanliness shift is at least −1').max(1, 'a cleanliness shift is at most 1')),
            discountRate: range(z.number().finite().gt(-1, 'a discount rate must be above −1')),
          })
          .partial()
          .strict()
          .optional(),
      })
      .strict()
      .optional(),
    includeDaily: z.boolean().default(true),
  })
  .strict()
  .refine((v) => (v.unit.condenser === undefined) !== (v.directPenalty === undefined), {
    message: 'give either unit.condenser (full condenser and turbine models) or directPenalty (a simplified cost curve), not both',
    path: ['unit', 'condenser'],
  })
  .refine((v) => v.unit.condenser !== undefined || v.unit.activeTubes !== undefined, {
    message: 'unit.activeTubes is needed with directPenalty (for the per-tube part of cleaning costs)',
    path: ['unit', 'activeTubes'],
  });

export type CalcScheduleInput = z.infer<typeof calcScheduleInput>;

const money = z.number().finite();
const costTotals = z.object({ foulingCost: money, cleaningCost: money, downtimeCost: money, total: money }).strict();
const scheduledCleaning = z
  .object({
    date: isoDate,
    endDate: isoDate,
    methodId: z.string(),
    methodName: z.string(),
    cleaningCost: money,
    downtimeCost: money,
    foulingCostDuring: money,
    daysInPlannedOutage: z.number().int().min(0),
    cleanlinessBefore: z.number(),
    cleanlinessAfter: z.number(),
    typicalValues: z.boolean(),
    cautions: z.array(z.string()),
  })
  .strict();

/** What `calc schedule` answers (money rounded to cents, plant-local dates). */
export const calcScheduleOutput = z
  .object({
    referenceCleanliness: z.number(),
    cleanings: z.array(scheduledCleaning),
    totals: costTotals,
    discountedTotals: costTotals,
    /** one per horizon year (year 1 first) */
    yearly: z.array(costTotals),
    baseline: z
      .object({ cleanings: z.array(scheduledCleaning), totals: costTotals, discountedTotals: costTotals, ruleBreaks: z.array(z.string()) })
      .strict(),
    businessCase: z
      .object({
        /** [0] at the start (the upfront cost), [k] at the end of horizon year k */
        cashflows: z.array(money),
        foulingSavings: z.array(money),
        extraCleaningCosts: z.array(money),
        npv: money,
        irr: z.number().nullable(),
        irrReason: z.string().optional(),
        paybackYears: z.number().nullable(),
        discountedPaybackYears: z.number().nullable(),
        benefitCostRatio: z.number().nullable(),
        benefitCostReason: z.string().optional(),
      })
      .strict(),
    sensitivity: z
      .object({
        baseNpv: money,
        bars: z.array(
          z
            .object({
              input: z.enum(UNCERTAIN_INPUTS),
              low: z.number(),
              high: z.number(),
              npvAtLow: money,
              npvAtHigh: money,
              swing: money,
            })
            .strict(),
        ),
      })
      .strict()
      .optional(),
    monteCarlo: z
      .object({
        trials: z.number().int(),
        seed: z.number().int(),
        p10Npv: money,
        p50Npv: money,
        p90Npv: money,
        meanNpv: money,
        probabilityNpvPositive: z.number().min(0).max(1),
        histogram: z.array(z.object({ from: money, to: money, count: z.number().int().min(0) }).strict()),
      })
      .strict()
      .optional(),
    daily: z.array(z.object({ date: isoDate, cleanliness: z.number(), foulingCost: money, cleaningCost: money }).strict()).optional(),
    warnings: z.array(z.string()),
  })
  .strict();
export type CalcScheduleOutput = z.infer<typeof calcScheduleOutput>;
