import { z } from 'zod';
import { cleanlinessFactor, count, within } from './bounded-number.js';
import { MAX_TUBE_COUNT } from '../limits.js';

export const UNIT_EVENT_KINDS = ['cleaning', 'tube-plugging', 'air-leak-repair', 'outage', 'other'] as const;

const isoDate = z.iso.date('Use a date like 2026-05-14');
/** A day a condenser record can plausibly carry (no unit ran before 1900; plans reach a few decades ahead). */
const eventDate = isoDate.refine((d) => d >= '1900-01-01' && d <= '2200-12-31', 'Use a date between 1900 and 2200');

export const unitEventInput = z
  .object({
    kind: z.enum(UNIT_EVENT_KINDS),
    startDate: eventDate,
    endDate: eventDate.nullable().default(null),
    methodId: z.string().max(64).nullable().default(null),
    cost: within('the cost', 0, 1e10).nullable().default(null),
    cleanlinessBefore: cleanlinessFactor('the cleanliness before').nullable().default(null),
    cleanlinessAfter: cleanlinessFactor('the cleanliness after').nullable().default(null),
    pluggedTubesAfter: count('the plugged tube count', 0, MAX_TUBE_COUNT).nullable().default(null),
    notes: z.string().max(2000).nullable().default(null),
  })
  .strict()
  .refine((e) => e.endDate === null || e.endDate >= e.startDate, { message: 'The end is before the start', path: ['endDate'] })
  .refine((e) => e.kind !== 'tube-plugging' || e.pluggedTubesAfter !== null, {
    message: 'Give the plugged-tube count after the plugging',
    path: ['pluggedTubesAfter'],
  })
  .refine((e) => e.kind !== 'outage' || e.endDate !== null, { message: 'Give the last day of the outage', path: ['endDate'] });
export type UnitEventInput = z.infer<typeof unitEventInput>;

export const dailyQuery = z.object({ from: isoDate.optional(), to: isoDate.optional() }).strict();

export const unitEventView = z
  .object({
    id: z.string(),
    unitId: z.string(),
    kind: z.enum(UNIT_EVENT_KINDS),
    startDate: isoDate,
    endDate: isoDate.nullable(),
    methodId: z.string().nullable(),
    cost: z.number().nullable(),
    cleanlinessBefore: z.number().nullable(),
    cleanlinessAfter: z.number().nullable(),
    pluggedTubesAfter: z.number().int().nullable(),
    notes: z.string().nullable(),
    createdAt: z.iso.datetime(),
  })
  .strict();
export type UnitEventView = z.infer<typeof unitEventView>;

export const unitEventsResponse = z.object({ events: z.array(unitEventView) }).strict();
export type UnitEventsResponse = z.infer<typeof unitEventsResponse>;
