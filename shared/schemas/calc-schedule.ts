/**
 * `calc schedule` contract (our design, documented in the README): least-cost cleaning calendar over a horizon,
 * its baseline, the business case and optionally sensitivity and Monte Carlo. Self-contained and short enough to
 * write by hand: drivers may be constants or 12 monthly values; methods may be ids of the typical library.
 */
import { z } from 'zod';
import { TUBE_MATERIALS } from '../domain/condenser/hei-tables.js';
import { UNCERTAIN_INPUTS } from '../domain/decision/uncertainty/schedule-uncertainty.js';
import { DEFAULT_POINT_RANGES } from '../domain/validity/point-validity.js';
import { MAX_TUBE_COUNT } from '../limits.js';
import { CLEANLINESS_RANGE } from './bounded-number.js';
import { correctionCurveSchema } from './calc-penalty.js';
import { cleaningMethodSchema } from './cleaning-method.js';
import { condenserSetup, economicsSetup, turbineSetup } from './unit-setup.js';

/** The calendar a case may be set in: wide enough for any plant's history and plans, narrow enough to refuse slips (common practice). */
export const CASE_DATE_RANGE = { min: '2000-01-01', max: '2100-12-31' } as const;
const isCalendarDay = (s: string) => {
  const [y, m, d] = s.split('-').map(Number) as [number, number, number];
  const t = new Date(Date.UTC(y, m - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === d;
};
const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'dates are YYYY-MM-DD (plant-local)')
  .refine(isCalendarDay, 'is not a calendar day')
  .refine((s) => s >= CASE_DATE_RANGE.min && s <= CASE_DATE_RANGE.max, `dates must be between ${CASE_DATE_RANGE.min} and ${CASE_DATE_RANGE.max}`);

const plain = (n: number) => n.toLocaleString('en-US', { maximumFractionDigits: 3 });
/** A number bounded to [min, max]; the message names the field and the range. */
const between = (field: string, min: number, max: number, unit = '') => {
  const message = `${field} must be between ${plain(min)} and ${plain(max)}${unit ? ` ${unit}` : ''}`;
  return z.number().finite().min(min, message).max(max, message);
};
/** The same range as a number of the unit's setup (shared/schemas/unit-setup.ts), so a case accepts what a setup accepts. */
const asInSetup = (field: string, setupNumber: z.ZodNumber, unit = '') => between(field, setupNumber.minValue ?? 0, setupNumber.maxValue ?? 0, unit);
const economics = economicsSetup.shape;
const condenser = condenserSetup.shape;
const turbine = turbineSetup.shape;

/**
 * Largest fouling index a condenser can show: from the cleanest cleanliness factor a case may use (1.2) to the
 * dirtiest plausible one (0.2, CLEANLINESS_RANGE, common practice), y = 1/0.2 − 1/1.2 ≈ 4.17. A trend growing by
 * that much in one day fouls a clean condenser within a day, which is not physical.
 */
export const MAX_FOULING_INDEX = 1 / CLEANLINESS_RANGE.min - 1 / CLEANLINESS_RANGE.max;
const foulingPerDay = `at most ${MAX_FOULING_INDEX.toFixed(2)} per day (more would foul a clean condenser within a day)`;
/** The fouling-trend fitter's own ceiling on a time constant: 50 × the longest span it fits (ten years, 3,650 days). */
const MAX_TIME_CONSTANT_DAYS = 50 * 3650;
/** Common practice: a condenser uncleaned for ten years is outside any fitted trend. */
export const MAX_DAYS_SINCE_CLEANING = 3650;
/** The library's ceiling on a method's fixed cost (cleaning-method.ts), used for an upfront cost too. */
const MAX_UPFRONT_COST = 1e9;
/**
 * A direct penalty is at most what the largest unit's whole output costs at the dearest replacement price:
 * 2,000 MW × 24 h × 10,000 per MWh ≈ 480,000,000 per day (the setup's rating and price ceilings).
 */
const MAX_PENALTY_PER_DAY = 5e8;
/** Uncertainty multipliers: a tenfold change of a price, rate or cost is beyond any spread a plant plans with (common practice). */
const MAX_MULTIPLIER = 10;
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
  fuelPricePerMmbtu: asInSetup('fuelPricePerMmbtu', economics.fuelPricePerMmbtu, 'per MMBtu').min(
    0,
    'fuelPricePerMmbtu cannot be negative (it must be between 0 and 500 per MMBtu)',
  ),
  replacementPricePerMwh: asInSetup('replacementPricePerMwh', economics.replacementPricePerMwh, 'per MWh'),
  co2PricePerTonne: asInSetup('co2PricePerTonne', economics.co2PricePerTonne, 'per tonne').min(
    0,
    'co2PricePerTonne cannot be negative (it must be between 0 and 1,000 per tonne)',
  ),
};

const foulingModel = z.discriminatedUnion(
  'model',
  [
    z.object({ model: z.literal('linear'), ratePerDay: z.number().finite().min(0).max(MAX_FOULING_INDEX, `ratePerDay is ${foulingPerDay}`) }).strict(),
    z
      .object({
        model: z.literal('asymptotic'),
        maxIndex: z.number().finite().min(0),
        timeConstantDays: z
          .number()
          .finite()
          .positive()
          .max(MAX_TIME_CONSTANT_DAYS, `timeConstantDays is at most ${plain(MAX_TIME_CONSTANT_DAYS)}`),
      })
      .strict()
      .refine((m) => m.maxIndex / m.timeConstantDays <= MAX_FOULING_INDEX, { message: `the early growth maxIndex / timeConstantDays is ${foulingPerDay}` }),
    z
      .object({
        model: z.literal('falling-rate'),
        coefficient: z.number().finite().min(0).max(MAX_FOULING_INDEX, `coefficient (the growth over the first day) is ${foulingPerDay}`),
        exponent: z.number().finite().gt(0).max(1),
      })
      .strict(),
  ],
  { error: 'fouling.model must be "linear", "asymptotic" or "falling-rate"' },
);

