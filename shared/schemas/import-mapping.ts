/**
 * How the columns of a historian export map onto the quantities Cleancase needs (PRODUCT.md step 2).
 * Plain data: guessed by the server, corrected by the user, saved per unit and reused for the next file.
 * Column references are header texts exactly as they appear in the file.
 */
import { z } from 'zod';

/** Every quantity an import can carry, with the units it may arrive in (unit codes are ASCII). */
export const IMPORT_QUANTITY_UNITS = {
  grossLoad: ['MW', 'kW'],
  /** Absolute backpressure. */
  backpressure: ['kPa', 'inHg', 'mbar', 'psi', 'bar', 'mmHg'],
  /** Condenser vacuum below the barometer (gauge); needs a barometer column or a fixed barometer. */
  condenserVacuum: ['kPa', 'inHg', 'mbar', 'psi', 'bar', 'mmHg'],
  barometer: ['kPa', 'inHg', 'mbar', 'psi', 'bar', 'mmHg'],
  cwInletTemperature: ['degC', 'degF'],
  cwOutletTemperature: ['degC', 'degF'],
  cwFlow: ['gpm', 'm3/h', 'm3/s', 'kg/s'],
  hotwellTemperature: ['degC', 'degF'],
  dissolvedOxygen: ['ppb', 'ppm'],
  airRemovalFlow: ['scfm', 'kg/h'],
  cwDifferentialPressure: ['kPa', 'psi', 'mbar', 'ftH2O'],
  condensateFlow: ['kg/s', 'kg/h', 't/h', 'lb/h', 'klb/h'],
} as const;

export type ImportQuantity = keyof typeof IMPORT_QUANTITY_UNITS;
export type ImportUnit = (typeof IMPORT_QUANTITY_UNITS)[ImportQuantity][number];
export const IMPORT_QUANTITIES = Object.keys(IMPORT_QUANTITY_UNITS) as ImportQuantity[];

/** Quantities that must be present in every row (backpressure may come as vacuum + barometer, CW flow as the design flow). */
export const REQUIRED_QUANTITIES = ['grossLoad', 'backpressure', 'cwInletTemperature', 'cwOutletTemperature', 'cwFlow'] as const;

export const TIMESTAMP_FORMATS = ['iso-8601-offset', 'local-text', 'excel-serial'] as const;
export type TimestampFormat = (typeof TIMESTAMP_FORMATS)[number];

/** Field order of a local date: 2024-03-10, 03/10/2024 (US) or 10.03.2024 / 10/03/2024. */
export const DATE_ORDERS = ['ymd', 'mdy', 'dmy'] as const;

/**
 * A local time that occurs twice when clocks go back: take the first (daylight) or second (standard)
 * occurrence, follow the file's order (the first pass through the hour is the earlier one, the
 * repeat after the clock went back is the later one), or reject the row as a file error.
 */
export const REPEATED_HOUR_RULES = ['by-file-order', 'earlier', 'later', 'reject'] as const;

export function isIanaTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

const columnName = z.string().trim().min(1, 'a column name is required').max(200, 'column names are at most 200 characters');

const columnRef = <Q extends ImportQuantity>(quantity: Q) =>
  z
    .object({
      column: columnName,
      unit: z.enum(IMPORT_QUANTITY_UNITS[quantity] as unknown as [string, ...string[]], {
        error: `unit must be one of ${IMPORT_QUANTITY_UNITS[quantity].join(', ')}`,
      }),
    })
    .strict();

const columnsShape = Object.fromEntries(IMPORT_QUANTITIES.map((q) => [q, columnRef(q).optional()])) as {
  [Q in ImportQuantity]: z.ZodOptional<ReturnType<typeof columnRef<Q>>>;
};

