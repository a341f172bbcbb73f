/**
 * First guess of a column mapping from the header texts (and a few sample rows): which quantity a
 * column holds and in which unit. Unknown columns are left unmapped; a guess that is only weakly
 * supported carries a low confidence. The user corrects the guess on the mapping screen, and the
 * corrected mapping (plain data, see shared/schemas/import-mapping.ts) is saved for the unit.
 */
import { IMPORT_QUANTITY_UNITS, importMappingSchema, type ImportQuantity, type ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { cwFlowToM3s, dissolvedOxygenToPpb, massFlowToKgS, powerToMw, pressureToKpa, temperatureToC } from './quantity-conversion.js';
import { looksLikeDateTime } from './raw-table.js';

export { importMappingSchema, type ImportMapping, type ImportMappingInput } from '@shared/schemas/import-mapping.js';

export type GuessedQuantity = ImportQuantity | 'timestamp';

export interface ColumnGuess {
  header: string;
  index: number;
  quantity: GuessedQuantity | null;
  unit: string | null;
  /** 0 to 1: about 0.9 when the header names both the quantity and a unit, about 0.5 from sample values. */
  confidence: number;
  note?: string;
}

export interface MappingGuess {
  columns: ColumnGuess[];
  /** The guess as a mapping draft (may be incomplete). */
  mapping: ImportMappingInput;
  /** True when the draft passes the mapping schema as it stands. */
  complete: boolean;
  /** Schema messages for what is still missing or unclear. */
  problems: string[];
}

/** Lower case, degree signs and superscripts spelled out, punctuation to spaces (slashes kept for units). */
export function normaliseHeader(header: string): string {
  return header
    .toLowerCase()
    .replace(/[°º]\s*/g, ' deg')
    .replace(/³/g, '3')
    .replace(/δp|Δp/gi, ' dp ')
    .replace(/%/g, ' pct ')
    .replace(/(?<!\d)\.|\.(?!\d)/g, ' ')
    .replace(/[()[\]{},;:_|"'#]/g, ' ')
    .replace(/\s*\/\s*/g, '/')
    .replace(/\s+/g, ' ')
    .trim();
}

type UnitRule = [pattern: RegExp, unit: string, kinds: readonly GuessedQuantity[], absolute?: boolean];

const PRESSURES: readonly GuessedQuantity[] = ['backpressure', 'condenserVacuum', 'barometer', 'cwDifferentialPressure'];
const TEMPERATURES: readonly GuessedQuantity[] = ['cwInletTemperature', 'cwOutletTemperature', 'hotwellTemperature'];
const MASS_FLOWS: readonly GuessedQuantity[] = ['condensateFlow', 'airRemovalFlow', 'cwFlow'];

const UNIT_RULES: UnitRule[] = [
  [/\bdeg ?f\b|\bfahrenheit\b|\bf$/, 'degF', TEMPERATURES],
  [/\bdeg ?c\b|\bcelsius\b|\bc$/, 'degC', TEMPERATURES],
  [/\bin\.? ?hg ?a\b|\binhga\b|\binhg ?abs/, 'inHg', PRESSURES, true],
  [/\bin\.? ?hg\b|\binhg\b|\binches (of )?(hg|mercury)\b/, 'inHg', PRESSURES],
  [/\bmm ?hg\b/, 'mmHg', PRESSURES],
  [/\bkpa ?\(?a\)?$|\bkpa ?a\b|\bkpa ?abs|\bkpaa\b/, 'kPa', PRESSURES, true],
  [/\bkpa\b/, 'kPa', PRESSURES],
  [/\bmbara\b|\bmbar ?abs/, 'mbar', PRESSURES, true],
  [/\bmbar\b|\bmillibar/, 'mbar', PRESSURES],
  [/\bpsia\b/, 'psi', PRESSURES, true],
  [/\bpsig?\b|\bpsid\b/, 'psi', PRESSURES],
  [/\bbara\b/, 'bar', PRESSURES, true],
  [/\bbar\b/, 'bar', PRESSURES],
  [/\bft ?h2o\b|\bft ?wc\b|\bfeet of water\b/, 'ftH2O', ['cwDifferentialPressure']],
  [/\bgpm\b|\bgal\/min\b|\bgallons per minute\b/, 'gpm', ['cwFlow']],
  [/\bm3\/h(r)?\b|\bm3h\b/, 'm3/h', ['cwFlow']],
  [/\bm3\/s(ec)?\b/, 'm3/s', ['cwFlow']],
  [/\bscfm\b/, 'scfm', ['airRemovalFlow']],
  [/\bk ?lbs?\/h(r)?\b|\bkpph\b/, 'klb/h', ['condensateFlow']],
  [/\blbs?\/h(r)?\b|\bpph\b/, 'lb/h', ['condensateFlow']],
  [/\bt\/h\b/, 't/h', ['condensateFlow']],
  [/\bkg\/h(r)?\b/, 'kg/h', ['airRemovalFlow', 'condensateFlow']],
  [/\bkg\/s\b/, 'kg/s', MASS_FLOWS],
  [/\bmw\b|\bmegawatts?\b/, 'MW', ['grossLoad']],
  [/\bkw\b/, 'kW', ['grossLoad']],
  [/\bppb\b|\bµg\/kg\b|\bug\/kg\b/, 'ppb', ['dissolvedOxygen']],
  [/\bppm\b/, 'ppm', ['dissolvedOxygen']],
];

const CW = /\b(cw|circ|circulating|cooling|cond(enser)? water|river|lake|sea|intake)\b/;
const IN = /\b(in|inlet|supply|intake|entering|inl)\b/;
const OUT = /\b(out|outlet|discharge|return|leaving|outl)\b/;
const TEMP = /\b(temp|temperature|t|deg[fc]?)\b/;

/**
 * Words that name a quantity Cleancase does not import: a header with one of them is never proposed, whatever else
 * it says ("Hotwell lvl in" is a level in inches, not a hotwell temperature).
 */
const OTHER_QUANTITIES: [RegExp, string][] = [
  [/\b(level|lvl|lev)\b/, 'a level'],
  [/\b(position|pos|valve|vlv|opening|damper)\b/, 'a valve or damper position'],
  [/\bpct\b|\bpercent\b/, 'a percentage'],
  [/\b(speed|rpm)\b/, 'a speed'],
  [/\b(current|amps?)\b/, 'an electric current'],
  [/\bmvars?\b|\bkvars?\b|\breactive\b/, 'reactive power'],
  [/\b(kv|volts?|voltage)\b/, 'a voltage'],
  [/\b(hz|frequency)\b/, 'a frequency'],
  [/\b(vib|vibration)\b|\bmils?\b|\bmm\/s\b/, 'a vibration'],
  [/\bconductivity\b|\bµs\/cm\b|\bus\/cm\b|\bph\b|\bsodium\b/, 'a water chemistry reading other than dissolved oxygen'],
  [/\b(setpoint|set point|sp)\b/, 'a setpoint'],
  [/\b(status|alarm|mode|count|hours|hrs|run ?time)\b/, 'a status or counter'],
];

function otherQuantityOf(n: string): string | null {
  for (const [re, what] of OTHER_QUANTITIES) if (re.test(n)) return what;
  return null;
}

/** Quantity from the header words, in the order the tests are tried (most specific first). */
function quantityFromWords(n: string): GuessedQuantity | null {
  if (/\b(time ?stamp|t?stamp|ts|date ?time|date|time|zeit|zeitstempel|datum)\b/.test(n) && !/\b(run|up|down) ?time\b/.test(n)) return 'timestamp';
  if (/\bbarom|\bbaro\b|\batmospheric|\bambient press|\batm press/.test(n)) return 'barometer';
  if (/\bhot ?well\b|\bcondensate temp/.test(n)) return 'hotwellTemperature';
  if (/\bdissolved (o2|oxygen)\b|\bdo\b|\bo2\b|\boxygen\b/.test(n)) return 'dissolvedOxygen';
  if (/\bair (removal|in ?-?leak(age)?|ejector|exhauster|extraction)\b|\bsjae\b|\bvacuum pump (flow|air)\b|\bair ?flow\b|\bnon-?condensable/.test(n))
    return 'airRemovalFlow';
  if (/\bcondensate (pump )?flow\b|\bcond(ensate)? flow\b/.test(n) && !CW.test(n)) return 'condensateFlow';
  if (/\bdp\b|\bd\/p\b|\bdiff(erential)? ?press|\bdelta ?p\b|\bpress(ure)? drop\b/.test(n)) return 'cwDifferentialPressure';
  if (/\bvac(uum)?\b/.test(n)) return 'condenserVacuum';
  if (
    /\bback ?pressure\b|\bbp\b|\bcond(enser)? (abs(olute)? )?(press(ure)?|pr)\b|\bexh(aust)? (abs(olute)? )?(press(ure)?|pr)\b|\bturb(ine)? exh(aust)?\b|\bshell press|\bcondenser pressure\b/.test(
      n,
    )
  ) {
    return 'backpressure';
  }
  if (TEMP.test(n) || /\bdeg ?[fc]\b/.test(n)) {
    if (IN.test(n) && (CW.test(n) || /\bwater\b/.test(n))) return 'cwInletTemperature';
    if (OUT.test(n) && (CW.test(n) || /\bwater\b/.test(n))) return 'cwOutletTemperature';
  }
  if (/\bflow\b/.test(n) && (CW.test(n) || /\bwater\b/.test(n))) return 'cwFlow';
  if (/\bgross\b|\bgenerator (output|load|power)\b|\bgen (mw|output|load)\b|\bunit load\b|\bload\b|\boutput\b|\bleistung\b/.test(n)) return 'grossLoad';
  return null;
}

function unitFromHeader(n: string): { unit: string; kinds: readonly GuessedQuantity[]; absolute: boolean } | null {
  for (const [re, unit, kinds, absolute] of UNIT_RULES) if (re.test(n)) return { unit, kinds, absolute: !!absolute };
  return null;
}

const numericValues = (rows: string[][], index: number, comma: boolean): number[] =>
  rows
    .map((r) => (r[index] ?? '').trim())
    .filter((c) => c !== '')
    .map((c) => Number(comma ? c.replace(',', '.') : c))
    .filter(Number.isFinite);

/** A typical value of a column: its upper middle value, one the file itself holds (so a message can quote it); NaN for none. */
const typicalValue = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length === 0 ? Number.NaN : s[Math.floor(s.length / 2)]!;
};

/** Unit of a column from typical magnitudes of its values [common practice, rough]. */
function unitFromValues(quantity: GuessedQuantity, values: number[]): string | null {
  const m = typicalValue(values);
  if (!Number.isFinite(m)) return null;
  if ((TEMPERATURES as readonly string[]).includes(quantity)) return m > 45 ? 'degF' : 'degC';
  if (quantity === 'backpressure') return m < 1 ? 'psi' : m < 6 ? 'inHg' : m < 30 ? 'kPa' : m < 300 ? 'mbar' : null;
  if (quantity === 'condenserVacuum') return m > 20 && m < 31 ? 'inHg' : m > 600 ? 'mbar' : m > 60 && m < 105 ? 'kPa' : null;
  if (quantity === 'barometer') return m > 25 && m < 32 ? 'inHg' : m > 80 && m < 110 ? 'kPa' : m > 800 && m < 1100 ? 'mbar' : m > 11 && m < 16 ? 'psi' : null;
  if (quantity === 'grossLoad') return m > 5000 ? 'kW' : 'MW';
  if (quantity === 'dissolvedOxygen') return 'ppb';
  return null;
}

/**
 * What each quantity can physically be, in Cleancase's units (kPa absolute, °C, m³/s, kg/s, MW, ppb): wide bands
 * that tell a temperature from a flow or a level, not operating limits [common practice, rough].
 */
const PLAUSIBLE_SI: Record<ImportQuantity, [min: number, max: number]> = {
  grossLoad: [-50, 2_500],
  backpressure: [0.5, 80],
  condenserVacuum: [0, 105],
  barometer: [60, 110],
  cwInletTemperature: [-5, 60],
  cwOutletTemperature: [-5, 75],
  hotwellTemperature: [0, 95],
  cwFlow: [0, 300],
  dissolvedOxygen: [0, 20_000],
  airRemovalFlow: [0, 10],
  cwDifferentialPressure: [0, 300],
  condensateFlow: [0, 3_000],
};

/** A value in a file unit in Cleancase's unit for the range check (a mass CW flow at 20 °C, close enough for it). */
function toSi(quantity: ImportQuantity, value: number, unit: string): number {
  if (PRESSURES.includes(quantity)) return pressureToKpa(value, unit);
  if (TEMPERATURES.includes(quantity)) return temperatureToC(value, unit);
  if (quantity === 'grossLoad') return powerToMw(value, unit);
  if (quantity === 'cwFlow') return cwFlowToM3s(value, unit, 20);
  if (quantity === 'dissolvedOxygen') return dissolvedOxygenToPpb(value, unit);
  return massFlowToKgS(value, unit);
}

/** Whether the typical value of a column (its middle value) is something the quantity can be in that unit. */
function plausible(quantity: ImportQuantity, unit: string, values: number[]): boolean {
  if (values.length === 0) return true;
  const [min, max] = PLAUSIBLE_SI[quantity];
  const m = toSi(quantity, typicalValue(values), unit);
  return m >= min && m <= max;
}

function guessTimestamp(
  samples: string[],
): { format: 'iso-8601-offset' | 'local-text' | 'excel-serial'; dateOrder?: 'ymd' | 'mdy' | 'dmy'; confidence: number } | null {
  const texts = samples.map((s) => s.trim()).filter(Boolean);
  if (texts.length === 0) return null;
  if (texts.every((t) => /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?\s*(Z|[+-]\d{2}(:?\d{2})?)$/i.test(t)))
    return { format: 'iso-8601-offset', confidence: 0.95 };
  if (texts.every((t) => /^\d+(\.\d+)?$/.test(t) && +t > 20_000 && +t < 80_000)) return { format: 'excel-serial', confidence: 0.8 };
  if (!texts.every(looksLikeDateTime)) return null;
  const parts = texts.map((t) => {
    const [first = '', second = ''] = t.split(/[-/.T ]/);
    return { first, second };
  });
  if (parts.every((p) => p.first.length === 4)) return { format: 'local-text', dateOrder: 'ymd', confidence: 0.9 };
  if (parts.some((p) => +p.first > 12)) return { format: 'local-text', dateOrder: 'dmy', confidence: 0.85 };
  if (parts.some((p) => +p.second > 12)) return { format: 'local-text', dateOrder: 'mdy', confidence: 0.85 };
  // ambiguous day/month: dots are the European habit, slashes the US one
  return { format: 'local-text', dateOrder: texts[0]!.includes('.') ? 'dmy' : 'mdy', confidence: 0.5 };
}

export interface GuessOptions {
  /** The plant's IANA zone, used for local and Excel timestamps. */
  timeZone?: string;
}

export function guessMapping(headers: string[], sampleRows: string[][] = [], options: GuessOptions = {}): MappingGuess {
  const commaDecimals =
    sampleRows.some((r) => r.some((c) => /^-?\d+,\d+$/.test(c.trim()))) && !sampleRows.some((r) => r.some((c) => /^-?\d+\.\d+$/.test(c.trim())));
  const guesses: ColumnGuess[] = headers.map((header, index) => {
    const n = normaliseHeader(header);
    const unmapped = (note?: string): ColumnGuess => ({ header, index, quantity: null, unit: null, confidence: 0, ...(note ? { note } : {}) });
    const other = otherQuantityOf(n);
    if (other) return unmapped(`the header names ${other}, which is not imported`);
    const fromUnit = unitFromHeader(n);
    let quantity = quantityFromWords(n);
    let confidence = 0;
    let unit: string | null = null;
    let note: string | undefined;
    if (quantity === 'timestamp') {
      const ts = guessTimestamp(sampleRows.map((r) => r[index] ?? ''));
      return { header, index, quantity, unit: null, confidence: ts ? Math.min(0.95, ts.confidence + 0.05) : 0.6 };
    }
    if (quantity === null && fromUnit && fromUnit.kinds.length === 1) {
      quantity = fromUnit.kinds[0]!;
      confidence = 0.35;
      note = 'guessed from the unit only';
    } else if (quantity === null && fromUnit?.absolute && /\b(press(ure)?|pr|p)\b/.test(n)) {
      // an absolute pressure that is not named a barometer: the condenser's
      quantity = 'backpressure';
      confidence = 0.45;
      note = 'guessed from the absolute pressure unit';
    } else if (quantity) confidence = 0.6;
    if (!quantity) return unmapped();
    // a gauge reading named like a backpressure is a vacuum; an absolute unit on a "vacuum" column is a backpressure
    if (quantity === 'backpressure' && fromUnit?.unit === 'inHg' && !fromUnit.absolute && /\bvac/.test(n)) quantity = 'condenserVacuum';
    if (quantity === 'condenserVacuum' && fromUnit?.absolute) quantity = 'backpressure';
    const values = numericValues(sampleRows, index, commaDecimals);
    const units = IMPORT_QUANTITY_UNITS[quantity as ImportQuantity] as readonly string[];
    if (fromUnit && !fromUnit.kinds.includes(quantity)) return unmapped(`the header's unit (${fromUnit.unit}) is not a unit of ${quantity}`);
    if (fromUnit) {
      unit = fromUnit.unit;
      confidence = Math.max(confidence, 0.6) + 0.3;
    } else {
      unit = unitFromValues(quantity, values);
      if (unit) {
        confidence = Math.min(confidence, 0.5);
        note = 'unit guessed from the values';
      } else note = 'unit unknown: choose it';
    }
    if (unit && units.includes(unit) && !plausible(quantity as ImportQuantity, unit, values)) {
      return unmapped(`the values (typically ${typicalValue(values)}) are not a plausible ${quantity} in ${unit}`);
    }
    if (!unit && values.length > 0 && !units.some((u) => plausible(quantity as ImportQuantity, u, values))) {
      return unmapped(`the values (typically ${typicalValue(values)}) are not a plausible ${quantity} in any unit`);
    }
    return { header, index, quantity, unit, confidence: Math.round(confidence * 100) / 100, ...(note ? { note } : {}) };
  });

  // no timestamp by its words: a column whose sample values are all date-times is taken, with a low confidence
  if (!guesses.some((g) => g.quantity === 'timestamp')) {
    const byValues = guesses.find(
      (g) => g.quantity === null && !g.note && sampleRows.length > 0 && guessTimestamp(sampleRows.map((r) => r[g.index] ?? ''))?.format === 'local-text',
    );
    if (byValues) Object.assign(byValues, { quantity: 'timestamp', confidence: 0.5, note: 'taken as the timestamp from its values' });
  }

  // one column per quantity: the most confident wins, the others are left for the user
  const best = new Map<GuessedQuantity, ColumnGuess>();
  for (const g of guesses) {
    if (!g.quantity) continue;
    const held = best.get(g.quantity);
    if (!held || g.confidence > held.confidence) best.set(g.quantity, g);
  }
  for (const g of guesses) {
    if (g.quantity && best.get(g.quantity) !== g) {
      g.note = `also looks like ${g.quantity}; "${best.get(g.quantity)!.header}" was preferred`;
      g.quantity = null;
      g.unit = null;
      g.confidence = 0;
    }
  }
  if (best.has('backpressure') && best.has('condenserVacuum')) {
    const vac = best.get('condenserVacuum')!;
    vac.note = 'an absolute backpressure column was found, so the vacuum is not needed';
    vac.quantity = null;
    vac.unit = null;
    vac.confidence = 0;
    best.delete('condenserVacuum');
  }

  const columns: Record<string, { column: string; unit: string }> = {};
  for (const [q, g] of best) {
    if (q === 'timestamp' || !g.unit) continue;
    if (!(IMPORT_QUANTITY_UNITS[q] as readonly string[]).includes(g.unit)) continue;
    columns[q] = { column: g.header, unit: g.unit };
  }
  const tsGuess = best.get('timestamp');
  const tsFormat = tsGuess ? guessTimestamp(sampleRows.map((r) => r[tsGuess.index] ?? '')) : null;
  const mapping = {
    ...(tsGuess
      ? {
          timestamp: {
            column: tsGuess.header,
            format: tsFormat?.format ?? 'local-text',
            ...(tsFormat?.format !== 'iso-8601-offset' && options.timeZone ? { timeZone: options.timeZone } : {}),
            ...(tsFormat?.dateOrder ? { dateOrder: tsFormat.dateOrder } : {}),
          },
        }
      : {}),
    columns,
    decimalSeparator: commaDecimals ? ',' : '.',
  } as ImportMappingInput;
  const parsed = importMappingSchema.safeParse(mapping);
  return {
    columns: guesses,
    mapping,
    complete: parsed.success,
    problems: parsed.success ? [] : parsed.error.issues.map((i) => i.message),
  };
}
