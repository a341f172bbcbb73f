/**
 * Plant and unit setup: the schemas both the forms and the server use. All values SI (the forms convert
 * from the user's units). The condenser surface is the HEI basis: outside surface between the tubesheets.
 */
import { z } from 'zod';
import { TUBE_MATERIALS } from '../domain/condenser/hei-tables.js';
import { CO2_KG_PER_MMBTU } from '../domain/turbine/emission-factors.js';
import { correctionCurveSchema } from './calc-penalty.js';

const uuid = z.uuid('Not a valid id');
const positive = (what: string) => z.number({ error: `Enter ${what}` }).finite().positive(`${what} must be above 0`);
const fraction = (what: string) => z.number({ error: `Enter ${what}` }).min(0, `${what} cannot be below 0`).max(1, `${what} is at most 1 (100 %)`);

function isIanaZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return zone.includes('/') || zone === 'UTC';
  } catch {
    return false;
  }
}

export const plantInput = z
  .object({
    name: z.string().trim().min(1, 'Enter a name').max(120),
    timeZone: z.string().refine(isIanaZone, 'Choose an IANA time zone such as America/Chicago or Europe/Berlin'),
    clientGroupId: uuid.nullable().default(null),
  })
  .strict();
export type PlantInput = z.infer<typeof plantInput>;

export const unitInput = z.object({ name: z.string().trim().min(1, 'Enter a name').max(120) }).strict();

export const condenserSetup = z
  .object({
    shells: z.number().int().min(1).max(4).default(1),
    passes: z.number({ error: 'Enter the number of passes' }).int().min(1, 'At least 1 pass').max(4, 'At most 4 passes'),
    tubeCount: z.number({ error: 'Enter the tube count' }).int().positive('Enter the tube count'),
    tubeOdMm: positive('the tube outside diameter').max(60, 'Tube outside diameter above 60 mm is not a condenser tube'),
    tubeBwg: z.number({ error: 'Choose a wall gauge' }).int().min(12).max(24),
    tubeMaterial: z.enum(TUBE_MATERIALS, { error: `Choose one of ${TUBE_MATERIALS.join(', ')}` }),
    tubeLengthM: positive('the effective tube length').max(40).nullable().default(null),
    /** HEI basis: outside surface between the tubesheets, N·π·OD·L. */
    surfaceM2: positive('the outside surface'),
    pluggedTubes: z.number().int().min(0, 'Plugged tubes cannot be negative'),
    designCwFlowM3s: positive('the design CW flow'),
    designCwInletC: z.number({ error: 'Enter the design CW inlet temperature' }).min(-2).max(45),
    designDutyMw: positive('the design duty'),
    designBackpressureKpa: positive('the design backpressure').max(35),
    designCleanliness: z.number({ error: 'Enter the design cleanliness' }).gt(0).max(1.2),
    designPluggedTubes: z.number().int().min(0).default(0),
    /** Reference for fouling cost: what the preferred cleaning achieves (default: design cleanliness). */
    referenceCleanliness: z.number().gt(0).max(1.2).nullable().default(null),
  })
  .strict()
  .refine((c) => c.pluggedTubes < c.tubeCount, { message: 'Plugged tubes must be fewer than the tube count', path: ['pluggedTubes'] })
  .refine((c) => c.designPluggedTubes < c.tubeCount, { message: 'Design plugged tubes must be fewer than the tube count', path: ['designPluggedTubes'] });
export type CondenserSetup = z.infer<typeof condenserSetup>;

export const turbineSetup = z
  .object({
    ratingMw: positive('the rating'),
    designHeatRateBtuKwh: positive('the design heat rate').max(20000),
    /** Heat-balance condenser duty against load (fraction of rating), at least two points. */
    heatBalanceDuty: z
      .array(z.object({ loadFraction: z.number().positive().max(1.2), dutyMw: z.number().positive() }).strict())
      .min(2, 'Give the duty at two loads at least'),
    /** Exhaust-pressure correction curves; null: the generic curve (labelled generic). */
    correctionCurve: correctionCurveSchema.nullable().default(null),
    minimumLoadFraction: z.number().min(0).max(1).default(0.4),
  })
  .strict();
export type TurbineSetup = z.infer<typeof turbineSetup>;

export const FUELS = Object.keys(CO2_KG_PER_MMBTU) as (keyof typeof CO2_KG_PER_MMBTU)[];

export const economicsSetup = z
  .object({
    fuel: z.enum(FUELS as [string, ...string[]]),
    co2KgPerMmbtu: z.number().min(0).max(200),
    fuelPricePerMmbtu: z.number().min(0).max(500),
    replacementPricePerMwh: z.number().min(-500).max(10000),
    /** Share of hours the unit is capacity-limited (lost MW costed at replacement price). */
    capacityLimitedShare: fraction('the capacity-limited share'),
    co2PricePerTonne: z.number().min(0).max(1000),
    discountRate: z.number().min(0).max(0.5),
    currency: z.string().length(3).default('USD'),
  })
  .strict();
export type EconomicsSetup = z.infer<typeof economicsSetup>;