export const importTimestampSchema = z
  .object({
    column: columnName,
    format: z.enum(TIMESTAMP_FORMATS),
    /** IANA zone of local wall-clock text and of Excel serial dates. */
    timeZone: z.string().optional(),
    /** For local text. */
    dateOrder: z.enum(DATE_ORDERS).optional(),
    repeatedHour: z.enum(REPEATED_HOUR_RULES).default('by-file-order'),
  })
  .strict()
  .superRefine((t, ctx) => {
    if (t.format !== 'iso-8601-offset') {
      if (!t.timeZone)
        ctx.addIssue({ code: 'custom', path: ['timeZone'], message: `a time zone (IANA name such as America/Chicago) is required for ${t.format} timestamps` });
      else if (!isIanaTimeZone(t.timeZone)) ctx.addIssue({ code: 'custom', path: ['timeZone'], message: `unknown time zone "${t.timeZone}"` });
    }
    if (t.format === 'local-text' && !t.dateOrder) {
      ctx.addIssue({ code: 'custom', path: ['dateOrder'], message: 'local text timestamps need the date order (ymd, mdy or dmy)' });
    }
  });

const pressureUnit = z.enum(IMPORT_QUANTITY_UNITS.barometer);

/** Time grids a tall file's values are aligned to, minutes. */
export const GRID_MINUTES = [1, 5, 10, 60] as const;
/**
 * How a tag's value at a grid time is found: the sample nearest in time (within the tolerance), a straight line
 * between the samples either side (both within the tolerance), or the mean of the samples in the interval
 * ending at the grid time.
 */
export const ALIGNMENT_RULES = ['nearest', 'interpolate', 'interval-mean'] as const;
export type AlignmentRule = (typeof ALIGNMENT_RULES)[number];

/** One row per tag per time: which columns hold the tag name and the value, and how the tags are put on one time grid. */
export const importTallSchema = z
  .object({
    tagColumn: columnName,
    valueColumn: columnName,
    gridMinutes: z.union(GRID_MINUTES.map((m) => z.literal(m)) as unknown as [z.ZodLiteral<1>, z.ZodLiteral<5>, z.ZodLiteral<10>, z.ZodLiteral<60>], {
      error: `the grid is one of ${GRID_MINUTES.join(', ')} minutes`,
    }),
    rule: z.enum(ALIGNMENT_RULES),
    /** How far from a grid time a sample may lie to be used (nearest, interpolate), minutes. */
    toleranceMinutes: z.number().min(0, 'the tolerance is at least 0 minutes').max(120, 'the tolerance is at most 120 minutes'),
  })
  .strict();
export type ImportTall = z.infer<typeof importTallSchema>;

/** Values of a quality column that mean "good"; any other value marks the row's values as not good. */
export const MAX_GOOD_QUALITY_VALUES = 50;
export const importQualitySchema = z
  .object({
    column: columnName,
    /** Compared trimmed and case-insensitive ("Good", "192", "0"). */
    goodValues: z
      .array(z.string().trim().min(1, 'a good value cannot be empty').max(40, 'a good value is at most 40 characters'))
      .min(1, 'name at least one value that means good (e.g. Good or 192)')
      .max(MAX_GOOD_QUALITY_VALUES, `at most ${MAX_GOOD_QUALITY_VALUES} good values`),
  })
  .strict();
export type ImportQuality = z.infer<typeof importQualitySchema>;

