/**
 * A person's e-mail alerts in the active organisation: which conditions to hear about, unit by unit (or for every
 * unit in their scope), after how many days without data "data stopped" is raised, and the weekly digest.
 */
import { z } from 'zod';
import { UNIT_CONDITION_KINDS } from '../domain/portfolio/unit-conditions.js';
import { count } from './bounded-number.js';

/** Days without data before "data stopped" is raised: at least a day, at most about two months. */
export const DATA_STOPPED_DAYS = { min: 1, max: 60, default: 3 } as const;
/** More unit rows than any organisation has units is refused (the plan limits stay far below). */
export const MAX_UNIT_CHOICES = 1000;

export const conditionKind = z.enum(UNIT_CONDITION_KINDS, { error: 'Choose among: cleaning now pays, backpressure unexplained, data stopped' });

const kinds = z
  .array(conditionKind, { error: 'List the conditions to hear about' })
  .max(UNIT_CONDITION_KINDS.length, 'Each condition once')
  .refine((k) => new Set(k).size === k.length, 'Each condition once');
const dataStoppedDays = count('the days without data before "data stopped" is raised', DATA_STOPPED_DAYS.min, DATA_STOPPED_DAYS.max);

/** Conditions to hear about, for one unit or for every unit in scope. */
export const alertChoice = z.object({ kinds, dataStoppedDays }).strict();
export type AlertChoice = z.infer<typeof alertChoice>;

export const unitAlertChoice = alertChoice.extend({ unitId: z.uuid({ error: 'This is not a unit id' }) }).strict();
export type UnitAlertChoice = z.infer<typeof unitAlertChoice>;

export const notificationSettingsBody = z
  .object({
    weeklyDigest: z.boolean({ error: 'Say whether you want the weekly digest (true or false)' }),
    /** conditions for every unit in scope, units added later included; null: none */
    allUnits: alertChoice.nullable(),
    /** a unit's own choice replaces `allUnits` for that unit; a unit not listed follows `allUnits` */
    units: z
      .array(unitAlertChoice, { error: 'List the units with their conditions' })
      .max(MAX_UNIT_CHOICES, `At most ${MAX_UNIT_CHOICES} units`)
      .refine((u) => new Set(u.map((x) => x.unitId)).size === u.length, 'Each unit once'),
  })
  .strict();
export type NotificationSettingsBody = z.infer<typeof notificationSettingsBody>;

export const notificationUnit = z
  .object({
    unitId: z.string(),
    unitName: z.string(),
    plantId: z.string(),
    plantName: z.string(),
    clientGroup: z.object({ id: z.string(), name: z.string() }).strict().nullable(),
  })
  .strict();
export type NotificationUnit = z.infer<typeof notificationUnit>;

export const notificationSettingsResponse = z
  .object({
    weeklyDigest: z.boolean(),
    allUnits: alertChoice.nullable(),
    units: z.array(unitAlertChoice),
    /** the units in the person's scope, to choose among */
    available: z.array(notificationUnit),
    dataStoppedDays: z.object({ min: z.number(), max: z.number(), default: z.number() }).strict(),
  })
  .strict();
export type NotificationSettingsResponse = z.infer<typeof notificationSettingsResponse>;

/** One sentence per condition, for the settings screen and the mails. */
export const CONDITION_EXPLAINED: Record<z.infer<typeof conditionKind>, { title: string; sentence: string }> = {
  'cleaning-now-pays': {
    title: 'Cleaning now pays',
    sentence: 'The cleaning outlook puts the next cleaning today or earlier: cleaning now saves more than it costs.',
  },
  'backpressure-unexplained': {
    title: 'Backpressure unexplained',
    sentence: 'Backpressure rose on recent days more than fouling explains: suspect air in-leakage or the instruments.',
  },
  'data-stopped': {
    title: 'Data stopped',
    sentence: 'No data has arrived for the unit for the number of days you choose.',
  },
};
