/**
 * Cleaning cases: the business case for cleaning one unit's condenser, built on the `schedule` calculation.
 * `inputs` is exactly a `calc schedule` input and `results` exactly its output for those inputs, so piping a
 * case's inputs into `npm run calc -- schedule` reproduces its figures.
 */
import { z } from 'zod';
import { calcScheduleInput, calcScheduleOutput } from './calc-schedule.js';

export const CASE_STATUSES = ['draft', 'submitted', 'approved', 'returned', 'archived'] as const;
export const caseStatus = z.enum(CASE_STATUSES);
export type CaseStatus = z.infer<typeof caseStatus>;

/** Where an input's value came from: the unit's measured data, a value the product filled in, or a person. */
export const INPUT_SOURCES = ['measured', 'prefilled', 'entered'] as const;
export const inputSource = z.enum(INPUT_SOURCES);
export type InputSource = z.infer<typeof inputSource>;

/**
 * Keys of `inputSources`: a top-level input name (`fouling`, `initial`, `methods`, `plannedOutages`, `unit`,
 * `discountRate`, `startDate`, `horizonDays`, `baseline`, `uncertainty`, …) or a driver (`drivers.cwInletC`).
 */
export const inputSourceEntry = z
  .object({
    source: inputSource,
    /** one sentence: "fitted to 212 days since the cleaning of 3 Mar 2026 (linear, R² 0.91)" */
    detail: z.string().max(400),
  })
  .strict();
export const inputSources = z.record(z.string().max(80), inputSourceEntry);
export type InputSources = z.infer<typeof inputSources>;

const title = z.string({ error: 'Give the case a title' }).trim().min(1, 'Give the case a title').max(120, 'A title is at most 120 characters');

export const caseCreate = z.object({ title }).strict();
export type CaseCreate = z.infer<typeof caseCreate>;

/** Inputs replace the whole input set (after the prefill); a changed input is then marked `entered`. */
export const casePatch = z
  .object({ title: title.optional(), inputs: calcScheduleInput.optional() })
  .strict()
  .refine((v) => v.title !== undefined || v.inputs !== undefined, { message: 'Change the title or the inputs' });
export type CasePatch = z.infer<typeof casePatch>;

/**
 * The case's `updatedAt` as the approver read it: a decision on a version older than the stored one is refused.
 * Optional so screens that do not send it yet keep working.
 */
const seenUpdatedAt = z.iso.datetime({ error: 'seenUpdatedAt is the case’s updatedAt as you read it (an ISO date and time)' }).optional();

export const caseApprove = z.object({ seenUpdatedAt }).strict();
export type CaseApprove = z.infer<typeof caseApprove>;

export const caseReturn = z
  .object({
    reason: z.string({ error: 'Say why the case goes back' }).trim().min(1, 'Say why the case goes back').max(2000, 'A reason is at most 2000 characters'),
    seenUpdatedAt,
  })
  .strict();
export type CaseReturn = z.infer<typeof caseReturn>;

export const caseListQuery = z
  .object({
    status: caseStatus.optional(),
    unitId: z.uuid({ error: 'unitId is not a unit id' }).optional(),
  })
  .strict();
export type CaseListQuery = z.infer<typeof caseListQuery>;

const person = z.object({ id: z.string(), name: z.string() }).strict();
const isoDate = z.iso.date();
const timestamp = z.iso.datetime();

/** What the person asking may do with the case now (the screens leave out what is not allowed). */
export const caseActions = z
  .object({
    edit: z.boolean(),
    submit: z.boolean(),
    approve: z.boolean(),
    return: z.boolean(),
    archive: z.boolean(),
    copy: z.boolean(),
    comment: z.boolean(),
  })
  .strict();
export type CaseActions = z.infer<typeof caseActions>;

export const caseView = z
  .object({
    id: z.string(),
    organisationId: z.string(),
    unitId: z.string(),
    unitName: z.string(),
    plantId: z.string(),
    plantName: z.string(),
    /** the plant's IANA time zone: the case's dates are plant-local days */
    timeZone: z.string(),
    currency: z.string(),
    title: z.string(),
    status: caseStatus,
    inputs: calcScheduleInput,
    inputSources,
    results: calcScheduleOutput,
    /**
     * What the case rests on that a reader should weigh (a start before the data ends, few measured months, a trend
     * extrapolated far past its fit): beside `results.warnings`, which stay exactly the calculation's own.
     */
    caseWarnings: z.array(z.string()).optional(),
    engineVersion: z.string(),
    builtFrom: z.object({ lastDataDay: isoDate.nullable(), setupVersion: z.number().int() }).strict(),
    /** the unit has data after `builtFrom.lastDataDay`: its last day and how many days later it is */
    newerData: z.object({ lastDataDay: isoDate, days: z.number().int().positive() }).strict().nullable(),
    author: person,
    decidedBy: person.nullable(),
    returnReason: z.string().nullable(),
    createdAt: timestamp,
    updatedAt: timestamp,
    submittedAt: timestamp.nullable(),
    decidedAt: timestamp.nullable(),
    archivedAt: timestamp.nullable(),
    /** the case this one was copied from */
    copiedFromId: z.string().nullable(),
    actions: caseActions,
  })
  .strict();
export type CaseView = z.infer<typeof caseView>;

export const caseSummary = z
  .object({
    id: z.string(),
    unitId: z.string(),
    unitName: z.string(),
    plantId: z.string(),
    plantName: z.string(),
    currency: z.string(),
    title: z.string(),
    status: caseStatus,
    npv: z.number(),
    firstCleaning: z.object({ date: isoDate, methodName: z.string() }).strict().nullable(),
    authorName: z.string(),
    updatedAt: timestamp,
    decidedAt: timestamp.nullable(),
  })
  .strict();
export type CaseSummary = z.infer<typeof caseSummary>;
export const caseListResponse = z.object({ cases: z.array(caseSummary) }).strict();
export type CaseListResponse = z.infer<typeof caseListResponse>;

export const caseCommentCreate = z
  .object({ text: z.string({ error: 'Write a comment' }).trim().min(1, 'Write a comment').max(4000, 'A comment is at most 4000 characters') })
  .strict();
export type CaseCommentCreate = z.infer<typeof caseCommentCreate>;
export const caseComment = z.object({ id: z.string(), author: person, text: z.string(), createdAt: timestamp }).strict();
export type CaseComment = z.infer<typeof caseComment>;
export const caseCommentsResponse = z.object({ comments: z.array(caseComment) }).strict();
export type CaseCommentsResponse = z.infer<typeof caseCommentsResponse>;
