/**
 * Outages: the condenser work picked for one outage of one or more units, within its budget and its window.
 * An outage holds candidate work items (an approved cleaning case's cleaning, or work entered by hand), the latest
 * proposal of the optimiser, up to three saved scopes shown side by side, and once approved a frozen snapshot.
 * Money travels as plain numbers in the organisation's currency (two decimals); dates are plant-local days.
 */
import { z } from 'zod';
import { count, within } from './bounded-number.js';

export const OUTAGE_STATUSES = ['draft', 'approved'] as const;
export const outageStatus = z.enum(OUTAGE_STATUSES);
export type OutageStatus = z.infer<typeof outageStatus>;

export const OUTAGE_ITEM_KINDS = [
  'case-cleaning',
  'tube-plugging',
  'air-in-leakage-repair',
  'waterbox-repair',
  'partial-retubing',
  'eddy-current-inspection',
  'other',
] as const;
export const outageItemKind = z.enum(OUTAGE_ITEM_KINDS, {
  error: `kind is one of ${OUTAGE_ITEM_KINDS.join(', ')}`,
});
export type OutageItemKind = z.infer<typeof outageItemKind>;

/** Words for each kind, shared by the screens and the reports. */
export const OUTAGE_ITEM_KIND_WORDS: Record<OutageItemKind, string> = {
  'case-cleaning': 'Cleaning from an approved case',
  'tube-plugging': 'Tube plugging',
  'air-in-leakage-repair': 'Air in-leakage repair',
  'waterbox-repair': 'Waterbox repair',
  'partial-retubing': 'Partial retubing',
  'eddy-current-inspection': 'Eddy-current inspection',
  other: 'Other condenser work',
};

/** Longest outage window (both end days inside it): a year refuses typing slips, not long overhauls (common practice). */
export const MAX_OUTAGE_WINDOW_DAYS = 365;
/** Ceiling of a single item's cost: the cleaning-method library's ceiling on a fixed cost (cleaning-method.ts). */
export const MAX_OUTAGE_ITEM_COST = 1e9;
/** Ceiling of an outage budget: ten items at the item ceiling. */
export const MAX_OUTAGE_BUDGET = 1e10;
/** Ceiling of a benefit typed as money: as the budget's. */
export const MAX_OUTAGE_ITEM_BENEFIT = 1e10;
/** Most items an outage may hold: the optimiser is exact up to 60. */
export const MAX_OUTAGE_ITEMS = 60;
/** Most units in one outage (a plant's units sharing one outage; more is a typing slip). */
export const MAX_OUTAGE_UNITS = 20;
/** Saved scopes per outage, shown side by side. A fourth is refused: delete one first (deleting an item never deletes a scope). */
export const MAX_SAVED_SCOPES = 3;
/** Cleanliness recovered by a piece of work, as a fraction of the cleanliness factor (0.005 = half a point, 0.5 = fifty points). */
export const CLEANLINESS_RECOVERED_RANGE = { min: 0.005, max: 0.5 } as const;
/** Horizon over which a recovered cleanliness is priced: up to three years. */
export const BENEFIT_HORIZON_DAYS_RANGE = { min: 1, max: 1095 } as const;

