/**
 * The portfolio: every unit the member may see with its figures now, what is planned for it and what needs
 * attention, grouped by client group, with totals per group and for the organisation. Money is in each unit's
 * own currency and is summed per currency only.
 */
import { z } from 'zod';
import { CASE_STATUSES } from './cases.js';
import { UNIT_CONDITION_KINDS } from '../domain/portfolio/unit-conditions.js';
import { UNIT_DURING_CLEANING } from './cleaning-method.js';
import { physicalCostPair } from './physical-cost.js';

const isoDate = z.iso.date();
const num = z.number().nullable();

export const portfolioCase = z.object({ id: z.string(), title: z.string(), status: z.enum(CASE_STATUSES) }).strict();
export type PortfolioCase = z.infer<typeof portfolioCase>;

export const portfolioUnit = z
  .object({
    unitId: z.string(),
    unitName: z.string(),
    plantId: z.string(),
    plantName: z.string(),
    /** the client group of the unit's plant; null when the plant is in none */
    clientGroup: z.object({ id: z.string(), name: z.string() }).strict().nullable(),
    /** the unit's currency (ISO 4217); null until its economics are set up */
    currency: z.string().nullable(),
    /** the last day's median cleanliness */
    cleanliness: num,
    referenceCleanliness: num,
    /** means of the last 7 days with valid data */
    excessBackpressureKpa: num,
    foulingCostPerDay: num,
    foulingCostSinceCleaning: num,
    /** the MW and t CO2 behind the fouling cost per day and since the last cleaning (null without economics; always sent) */
    foulingPhysical: physicalCostPair.nullable().optional(),
    lastCleaningDate: isoDate.nullable(),
    /** the cleaning outlook's first cleaning; null when it plans none or is not available */
    nextCleaning: z
      .object({
        date: isoDate,
        methodName: z.string(),
        unitDuringCleaning: z.enum(UNIT_DURING_CLEANING).nullable(),
        /** what the plan over the coming year saves against not cleaning, in the unit's currency */
        saving: num,
      })
      .strict()
      .nullable(),
    /** why there is no next cleaning (none needed, not enough data, not analysed yet) */
    nextCleaningNote: z.string().nullable(),
    /** cases not archived (viewers: approved ones only), latest change first */
    openCases: z.array(portfolioCase),
    /** the next outage that takes the unit off line and has not ended (plant-local) */
    nextOutage: z.object({ id: z.string(), name: z.string(), startDate: isoDate, endDate: isoDate }).strict().nullable(),
    /** the last day with valid data */
    dataThrough: isoDate.nullable(),
    dataAgeDays: z.number().int().nullable(),
    stale: z.boolean(),
    alerts: z.array(z.object({ kind: z.enum(UNIT_CONDITION_KINDS), sentence: z.string() }).strict()),
    /** what keeps figures out (setup incomplete, not analysed yet) */
    note: z.string().nullable(),
  })
  .strict();
export type PortfolioUnit = z.infer<typeof portfolioUnit>;

/** Money summed over the units of one currency. */
export const currencyTotal = z
  .object({
    currency: z.string(),
    units: z.number().int(),
    foulingCostPerDay: z.number(),
    foulingCostSinceCleaning: z.number(),
    nextCleaningSavings: z.number(),
  })
  .strict();
export type CurrencyTotal = z.infer<typeof currencyTotal>;

export const portfolioTotals = z
  .object({
    units: z.number().int(),
    unitsWithAlerts: z.number().int(),
    staleUnits: z.number().int(),
    openCases: z.record(z.enum(CASE_STATUSES), z.number().int()),
    money: z.array(currencyTotal),
  })
  .strict();
export type PortfolioTotals = z.infer<typeof portfolioTotals>;

export const portfolioGroup = z
  .object({
    /** null: plants in no client group */
    id: z.string().nullable(),
    name: z.string(),
    unitIds: z.array(z.string()),
    totals: portfolioTotals,
  })
  .strict();
export type PortfolioGroup = z.infer<typeof portfolioGroup>;

export const portfolioResponse = z
  .object({
    units: z.array(portfolioUnit),
    /** one per client group with visible units; empty when the organisation has no client groups */
    groups: z.array(portfolioGroup),
    totals: portfolioTotals,
    /** days without data after which a unit's figures count as stale */
    staleAfterDays: z.number().int(),
    /** whether next outages are read (false while the organisation's outages are not available) */
    outagesAvailable: z.boolean(),
  })
  .strict();
export type PortfolioResponse = z.infer<typeof portfolioResponse>;
