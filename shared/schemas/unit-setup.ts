/**
 * Plant and unit setup: the schemas both the forms and the server use. All values SI (the forms convert
 * from the user's units). The condenser surface is the HEI basis: outside surface between the tubesheets.
 */
import { z } from 'zod';
import { TUBE_MATERIALS } from '../domain/condenser/hei-tables.js';
import { CO2_KG_PER_MMBTU } from '../domain/turbine/emission-factors.js';
import { MAX_TUBE_COUNT } from '../limits.js';
import { btuKwhToKjKwh, cToF, kpaToInHg, m2ToFt2, m3sToGpm, mmToIn, mToFt } from '../units.js';
import { cleanlinessFactor, count, within } from './bounded-number.js';
import { correctionCurveSchema } from './calc-penalty.js';

const uuid = z.uuid('Not a valid id');

const fraction = (what: string) =>
  z
    .number({ error: `Enter ${what}` })
    .min(0, `${what} cannot be below 0`)
    .max(1, `${what} is at most 1 (100 %)`);

/*
 * Physical ranges of setup numbers. Wide on purpose: they refuse typing slips (a tube count of 100,000,000), not
 * unusual plants. From memory: the largest single-unit condensers (nuclear units above 1,300 MW) carry on the
 * order of 100,000 tubes (MAX_TUBE_COUNT) and 100,000 m² of surface, pass 50–100 m³/s of cooling water and reject up to about
 * 3,000 MW; the largest turbine-generators are rated below 2,000 MW.
 */
/** 3,412.14 Btu/kWh is 100 % efficiency (one kWh of heat); no thermal cycle comes near 4,000. */
const MIN_HEAT_RATE_BTU_KWH = 4_000;
const MAX_HEAT_RATE_BTU_KWH = 20_000;
const MAX_DUTY_MW = 4_000;
const MAX_RATING_MW = 2_000;

const alsoIn = {
  pressure: { unit: 'inHgA', fromSi: kpaToInHg },
  area: { unit: 'ft²', fromSi: m2ToFt2 },
  flow: { unit: 'gpm', fromSi: m3sToGpm },
  temperature: { unit: '°F', fromSi: cToF },
  tubeOd: { unit: 'in', fromSi: mmToIn },
  length: { unit: 'ft', fromSi: mToFt },
  heatRate: { unit: 'kJ/kWh', fromSi: btuKwhToKjKwh },
};

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
export type UnitInput = z.input<typeof unitInput>;

export const condenserSetup = z
  .object({
    shells: count('the number of shells', 1, 4).default(1),
    passes: count('the number of passes', 1, 4),
    tubeCount: count('the tube count', 50, MAX_TUBE_COUNT),
    tubeOdMm: within('the tube outside diameter', 12, 60, 'mm', alsoIn.tubeOd),
    tubeBwg: z
      .number({ error: 'Choose a wall gauge' })
      .int('Choose a wall gauge')
      .min(12, 'Choose a wall gauge from 12 to 24 BWG')
      .max(24, 'Choose a wall gauge from 12 to 24 BWG'),
    tubeMaterial: z.enum(TUBE_MATERIALS, { error: `Choose one of ${TUBE_MATERIALS.join(', ')}` }),
    tubeLengthM: within('the effective tube length', 1, 40, 'm', alsoIn.length).nullable().default(null),
    /** HEI basis: outside surface between the tubesheets, N·π·OD·L. */
    surfaceM2: within('the outside surface', 10, 200_000, 'm²', alsoIn.area),
    pluggedTubes: count('the plugged tube count', 0, MAX_TUBE_COUNT),
    designCwFlowM3s: within('the design CW flow', 0.01, 200, 'm³/s', alsoIn.flow),
    /** Sea water stays liquid to about −2 °C. */
    designCwInletC: within('the design CW inlet temperature', -2, 45, '°C', alsoIn.temperature),
    designDutyMw: within('the design duty', 1, MAX_DUTY_MW, 'MW'),
    designBackpressureKpa: within('the design backpressure', 1, 35, 'kPa(a)', alsoIn.pressure),
    designCleanliness: cleanlinessFactor('the design cleanliness'),
    designPluggedTubes: count('the plugged tube count at design', 0, MAX_TUBE_COUNT).default(0),
    /** Reference for fouling cost: what the preferred cleaning achieves (default: design cleanliness). */
    referenceCleanliness: cleanlinessFactor('the reference cleanliness').nullable().default(null),
  })
  .strict()
  .refine((c) => c.pluggedTubes < c.tubeCount, { message: 'Plugged tubes must be fewer than the tube count', path: ['pluggedTubes'] })
  .refine((c) => c.designPluggedTubes < c.tubeCount, { message: 'Design plugged tubes must be fewer than the tube count', path: ['designPluggedTubes'] });