/** Plant-local calendar day; the same calendar as a case's (2000–2100). */
export const OUTAGE_DATE_RANGE = { min: '2000-01-01', max: '2100-12-31' } as const;
const isCalendarDay = (s: string) => {
  const [y, m, d] = s.split('-').map(Number) as [number, number, number];
  const t = new Date(Date.UTC(y, m - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === d;
};
const day = (what: string) =>
  z
    .string({ error: `Enter the ${what} (YYYY-MM-DD, plant-local)` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `The ${what} is a date written YYYY-MM-DD (plant-local)`)
    .refine(isCalendarDay, `The ${what} is not a calendar day`)
    .refine(
      (s) => s >= OUTAGE_DATE_RANGE.min && s <= OUTAGE_DATE_RANGE.max,
      `The ${what} must be between ${OUTAGE_DATE_RANGE.min} and ${OUTAGE_DATE_RANGE.max}`,
    );

/** Days of a window with both end days inside it (2026-05-01 to 2026-05-01 is one day). */
export function windowDays(startDate: string, endDate: string): number {
  const ms = Date.parse(`${endDate}T00:00:00Z`) - Date.parse(`${startDate}T00:00:00Z`);
  return Math.round(ms / 86_400_000) + 1;
}

const name = z.string({ error: 'Give the outage a name' }).trim().min(1, 'Give the outage a name').max(120, 'A name is at most 120 characters');
const unitIds = z
  .array(z.uuid({ error: 'This is not a unit id' }), { error: 'Choose the units the outage takes off line' })
  .min(1, 'Choose at least one unit')
  .max(MAX_OUTAGE_UNITS, `An outage holds at most ${MAX_OUTAGE_UNITS} units`)
  .refine((ids) => new Set(ids.map((i) => i.toLowerCase())).size === ids.length, 'A unit is listed twice');
const budget = within('the budget', 0, MAX_OUTAGE_BUDGET);
const seenUpdatedAt = z.iso.datetime({ error: 'seenUpdatedAt is the outage’s updatedAt as you read it (an ISO date and time)' }).optional();

function checkWindow(v: { startDate?: string | undefined; endDate?: string | undefined }, ctx: z.RefinementCtx) {
  if (v.startDate === undefined || v.endDate === undefined) return;
  if (v.endDate < v.startDate) {
    ctx.addIssue({ code: 'custom', path: ['endDate'], message: 'The last day cannot be before the first day' });
  } else if (windowDays(v.startDate, v.endDate) > MAX_OUTAGE_WINDOW_DAYS) {
    ctx.addIssue({ code: 'custom', path: ['endDate'], message: `An outage window is at most ${MAX_OUTAGE_WINDOW_DAYS} days` });
  }
}

export const outageCreate = z
  .object({ name, unitIds, startDate: day('first day'), endDate: day('last day'), budget })
  .strict()
  .superRefine(checkWindow);
export type OutageCreate = z.infer<typeof outageCreate>;

/** Change a draft outage; a unit that still has items cannot be taken out (remove its items first). */
export const outagePatch = z
  .object({
    name: name.optional(),
    unitIds: unitIds.optional(),
    startDate: day('first day').optional(),
    endDate: day('last day').optional(),
    budget: budget.optional(),
    seenUpdatedAt,
  })
  .strict()
  .superRefine(checkWindow)
  .refine((v) => Object.keys(v).some((k) => k !== 'seenUpdatedAt'), { message: 'Change the name, units, window or budget' });
export type OutagePatch = z.infer<typeof outagePatch>;

/** A benefit priced by the product: cleanliness recovered, valued with the unit's own model over a horizon. */
export const cleanlinessBenefit = z
  .object({
    cleanlinessRecovered: within('the cleanliness recovered', CLEANLINESS_RECOVERED_RANGE.min, CLEANLINESS_RECOVERED_RANGE.max, '(fraction)', {
      unit: 'points of cleanliness',
      fromSi: (v) => v * 100,
    }),
    horizonDays: count('the horizon', BENEFIT_HORIZON_DAYS_RANGE.min, BENEFIT_HORIZON_DAYS_RANGE.max),
  })
  .strict();
export type CleanlinessBenefit = z.infer<typeof cleanlinessBenefit>;
/** Money (in the organisation's currency) or a cleanliness recovered to be priced. */
export const itemBenefit = z.union([within('the benefit', 0, MAX_OUTAGE_ITEM_BENEFIT), cleanlinessBenefit], {
  error: 'The benefit is money (a number) or {"cleanlinessRecovered": fraction, "horizonDays": days}',
});
export type ItemBenefit = z.infer<typeof itemBenefit>;

const title = z.string({ error: 'Give the work a title' }).trim().min(1, 'Give the work a title').max(120, 'A title is at most 120 characters');
const cost = within('the cost', 0, MAX_OUTAGE_ITEM_COST);
const durationDays = count('the duration in days', 1, MAX_OUTAGE_WINDOW_DAYS);
const lane = z
  .string({ error: 'Name the crew lane (items in one lane run one after another)' })
  .trim()
  .min(1, 'Name the crew lane (items in one lane run one after another)')
  .max(40, 'A lane name is at most 40 characters');
const needs = z
  .array(z.uuid({ error: 'needs lists ids of other items of this outage' }))
  .max(MAX_OUTAGE_ITEMS - 1, `An item needs at most ${MAX_OUTAGE_ITEMS - 1} others`)
  .refine((ids) => new Set(ids.map((i) => i.toLowerCase())).size === ids.length, 'An item is listed twice in needs');
export const FORCED_CHOICES = ['in', 'out'] as const;
const forced = z.enum(FORCED_CHOICES, { error: 'forced is "in", "out" or null' }).nullable();

/**
 * A candidate item. For `case-cleaning`, `caseId` names an approved case of the unit and the benefit comes from the
 * case (do not send one); title, cost and duration default to the case's first cleaning. Every other kind needs
 * title, cost, durationDays and benefit and has no caseId.
 */
export const outageItemCreate = z
  .object({
    unitId: z.uuid({ error: 'Choose the unit this work is on' }),
    kind: outageItemKind,
    title: title.optional(),
    cost: cost.optional(),
    durationDays: durationDays.optional(),
    lane,
    benefit: itemBenefit.optional(),
    caseId: z.uuid({ error: 'caseId is not a case id' }).optional(),
    needs: needs.optional(),
    forced: forced.optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.kind === 'case-cleaning') {
      if (v.caseId === undefined) ctx.addIssue({ code: 'custom', path: ['caseId'], message: 'Choose the approved case whose cleaning this is' });
      if (v.benefit !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['benefit'], message: 'A case’s cleaning takes its benefit from the case: leave the benefit out' });
      }
      return;
    }
    if (v.caseId !== undefined) ctx.addIssue({ code: 'custom', path: ['caseId'], message: 'Only a case’s cleaning (kind case-cleaning) names a case' });
    if (v.title === undefined) ctx.addIssue({ code: 'custom', path: ['title'], message: 'Give the work a title' });
    if (v.cost === undefined) ctx.addIssue({ code: 'custom', path: ['cost'], message: 'Enter the cost' });
    if (v.durationDays === undefined) ctx.addIssue({ code: 'custom', path: ['durationDays'], message: 'Enter the duration in days' });
    if (v.benefit === undefined)
      ctx.addIssue({ code: 'custom', path: ['benefit'], message: 'Enter the benefit: money, or the cleanliness recovered and its horizon' });
  });
