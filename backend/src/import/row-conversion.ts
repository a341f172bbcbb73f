/**
 * Applies a checked mapping to one raw row: finds the cells, parses numbers and the timestamp,
 * converts to SI and writes the result into a flat record (NaN = optional value absent). Every
 * problem with the row ("the file is wrong") is reported to the error list; nothing is guessed.
 */
import { IMPORT_QUANTITIES, importMappingSchema, type ImportMapping, type ImportQuantity } from '@shared/schemas/import-mapping.js';
import { INHG_REFERENCE_NOTE } from '@shared/units.js';
import { ImportFileError, type RowErrorList } from './import-errors.js';
import { SCFM_BASIS_NOTE, cwFlowToM3s, dissolvedOxygenToPpb, massFlowToKgS, powerToMw, pressureToKpa, temperatureToC } from './quantity-conversion.js';
import { TimestampParser, describeTimestampRule } from './timestamp-parsing.js';

/** Field positions in a converted record (a Float64Array, so millions of rows stay compact). */
export const F = {
  timestampUtc: 0,
  line: 1,
  loadMw: 2,
  backpressureKpa: 3,
  cwInletC: 4,
  cwOutletC: 5,
  cwFlowM3s: 6,
  hotwellC: 7,
  dissolvedOxygenPpb: 8,
  airRemovalKgS: 9,
  barometerKpa: 10,
  cwDifferentialPressureKpa: 11,
  condensateFlowKgS: 12,
} as const;
export const RECORD_FIELDS = 13;

export interface CompiledMapping {
  mapping: ImportMapping;
  headers: string[];
  timestampIndex: number;
  index: Partial<Record<ImportQuantity, number>>;
  flowAssumed: boolean;
  assumptions: string[];
}

/** Checks the mapping against the schema and the file's headers; a problem is a file-level error. */
export function compileMapping(mappingInput: unknown, headers: string[]): CompiledMapping {
  const parsed = importMappingSchema.safeParse(mappingInput);
  if (!parsed.success) {
    const detail = parsed.error.issues.map((i) => `${i.path.join('.') || 'mapping'}: ${i.message}`).join('; ');
    throw new ImportFileError('bad-mapping', `the column mapping is not complete or not valid: ${detail}`);
  }
  const mapping = parsed.data;
  const positions = new Map<string, number[]>();
  headers.forEach((h, i) => positions.set(h, [...(positions.get(h) ?? []), i]));
  const missing: string[] = [];
  const find = (column: string): number => {
    const at = positions.get(column);
    if (!at) {
      missing.push(`"${column}"`);
      return -1;
    }
    if (at.length > 1)
      throw new ImportFileError('duplicate-column', `the file has ${at.length} columns named "${column}": rename them so the mapping is unambiguous`);
    return at[0]!;
  };
  const timestampIndex = find(mapping.timestamp.column);
  const index: Partial<Record<ImportQuantity, number>> = {};
  for (const q of IMPORT_QUANTITIES) {
    const ref = mapping.columns[q];
    if (ref) index[q] = find(ref.column);
  }
  if (missing.length > 0) {
    throw new ImportFileError('column-not-found', `mapped column${missing.length > 1 ? 's' : ''} ${missing.join(', ')} not found in the file's header`);
  }
  const assumptions = [describeTimestampRule(mapping.timestamp)];
  const flowAssumed = !mapping.columns.cwFlow;
  if (flowAssumed) assumptions.push(`CW flow not metered: every row uses the design flow ${mapping.designCwFlowM3s} m³/s`);
  if (mapping.columns.condenserVacuum) {
    assumptions.push(
      mapping.columns.barometer
        ? 'backpressure = barometer − condenser vacuum, row by row'
        : `backpressure = fixed barometer ${mapping.fixedBarometer!.value} ${mapping.fixedBarometer!.unit} − condenser vacuum`,
    );
  }
  const units = IMPORT_QUANTITIES.map((q) => mapping.columns[q]?.unit).filter(Boolean);
  if (units.includes('inHg')) assumptions.push(INHG_REFERENCE_NOTE);
  if (mapping.columns.airRemovalFlow?.unit === 'scfm') assumptions.push(SCFM_BASIS_NOTE);
  if (mapping.columns.cwFlow?.unit === 'kg/s') assumptions.push('CW mass flow turned into volume flow at the inlet temperature (IAPWS-IF97 density)');
  return { mapping, headers, timestampIndex, index, flowAssumed, assumptions };
}

const NUMBER_DOT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const NUMBER_COMMA = /^[+-]?(\d+(,\d*)?|,\d+)([eE][+-]?\d+)?$/;

const REQUIRED_LABEL: Partial<Record<ImportQuantity, string>> = {
  grossLoad: 'gross load',
  backpressure: 'backpressure',
  condenserVacuum: 'condenser vacuum',
  cwInletTemperature: 'CW inlet temperature',
  cwOutletTemperature: 'CW outlet temperature',
  cwFlow: 'CW flow',
};

export class RowConverter {
  readonly timestamps: TimestampParser;
  private readonly numberPattern: RegExp;
  private readonly comma: boolean;

  constructor(private readonly m: CompiledMapping) {
    this.timestamps = new TimestampParser(m.mapping.timestamp);
    this.comma = m.mapping.decimalSeparator === ',';
    this.numberPattern = this.comma ? NUMBER_COMMA : NUMBER_DOT;
  }