const range = (value: z.ZodNumber) => z.object({ low: value, base: value, high: value }).strict();
const multiplier = between('a multiplier', 0, MAX_MULTIPLIER).min(0, 'a multiplier cannot be negative');

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
        ratingMw: asInSetup('ratingMw', turbine.ratingMw, 'MW'),
        heatRateBtuKwh: asInSetup('heatRateBtuKwh', turbine.designHeatRateBtuKwh, 'Btu/kWh'),
        co2KgPerMmbtu: asInSetup('co2KgPerMmbtu', economics.co2KgPerMmbtu, 'kg/MMBtu').default(0),
        capacityLimitedShare: asInSetup('capacityLimitedShare', economics.capacityLimitedShare).default(0),
        /** tubes in service; default tubeCount − pluggedTubes of the condenser */
        activeTubes: between('activeTubes', 0, MAX_TUBE_COUNT).int().optional(),
        condenser: z
          .object({
            surfaceM2: asInSetup('surfaceM2', condenser.surfaceM2, 'm²'),
            tubeCount: asInSetup('tubeCount', condenser.tubeCount).int(),
            passes: z.number().int().min(1).max(4),
            tubeOdMm: asInSetup('tubeOdMm', condenser.tubeOdMm, 'mm'),
            tubeBwg: asInSetup('tubeBwg', condenser.tubeBwg, 'BWG').int(),
            tubeMaterial: z.enum(TUBE_MATERIALS),
            pluggedTubes: between('pluggedTubes', 0, MAX_TUBE_COUNT).int().default(0),
            cwFlowM3s: asInSetup('cwFlowM3s', condenser.designCwFlowM3s, 'm³/s'),
            designDutyMw: asInSetup('designDutyMw', condenser.designDutyMw, 'MW'),
          })
          .strict()
          .refine((c) => c.pluggedTubes < c.tubeCount, { message: 'pluggedTubes must be fewer than tubeCount', path: ['pluggedTubes'] })
          .optional(),
        curve: correctionCurveSchema.optional(),
      })
      .strict(),
    directPenalty: z
      .object({
        points: z
          .array(
            z
              .object({
                cleanliness: z.number().finite().gt(0).max(CLEANLINESS_RANGE.max),
                costPerDay: between('costPerDay', -MAX_PENALTY_PER_DAY, MAX_PENALTY_PER_DAY, 'per day'),
              })
              .strict(),
          )
          .min(2)
          .max(50),
        monthlyFactors: z
          .array(between('a monthly factor', 0, MAX_MULTIPLIER))
          .length(12)
          .optional(),
      })
      .strict()
      .optional(),
    fouling: foulingModel,
    initial: z
      .object({
        daysSinceCleaning: between('daysSinceCleaning', 0, MAX_DAYS_SINCE_CLEANING, 'days').int(),
        cleanlinessAfterCleaning: z.number().finite().gt(0).max(1.2),
        /** the library's ceiling for a method's multiplier (cleaning-method.ts) */
        foulingRateMultiplier: z.number().finite().positive().max(10).default(1),
      })
      .strict(),
    methods: z
      .array(z.union([z.string(), cleaningMethodSchema]))
      .min(1)
      .max(12),
    plannedOutages: z.array(dateRange).max(100).optional(),
    windows: z.array(dateRange).max(500).optional(),
    methodWindows: z.record(z.string(), z.array(dateRange).max(500)).optional(),
    minSpacingDays: z.number().int().min(0).max(1830).default(0),
    /** As in the economics setup (0–50 %). A negative real rate is not allowed: the business case discounts nominal money. */
    discountRate: asInSetup('discountRate', economics.discountRate),
    referenceCleanliness: z.number().finite().gt(0).max(1.2).optional(),
    baseline: z
      .discriminatedUnion('kind', [
        z.object({ kind: z.literal('never') }).strict(),
        z.object({ kind: z.literal('next-planned-outage'), methodId: z.string() }).strict(),
        z.object({ kind: z.literal('every-planned-outage'), methodId: z.string() }).strict(),
        z.object({ kind: z.literal('fixed'), cleanings: z.array(z.object({ date: isoDate, methodId: z.string() }).strict()).max(200) }).strict(),
      ])
      .default({ kind: 'never' }),
    upfrontCost: between('upfrontCost', 0, MAX_UPFRONT_COST).default(0),
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
            discountRate: range(asInSetup('a discount rate', economics.discountRate)),
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
  .superRefine((v, ctx) => {
    if (v.minSpacingDays > v.horizonDays) {
      ctx.addIssue({ code: 'custom', path: ['minSpacingDays'], message: `minSpacingDays is at most the horizon (${v.horizonDays} days)` });
    }
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
    baseline: z.object({ cleanings: z.array(scheduledCleaning), totals: costTotals, discountedTotals: costTotals, ruleBreaks: z.array(z.string()) }).strict(),
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