export type OutageItemCreate = z.infer<typeof outageItemCreate>;

/** Change an item of a draft outage (its unit, kind and case stay: remove it and add another). */
export const outageItemPatch = z
  .object({
    title: title.optional(),
    cost: cost.optional(),
    durationDays: durationDays.optional(),
    lane: lane.optional(),
    benefit: itemBenefit.optional(),
    needs: needs.optional(),
    forced: forced.optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Change the title, cost, duration, lane, benefit, needs or forced' });
export type OutageItemPatch = z.infer<typeof outageItemPatch>;

export const scopeSave = z
  .object({
    name: z.string({ error: 'Name the scope' }).trim().min(1, 'Name the scope').max(80, 'A scope name is at most 80 characters'),
    /** default: the latest proposal's selection */
    itemIds: z
      .array(z.uuid({ error: 'itemIds lists ids of items of this outage' }))
      .max(MAX_OUTAGE_ITEMS, `A scope holds at most ${MAX_OUTAGE_ITEMS} items`)
      .refine((ids) => new Set(ids.map((i) => i.toLowerCase())).size === ids.length, 'An item is listed twice')
      .optional(),
  })
  .strict();
export type ScopeSave = z.infer<typeof scopeSave>;

/** No body (or `{}`): approve the latest proposal. `scopeId`: approve that saved scope. */
export const outageApprove = z
  .object({
    scopeId: z.uuid({ error: 'scopeId is not a saved scope of this outage' }).optional(),
    seenUpdatedAt,
  })
  .strict();
export type OutageApprove = z.infer<typeof outageApprove>;

const person = z.object({ id: z.string(), name: z.string() }).strict();
const isoDate = z.iso.date();
const timestamp = z.iso.datetime();
const money = z.number().finite();

export const PRICING_METHODS = ['entered', 'cleanliness', 'case'] as const;
/** How an item's benefit was priced: typed as money, a cleanliness recovered valued with the unit's model, or from a case. */
export const itemPricing = z
  .object({
    method: z.enum(PRICING_METHODS),
    /** one sentence with the figures: "0.05 cleanliness recovered on Unit 2 at its typical … = 412,000 USD over 365 days" */
    text: z.string(),
  })
  .strict();
export type ItemPricing = z.infer<typeof itemPricing>;

export const outageItemView = z
  .object({
    id: z.string(),
    outageId: z.string(),
    unitId: z.string(),
    unitName: z.string(),
    plantName: z.string(),
    kind: outageItemKind,
    title: z.string(),
    cost: money,
    durationDays: z.number().int(),
    lane: z.string(),
    /** what was entered: money, a cleanliness recovered, or null for a case's cleaning */
    benefitEntered: z.union([money, cleanlinessBenefit]).nullable(),
    /** the benefit in money the optimiser uses */
    benefit: money,
    pricing: itemPricing,
    caseId: z.string().nullable(),
    caseTitle: z.string().nullable(),
    needs: z.array(z.string()),
    forced: forced,
    createdAt: timestamp,
    updatedAt: timestamp,
  })
  .strict();
export type OutageItemView = z.infer<typeof outageItemView>;

/** The optimiser's answer (see shared/domain/outage/scope-problem.ts). */
export const optimiseResponse = z
  .object({
    selectedItemIds: z.array(z.string()),
    totalBenefit: money,
    totalCost: money,
    /** summed duration of the chosen items per lane */
    laneDays: z.record(z.string(), z.number()),
    /** one sentence per item: why it is in or out */
    reasons: z.record(z.string(), z.string()),
    feasible: z.boolean(),
    problems: z.array(z.string()),
    computedAt: timestamp,
  })
  .strict();
export type OptimiseResponse = z.infer<typeof optimiseResponse>;

/** A saved scope with its figures from the items as they are now. */
export const savedScopeView = z
  .object({
    id: z.string(),
    name: z.string(),
    itemIds: z.array(z.string()),
    /** ids saved with the scope whose items were removed since */
    missingItemIds: z.array(z.string()),
    totalBenefit: money,
    totalCost: money,
    laneDays: z.record(z.string(), z.number()),
    /** the longest lane: the scope's length of work in days */
    criticalLaneDays: z.number(),
    feasible: z.boolean(),
    problems: z.array(z.string()),
    createdBy: person,
    createdAt: timestamp,
  })
  .strict();
export type SavedScopeView = z.infer<typeof savedScopeView>;

/** Side by side: the items some saved scopes hold and others do not. */
export const scopeComparison = z
  .object({
    /** items in every saved scope */
    inAll: z.array(z.string()),
    differences: z.array(z.object({ itemId: z.string(), title: z.string(), inScopeIds: z.array(z.string()) }).strict()),
  })
  .strict();
export type ScopeComparison = z.infer<typeof scopeComparison>;

/** The approved scope, frozen: the items as they were, the totals and what was left out and why. */
export const approvedSnapshot = z
  .object({
    scopeName: z.string(),
    /** the saved scope approved, or null for the latest proposal */
    scopeId: z.string().nullable(),
    startDate: isoDate,
    endDate: isoDate,
    windowDays: z.number().int(),
    budget: money,
    currency: z.string(),
    items: z.array(outageItemView),
    selectedItemIds: z.array(z.string()),
    totalBenefit: money,
    totalCost: money,
    laneDays: z.record(z.string(), z.number()),
    reasons: z.record(z.string(), z.string()),
  })
  .strict();
export type ApprovedSnapshot = z.infer<typeof approvedSnapshot>;

export const outageActions = z
  .object({
    edit: z.boolean(),
    optimise: z.boolean(),
    saveScope: z.boolean(),
    approve: z.boolean(),
    delete: z.boolean(),
  })
  .strict();
export type OutageActions = z.infer<typeof outageActions>;

const outageUnit = z.object({ id: z.string(), name: z.string(), plantId: z.string(), plantName: z.string(), timeZone: z.string() }).strict();

export const outageView = z
  .object({
    id: z.string(),
    organisationId: z.string(),
    name: z.string(),
    units: z.array(outageUnit),
    startDate: isoDate,
    endDate: isoDate,
    windowDays: z.number().int(),
    budget: money,
    currency: z.string(),
    status: outageStatus,
    items: z.array(outageItemView),
    /** the latest optimiser run; stale when items or the outage changed after it */
    proposal: optimiseResponse.nullable(),
    proposalStale: z.boolean(),
    scopes: z.array(savedScopeView),
    comparison: scopeComparison,
    approved: approvedSnapshot.nullable(),
    approvedBy: person.nullable(),
    approvedAt: timestamp.nullable(),
    createdBy: person,
    createdAt: timestamp,
    updatedAt: timestamp,
    /** safety cautions for the kinds of work listed */
    cautions: z.array(z.string()),
    actions: outageActions,
  })
  .strict();
export type OutageView = z.infer<typeof outageView>;

export const outageSummary = z
  .object({
    id: z.string(),
    name: z.string(),
    units: z.array(outageUnit),
    startDate: isoDate,
    endDate: isoDate,
    budget: money,
    currency: z.string(),
    status: outageStatus,
    itemCount: z.number().int(),
    /** benefit and cost of the approved scope, else of the latest proposal, else null */
    totalBenefit: money.nullable(),
    totalCost: money.nullable(),
    approvedAt: timestamp.nullable(),
    updatedAt: timestamp,
  })
  .strict();
export type OutageSummary = z.infer<typeof outageSummary>;
export const outageListQuery = z
  .object({
    status: outageStatus.optional(),
    unitId: z.uuid({ error: 'unitId is not a unit id' }).optional(),
  })
  .strict();
export type OutageListQuery = z.infer<typeof outageListQuery>;
export const outageListResponse = z.object({ outages: z.array(outageSummary) }).strict();
export type OutageListResponse = z.infer<typeof outageListResponse>;
