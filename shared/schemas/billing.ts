/** Requests and answers of the billing API (GET /api/billing and the actions beside it). */
import { z } from 'zod';

export const LIMIT_NAMES = ['units', 'clientGroups', 'seats'] as const;
export type LimitName = (typeof LIMIT_NAMES)[number];

export const planLimits = z.object({ units: z.number().int().min(0), clientGroups: z.number().int().min(0), seats: z.number().int().min(0) }).strict();
export type PlanLimits = z.infer<typeof planLimits>;

/** The value to send back as `price`: a price's lookup key (never a Stripe id, never an amount). */
const priceKey = z
  .string()
  .min(1, 'Choose a plan')
  .max(64)
  .regex(/^[a-z0-9_]+$/, 'Choose one of the plans on offer');

export const billingPriceRequest = z.object({ price: priceKey }).strict();
export type BillingPriceRequest = z.infer<typeof billingPriceRequest>;

export const billingUrlAnswer = z.object({ url: z.string() }).strict();

export const billingPlanOffer = z
  .object({
    plan: z.string(),
    name: z.string(),
    price: z.string(),
    interval: z.enum(['month', 'year']),
    /** In the currency's main unit, two decimals ("690.00"). */
    amount: z.string(),
    currency: z.string(),
    limits: planLimits,
  })
  .strict();
export type BillingPlanOffer = z.infer<typeof billingPlanOffer>;

export const billingUsage = z.object({ limit: z.enum(LIMIT_NAMES), label: z.string(), used: z.number().int(), allowed: z.number().int() }).strict();

/** A limit the organisation holds more of than its plan allows (a plan changed in Stripe, or a race): nothing is deleted, additions are refused. */
export const billingOverLimit = z
  .object({ limit: z.enum(LIMIT_NAMES), used: z.number().int(), allowed: z.number().int(), liftedBy: z.string().nullable(), message: z.string() })
  .strict();
export type BillingOverLimit = z.infer<typeof billingOverLimit>;

export const billingInvoice = z
  .object({
    id: z.string(),
    number: z.string().nullable(),
    date: z.string(),
    amount: z.string(),
    currency: z.string(),
    status: z.string(),
    url: z.string().nullable(),
  })
  .strict();

export const SUBSCRIPTION_STATUSES = ['trialing', 'active', 'past_due', 'canceled', 'unpaid'] as const;

export const billingOverview = z
  .object({
    plan: z.object({ code: z.string(), name: z.string() }).strict(),
    /** Stripe's own words. */
    status: z.enum(SUBSCRIPTION_STATUSES),
    price: z.string().nullable(),
    interval: z.enum(['month', 'year']).nullable(),
    trialEndsAt: z.string().nullable(),
    trialDaysLeft: z.number().int().nullable(),
    currentPeriodEnd: z.string().nullable(),
    cancelAtPeriodEnd: z.boolean(),
    /** Why writes are refused, or null. */
    readOnly: z.string().nullable(),
    usage: z.array(billingUsage),
    /** The limits exceeded, each with its sentence; empty when the plan holds everything. */
    overLimit: z.array(billingOverLimit),
    /** The Checkout page that may still be paid, and until when the organisation is held to its plan's limits. */
    openCheckout: z.object({ plan: z.string(), name: z.string(), until: z.string() }).strict().nullable(),
    nextInvoice: z.object({ date: z.string(), amount: z.string(), currency: z.string() }).strict().nullable(),
    invoices: z.array(billingInvoice),
    plans: z.array(billingPlanOffer),
  })
  .strict();
export type BillingOverview = z.infer<typeof billingOverview>;

/** What every member sees about the subscription: the banner's facts. */
export const billingNotice = z
  .object({
    status: z.enum(SUBSCRIPTION_STATUSES),
    readOnly: z.string().nullable(),
    trialEndsAt: z.string().nullable(),
    trialDaysLeft: z.number().int().nullable(),
    trialEndingSoon: z.boolean(),
    /** A plain sentence when the organisation holds more than its plan allows, or null. */
    overLimit: z.string().nullable(),
  })
  .strict();
export type BillingNotice = z.infer<typeof billingNotice>;
