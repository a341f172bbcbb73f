import { z } from 'zod';
import { condenserSetup, economicsSetup, turbineSetup } from './unit-setup.js';
import { jobView } from './jobs.js';

export const unitSummary = z.object({ id: z.string(), name: z.string(), ratingMw: z.number().nullable(), setupComplete: z.boolean() }).strict();
export type UnitSummary = z.infer<typeof unitSummary>;

export const plantView = z
  .object({
    id: z.string(),
    name: z.string(),
    /** IANA time zone: the plant's local days */
    timeZone: z.string(),
    clientGroupId: z.string().nullable(),
    units: z.array(unitSummary),
  })
  .strict();
export type PlantView = z.infer<typeof plantView>;

export const plantsResponse = z.object({ plants: z.array(plantView) }).strict();
export type PlantsResponse = z.infer<typeof plantsResponse>;

/** A unit with its setup (each part null until saved), its data span and its recent background work. */
export const unitDetail = z
  .object({
    id: z.string(),
    name: z.string(),
    plant: plantView.omit({ units: true }),
    condenser: condenserSetup.nullable(),
    turbine: turbineSetup.nullable(),
    economics: economicsSetup.nullable(),
    setupVersion: z.number().int(),
    setupComplete: z.boolean(),
    samples: z.object({ count: z.number().int().nonnegative(), first: z.iso.datetime().nullable(), last: z.iso.datetime().nullable() }).strict(),
    jobs: z.array(jobView),
  })
  .strict();
export type UnitDetail = z.infer<typeof unitDetail>;