export type CondenserSetup = z.infer<typeof condenserSetup>;

/**
 * Correction curves in a unit's setup: every point within the band a measured backpressure may have (1–50 kPa,
 * the import's input bounds), and a change no turbine shows (beyond ±100 %) refused as a slip.
 */
const setupCorrectionCurve = correctionCurveSchema.superRefine((curve, ctx) => {
  if (curve.curves.length > 12) ctx.addIssue({ code: 'custom', path: ['curves'], message: 'At most 12 load curves' });
  curve.curves.forEach((c, i) => {
    if (c.points.length > 50) ctx.addIssue({ code: 'custom', path: ['curves', i, 'points'], message: 'At most 50 points per load curve' });
    c.points.forEach((p, j) => {
      if (p.backpressureKpa < 1 || p.backpressureKpa > 50) {
        ctx.addIssue({
          code: 'custom',
          path: ['curves', i, 'points', j, 'backpressureKpa'],
          message: 'Backpressure must be between 1 and 50 kPa(a) (0.295 to 14.8 inHgA)',
        });
      }
      if (p.changePct < -100 || p.changePct > 100) {
        ctx.addIssue({ code: 'custom', path: ['curves', i, 'points', j, 'changePct'], message: 'The change must be between −100 and 100 %' });
      }
    });
  });
});

export const turbineSetup = z
  .object({
    ratingMw: within('the rating', 1, MAX_RATING_MW, 'MW'),
    designHeatRateBtuKwh: within('the design heat rate', MIN_HEAT_RATE_BTU_KWH, MAX_HEAT_RATE_BTU_KWH, 'Btu/kWh', alsoIn.heatRate),
    /** Heat-balance condenser duty against load (fraction of rating), at least two points. */
    heatBalanceDuty: z
      .array(
        z
          .object({
            loadFraction: z.number({ error: 'Enter the load' }).positive('The load must be above 0 %').max(1.2, 'The load is at most 120 % of the rating'),
            dutyMw: within('the condenser duty', 0.1, MAX_DUTY_MW, 'MW'),
          })
          .strict(),
      )
      .min(2, 'Give the duty at two loads at least')
      .max(20, 'Give the duty at 20 loads at most'),
    /** Exhaust-pressure correction curves; null: the generic curve (labelled generic). */
    correctionCurve: setupCorrectionCurve.nullable().default(null),
    minimumLoadFraction: fraction('the minimum load').default(0.4),
  })
  .strict();
export type TurbineSetup = z.infer<typeof turbineSetup>;

export const FUELS = Object.keys(CO2_KG_PER_MMBTU) as (keyof typeof CO2_KG_PER_MMBTU)[];

export const economicsSetup = z
  .object({
    fuel: z.enum(FUELS as [string, ...string[]], { error: `Choose one of ${FUELS.join(', ')}` }),
    /** Coal is about 95 kg/MMBtu (EPA 40 CFR 98 Table C-1); 200 leaves room for any fuel. */
    co2KgPerMmbtu: within('the CO2 factor', 0, 200, 'kg/MMBtu'),
    fuelPricePerMmbtu: within('the fuel price', 0, 500, 'per MMBtu'),
    /** Power markets do clear below zero. */
    replacementPricePerMwh: within('the replacement power price', -500, 10_000, 'per MWh'),
    /** Share of hours the unit is capacity-limited (lost MW costed at replacement price). */
    capacityLimitedShare: fraction('the capacity-limited share'),
    co2PricePerTonne: within('the CO2 price', 0, 1_000, 'per tonne'),
    discountRate: within('the discount rate', 0, 0.5, '', { unit: '%', fromSi: (v) => v * 100 }),
    currency: z
      .string()
      .regex(/^[A-Z]{3}$/, 'Use a three-letter currency code (ISO 4217) such as USD or EUR')
      .default('USD'),
  })
  .strict();
export type EconomicsSetup = z.infer<typeof economicsSetup>;
