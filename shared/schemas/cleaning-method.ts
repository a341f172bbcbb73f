/**
 * Cleaning methods: the tenant's library entry, its zod schema, the cautions a method carries, and a seed list of
 * typical methods. Seed numbers are typical values (common practice, typical order of magnitude, not from a named
 * source), marked `typical: true`; every value is editable and should be replaced by the plant's own quotes.
 */
import { z } from 'zod';

export const CAUTION_KEYS = ['confined-space', 'lockout-tagout', 'online-isolation', 'water-jetting', 'chemical'] as const;
export type CautionKey = (typeof CAUTION_KEYS)[number];

/** Shown with every method, whatever its cautions. */
export const GENERAL_CAUTION =
  'Cleaning can hurt people. Follow local codes, the equipment maker’s instructions and licensed engineering practice; these notes do not replace them.';

/** Caution texts (ENGINEERING.md §9), in our words. */
export const CAUTION_TEXT: Record<CautionKey, string> = {
  'confined-space':
    'Entering a waterbox is permit-required confined-space entry (OSHA 29 CFR 1910.146): test the air for oxygen, H₂S and residual biocide, post an attendant and have a rescue plan.',
  'lockout-tagout': 'Isolate the circulating water by lock-out/tag-out (29 CFR 1910.147) with double isolation, then drain and vent before opening.',
  'online-isolation':
    'Half-condenser cleaning on line keeps the unit running under vacuum: prove the isolation of the half being cleaned and expect load limits.',
  'water-jetting':
    'High-pressure water jetting (typically 10–20 kpsi) follows WJTA-IMCA practice: dead-man controls and barricades; any injection injury is a medical emergency.',
  chemical:
    'Chemical cleaning: inhibited acids give off hydrogen; check that the chemistry suits the tube and tubesheet alloys; dispose of the waste under the discharge permit.',
};

/** What the unit does while the cleaning runs. */
export const UNIT_DURING_CLEANING = ['outage', 'derate', 'online'] as const;

export const cleaningMethodSchema = z
  .object({
    id: z.string().regex(/^[a-z0-9][a-z0-9-]{0,59}$/, 'lower-case letters, digits and dashes'),
    name: z.string().min(1).max(120),
    /** money per cleaning, whatever the size */
    fixedCost: z.number().finite().nonnegative().max(1e9, 'The fixed cost must be between 0 and 1,000,000,000'),
    /** money per tube cleaned (active tubes) */
    costPerTube: z.number().finite().nonnegative().max(10_000, 'The cost per tube must be between 0 and 10,000'),
    /** whole days the cleaning takes */
    durationDays: z.number().int().min(1).max(60),
    unitDuringCleaning: z.enum(UNIT_DURING_CLEANING),
    /** share of the rating lost while a 'derate' cleaning runs, in percent */
    deratePct: z.number().min(0).max(100),
    /** absolute cleanliness factor right after the cleaning */
    recoveredCleanliness: z.number().gt(0).max(1.2),
    /** multiplies the fouling index growth after this cleaning (1 = unchanged) */
    foulingRateMultiplier: z.number().positive().max(10),
    cautions: z.array(z.enum(CAUTION_KEYS)).max(CAUTION_KEYS.length),
    /** true for seed values that are typical orders of magnitude, not plant data */
    typical: z.boolean(),
    note: z.string().max(2000).optional(),
  })
  .strict()
  .refine((m) => m.unitDuringCleaning !== 'derate' || m.deratePct > 0, { message: 'a derate method needs deratePct above 0', path: ['deratePct'] })
  .refine((m) => m.unitDuringCleaning === 'derate' || m.deratePct === 0, { message: 'deratePct applies only to derate methods', path: ['deratePct'] });

export type CleaningMethod = z.infer<typeof cleaningMethodSchema>;

const TYPICAL_NOTE = 'Typical values (common practice, typical order of magnitude), not plant data: edit them to your own quotes and results.';

