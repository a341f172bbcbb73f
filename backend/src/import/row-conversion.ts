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
import { DEFAULT_STATUS_WORDS, statusWordKey } from '@shared/schemas/historian-status.js';

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
  /** 0 for a row with good values; else 1 + the index of its marker in RowConverter.markers (a status word or a quality value). */
  marker: 13,
} as const;
export const RECORD_FIELDS = 14;

export interface CompiledMapping {
  mapping: ImportMapping;
  headers: string[];
  timestampIndex: number;
  index: Partial<Record<ImportQuantity, number>>;
  /** Position of the quality column, -1 without one. */
  qualityIndex: number;
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
  const qualityIndex = mapping.quality ? find(mapping.quality.column) : -1;
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
  if (mapping.quality)
    assumptions.push(`rows whose "${mapping.quality.column}" is not ${mapping.quality.goodValues.join(' or ')} are kept out as instrument status`);
  return { mapping, headers, timestampIndex, index, qualityIndex, flowAssumed, assumptions };
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

/** Distinct not-good quality values counted by name; beyond this they are counted together. */
const MAX_QUALITY_MARKERS = 100;

export class RowConverter {
  readonly timestamps: TimestampParser;
  private readonly numberPattern: RegExp;
  private readonly comma: boolean;
  /** Marker texts by position (status words as the list spells them, then "quality <value>" as met); F.marker is 1 + the position. */
  readonly markers: string[];
  private readonly markerIndex = new Map<string, number>();
  private readonly goodQuality: Set<string>;
  /** markers[0 .. statusWordCount) are status words; the rest are quality values met in the file. */
  private readonly statusWordCount: number;
  /** Marker of the row being converted (0 = none). */
  private rowMarker = 0;
  private pendingMissing: [column: string, raw: string, message: string][] = [];

  constructor(
    private readonly m: CompiledMapping,
    statusWords: readonly string[] = DEFAULT_STATUS_WORDS,
  ) {
    this.timestamps = new TimestampParser(m.mapping.timestamp);
    this.comma = m.mapping.decimalSeparator === ',';
    this.numberPattern = this.comma ? NUMBER_COMMA : NUMBER_DOT;
    this.markers = [];
    for (const w of statusWords) {
      const key = statusWordKey(w);
      if (!this.markerIndex.has(key)) {
        this.markers.push(w);
        this.markerIndex.set(key, this.markers.length);
      }
    }
    this.statusWordCount = this.markers.length;
    this.goodQuality = new Set((m.mapping.quality?.goodValues ?? []).map(statusWordKey));
  }

  /** The marker of a not-good quality value, added to the list when first met (the first MAX_QUALITY_MARKERS by name). */
  private qualityMarker(raw: string): number {
    const text = raw.trim() === '' ? '(empty)' : raw.trim().slice(0, 40);
    const key = `quality ${statusWordKey(text)}`;
    const known = this.markerIndex.get(key);
    if (known !== undefined) return known;
    const named = this.markers.length - this.statusWordCount;
    const label = named < MAX_QUALITY_MARKERS ? `quality ${text}` : 'quality (other values)';
    const again = this.markerIndex.get(statusWordKey(label));
    if (again !== undefined) return again;
    this.markers.push(label);
    this.markerIndex.set(named < MAX_QUALITY_MARKERS ? key : statusWordKey(label), this.markers.length);
    return this.markers.length;
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
    this.rowMarker = 0;
    this.pendingMissing.length = 0;
    if (this.m.qualityIndex >= 0) {
      const q = cells[this.m.qualityIndex]!;
      if (!this.goodQuality.has(statusWordKey(q))) this.rowMarker = this.qualityMarker(q);
    }
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
    // a required value left empty in a row the historian marked is part of the same outage, not a file error
    if (this.rowMarker === 0) for (const [column, raw, message] of this.pendingMissing) errors.add(line, column, raw, message);
    if (this.rowMarker === 0 && this.pendingMissing.length > 0) this.rowOk = false;
    out[F.marker] = this.rowMarker;
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
      if (required) this.pendingMissing.push([this.m.headers[i]!, raw, `missing value: ${REQUIRED_LABEL[q] ?? q} is required in every row`]);
      return Number.NaN;
    }
    if (!this.numberPattern.test(text)) {
      const marker = this.markerIndex.get(statusWordKey(text));
      if (marker !== undefined && marker <= this.statusWordCount) {
        if (this.rowMarker === 0) this.rowMarker = marker;
        return Number.NaN;
      }
      errors.add(line, this.m.headers[i]!, raw, `not a number${this.comma ? ' (decimal comma expected)' : ''}`);
      this.rowOk = false;
      return Number.NaN;
    }
    return Number(this.comma ? text.replace(',', '.') : text);
  }
}