  /**
   * Fills `out` from the row; returns false (and reports to `errors`) when the row is wrong.
   * All problems of a row are reported, not only the first.
   */
  convert(cells: string[], line: number, out: Float64Array, errors: RowErrorList): boolean {
    const { headers, mapping } = this.m;
    out[F.timestampUtc] = Number.NaN;
    out[F.line] = line;
    if (cells.length < headers.length) {
      errors.add(line, headers[cells.length]!, '', `the row has ${cells.length} column${cells.length === 1 ? '' : 's'}; the header has ${headers.length}`);
      return false;
    }
    for (let k = headers.length; k < cells.length; k++) {
      if (cells[k]!.trim() !== '') {
        errors.add(line, `(column ${k + 1})`, cells[k]!, `the row has more columns than the header (${headers.length})`);
        return false;
      }
    }
    // From here every mapped column index is below headers.length ≤ cells.length.
    this.rowOk = true;
    const tsText = cells[this.m.timestampIndex]!;
    const ts = this.timestamps.parse(tsText);
    if (Number.isNaN(ts)) {
      errors.add(line, headers[this.m.timestampIndex]!, tsText, `bad timestamp: ${this.timestamps.error}`);
      this.rowOk = false;
    }
    out[F.timestampUtc] = ts;
    out[F.line] = line;

    const c = mapping.columns;
    const load = this.readNumber(cells, line, errors, 'grossLoad', true);
    const t1 = this.readNumber(cells, line, errors, 'cwInletTemperature', true);
    const t2 = this.readNumber(cells, line, errors, 'cwOutletTemperature', true);
    out[F.loadMw] = powerToMw(load, c.grossLoad!.unit);
    out[F.cwInletC] = temperatureToC(t1, c.cwInletTemperature!.unit);
    out[F.cwOutletC] = temperatureToC(t2, c.cwOutletTemperature!.unit);

    const baro = this.readNumber(cells, line, errors, 'barometer', !!c.condenserVacuum && !mapping.fixedBarometer);
    out[F.barometerKpa] = c.barometer ? pressureToKpa(baro, c.barometer.unit) : Number.NaN;
    if (c.backpressure) {
      out[F.backpressureKpa] = pressureToKpa(this.readNumber(cells, line, errors, 'backpressure', true), c.backpressure.unit);
    } else {
      const vacuumKpa = pressureToKpa(this.readNumber(cells, line, errors, 'condenserVacuum', true), c.condenserVacuum!.unit);
      const baroKpa =
        c.barometer && !Number.isNaN(out[F.barometerKpa]) ? out[F.barometerKpa]! : pressureToKpa(mapping.fixedBarometer!.value, mapping.fixedBarometer!.unit);
      out[F.backpressureKpa] = baroKpa - vacuumKpa;
    }
    if (c.cwFlow) {
      const flow = this.readNumber(cells, line, errors, 'cwFlow', true);
      out[F.cwFlowM3s] = Number.isNaN(flow) ? Number.NaN : cwFlowToM3s(flow, c.cwFlow.unit, out[F.cwInletC]!);
    } else {
      out[F.cwFlowM3s] = mapping.designCwFlowM3s!;
    }
    out[F.hotwellC] = c.hotwellTemperature
      ? temperatureToC(this.readNumber(cells, line, errors, 'hotwellTemperature', false), c.hotwellTemperature.unit)
      : Number.NaN;
    out[F.dissolvedOxygenPpb] = c.dissolvedOxygen
      ? dissolvedOxygenToPpb(this.readNumber(cells, line, errors, 'dissolvedOxygen', false), c.dissolvedOxygen.unit)
      : Number.NaN;
    out[F.airRemovalKgS] = c.airRemovalFlow ? massFlowToKgS(this.readNumber(cells, line, errors, 'airRemovalFlow', false), c.airRemovalFlow.unit) : Number.NaN;
    out[F.cwDifferentialPressureKpa] = c.cwDifferentialPressure
      ? pressureToKpa(this.readNumber(cells, line, errors, 'cwDifferentialPressure', false), c.cwDifferentialPressure.unit)
      : Number.NaN;
    out[F.condensateFlowKgS] = c.condensateFlow
      ? massFlowToKgS(this.readNumber(cells, line, errors, 'condensateFlow', false), c.condensateFlow.unit)
      : Number.NaN;
    return this.rowOk;
  }

  private rowOk = true;

  /** The number in a mapped cell, NaN when empty (an error if required) or not a number (an error). */
  private readNumber(cells: string[], line: number, errors: RowErrorList, q: ImportQuantity, required: boolean): number {
    const i = this.m.index[q];
    if (i === undefined) return Number.NaN;
    const raw = cells[i]!;
    const text = raw.trim();
    if (text === '') {
      if (required) {
        errors.add(line, this.m.headers[i]!, raw, `missing value: ${REQUIRED_LABEL[q] ?? q} is required in every row`);
        this.rowOk = false;
      }
      return Number.NaN;
    }
    if (!this.numberPattern.test(text)) {
      errors.add(line, this.m.headers[i]!, raw, `not a number${this.comma ? ' (decimal comma expected)' : ''}`);
      this.rowOk = false;
      return Number.NaN;
    }
    return Number(this.comma ? text.replace(',', '.') : text);
  }
}