export const importMappingSchema = z
  .object({
    timestamp: importTimestampSchema,
    columns: z.object(columnsShape).strict(),
    /** Decimal separator of numbers in a CSV file (a semicolon-delimited file often uses a comma). */
    decimalSeparator: z.enum(['.', ',']).default('.'),
    /** CW flow not metered: every row uses the design flow, recorded as an assumption. */
    designCwFlowM3s: z.number().positive('the design CW flow must be positive (m³/s)').max(200, 'the design CW flow is at most 200 m³/s').optional(),
    /** A fixed barometer for condenser vacuum when there is no barometer column, recorded as an assumption. */
    fixedBarometer: z
      .object({ value: z.number().positive('the barometer must be positive'), unit: pressureUnit })
      .strict()
      .optional(),
    /** A column saying whether each row's values are good; rows whose value is not among `goodValues` are kept out as instrument-status. */
    quality: importQualitySchema.optional(),
    /**
     * A tall file (one row per tag per time): `columns` then name tags, not columns, and `timestamp` and `quality`
     * the tall file's columns.
     */
    tall: importTallSchema.optional(),
    /**
     * The file holds averages over this many minutes rather than instantaneous values (the header or the person says
     * so): recorded with the import, and the steadiness rule compares neighbouring intervals.
     */
    averagingMinutes: z
      .number()
      .int('the averaging interval is a whole number of minutes')
      .min(1, 'the averaging interval is at least 1 minute')
      .max(1440, 'the averaging interval is at most 1,440 minutes (a day)')
      .optional(),
    /** XLSX: the sheet to read, by name (default: the first). */
    sheet: z.string().trim().min(1, 'a sheet name cannot be empty').max(31, 'sheet names are at most 31 characters').optional(),
  })
  .strict()
  .superRefine((m, ctx) => {
    const c = m.columns;
    if (!c.grossLoad) ctx.addIssue({ code: 'custom', path: ['columns', 'grossLoad'], message: 'map the gross load column (MW)' });
    if (!c.cwInletTemperature) ctx.addIssue({ code: 'custom', path: ['columns', 'cwInletTemperature'], message: 'map the CW inlet temperature column' });
    if (!c.cwOutletTemperature) ctx.addIssue({ code: 'custom', path: ['columns', 'cwOutletTemperature'], message: 'map the CW outlet temperature column' });
    if (c.backpressure && c.condenserVacuum) {
      ctx.addIssue({ code: 'custom', path: ['columns', 'condenserVacuum'], message: 'map either the absolute backpressure or the condenser vacuum, not both' });
    } else if (!c.backpressure && !c.condenserVacuum) {
      ctx.addIssue({
        code: 'custom',
        path: ['columns', 'backpressure'],
        message: 'map the backpressure column (absolute), or the condenser vacuum with a barometer',
      });
    }
    if (c.condenserVacuum && !c.barometer && !m.fixedBarometer) {
      ctx.addIssue({ code: 'custom', path: ['columns', 'barometer'], message: 'condenser vacuum needs a barometer column or a fixed barometer value' });
    }
    if (c.cwFlow && m.designCwFlowM3s !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['designCwFlowM3s'], message: 'the CW flow is mapped to a column: leave the design flow out' });
    } else if (!c.cwFlow && m.designCwFlowM3s === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['columns', 'cwFlow'],
        message: 'map the CW flow column, or state that it is not metered and give the design flow',
      });
    }
    const seen = new Map<string, string>();
    const refs: [string, string][] = [['timestamp', m.timestamp.column]];
    for (const q of IMPORT_QUANTITIES) if (c[q]) refs.push([q, c[q]!.column]);
    if (m.quality) refs.push(['the quality', m.quality.column]);
    if (m.tall) {
      for (const [what, column] of [
        ['the tag names', m.tall.tagColumn],
        ['the values', m.tall.valueColumn],
      ] as const) {
        if ([m.timestamp.column, m.quality?.column].includes(column))
          ctx.addIssue({ code: 'custom', path: ['tall'], message: `column "${column}" cannot hold ${what} and another part of the row` });
      }
      if (m.tall.tagColumn === m.tall.valueColumn)
        ctx.addIssue({ code: 'custom', path: ['tall', 'valueColumn'], message: 'the tag names and the values are in different columns' });
    }
    for (const [q, column] of refs) {
      const other = seen.get(column);
      if (other) ctx.addIssue({ code: 'custom', path: ['columns', q], message: `column "${column}" is already mapped to ${other}` });
      else seen.set(column, q);
    }
  });

export type ImportMapping = z.infer<typeof importMappingSchema>;
export type ImportMappingInput = z.input<typeof importMappingSchema>;
export type ImportTimestamp = z.infer<typeof importTimestampSchema>;
export type ImportColumnRef = { column: string; unit: string };