export const TYPICAL_CLEANING_METHODS: readonly CleaningMethod[] = [
  {
    id: 'sponge-ball-campaign',
    name: 'On-line sponge-ball campaign',
    fixedCost: 12_000,
    costPerTube: 0.1,
    durationDays: 7,
    unitDuringCleaning: 'online',
    deratePct: 0,
    recoveredCleanliness: 0.8,
    foulingRateMultiplier: 0.85,
    cautions: [],
    typical: true,
    note: `${TYPICAL_NOTE} Needs an installed ball-recirculation system; removes soft deposits only.`,
  },
  {
    id: 'hp-water-lancing',
    name: 'High-pressure water lancing',
    fixedCost: 25_000,
    costPerTube: 4,
    durationDays: 4,
    unitDuringCleaning: 'outage',
    deratePct: 0,
    recoveredCleanliness: 0.92,
    foulingRateMultiplier: 1,
    cautions: ['confined-space', 'lockout-tagout', 'water-jetting'],
    typical: true,
    note: TYPICAL_NOTE,
  },
  {
    id: 'shot-tube-cleaners',
    name: 'Scrapers and brushes shot through the tubes',
    fixedCost: 20_000,
    costPerTube: 3,
    durationDays: 3,
    unitDuringCleaning: 'outage',
    deratePct: 0,
    recoveredCleanliness: 0.9,
    foulingRateMultiplier: 1,
    cautions: ['confined-space', 'lockout-tagout'],
    typical: true,
    note: TYPICAL_NOTE,
  },
  {
    id: 'chemical-descaling',
    name: 'Chemical descaling with inhibited acid',
    fixedCost: 60_000,
    costPerTube: 2,
    durationDays: 5,
    unitDuringCleaning: 'outage',
    deratePct: 0,
    recoveredCleanliness: 0.95,
    foulingRateMultiplier: 0.9,
    cautions: ['confined-space', 'lockout-tagout', 'chemical'],
    typical: true,
    note: `${TYPICAL_NOTE} For hard scale; check alloy compatibility with the chemical supplier and the condenser maker.`,
  },
  {
    id: 'half-condenser-online',
    name: 'On-line half-condenser brushing under derate',
    fixedCost: 18_000,
    costPerTube: 3,
    durationDays: 4,
    unitDuringCleaning: 'derate',
    deratePct: 50,
    recoveredCleanliness: 0.88,
    foulingRateMultiplier: 1,
    cautions: ['online-isolation', 'confined-space', 'lockout-tagout'],
    typical: true,
    note: TYPICAL_NOTE,
  },
];

/**
 * The cautions a method carries whatever its list says, from what the unit does and what the method is called
 * (common practice): an outage means opening the waterboxes (confined space, lock-out/tag-out); a derate means
 * isolating a half on line and entering it; acids and chemicals mean chemical handling; jetting and lancing mean
 * high-pressure water.
 */
export function minimumCautions(method: Pick<CleaningMethod, 'unitDuringCleaning' | 'name' | 'id'>): CautionKey[] {
  const out: CautionKey[] = [];
  if (method.unitDuringCleaning === 'outage') out.push('confined-space', 'lockout-tagout');
  if (method.unitDuringCleaning === 'derate') out.push('online-isolation', 'confined-space', 'lockout-tagout');
  const words = `${method.name} ${method.id}`.toLowerCase();
  if (/chemi|acid|descal|pickl|biocid|chlorin/.test(words)) out.push('chemical');
  if (/jet|lanc|hydro|high-pressure water|high pressure water/.test(words)) out.push('water-jetting');
  return out;
}

/** All caution texts that apply to a method, the general one first: its own list and its minimum ones, each once. */
export function cautionsFor(method: Pick<CleaningMethod, 'cautions' | 'unitDuringCleaning' | 'name' | 'id'>): string[] {
  const keys = new Set<CautionKey>([...method.cautions, ...minimumCautions(method)]);
  return [GENERAL_CAUTION, ...CAUTION_KEYS.filter((k) => keys.has(k)).map((c) => CAUTION_TEXT[c])];
}

/** A method as the library answers it: the record's id beside the method's own key, and its cautions spelled out. */
export const cleaningMethodView = z
  .object({
    recordId: z.string(),
    ...cleaningMethodSchema.shape,
    cautionTexts: z.array(z.string()),
  })
  .strict();
export type CleaningMethodView = z.infer<typeof cleaningMethodView>;
export const cleaningMethodsResponse = z.object({ methods: z.array(cleaningMethodView) }).strict();
export type CleaningMethodsResponse = z.infer<typeof cleaningMethodsResponse>;
