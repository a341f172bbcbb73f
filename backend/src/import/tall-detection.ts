/**
 * Recognises a tall historian file (one row per tag per time) from its header and first rows, lists the tags it
 * holds (one pass over the tag column), and proposes a mapping of tags to quantities by the same guess as for
 * column names, with the tag's first values standing in for a column's.
 */
import { GRID_MINUTES, type ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { guessMapping, normaliseHeader, type MappingGuess } from './column-mapping.js';
import { openTable } from './open-table.js';
import { looksNumeric } from './raw-table.js';

export interface TallShape {
  timestampColumn: string;
  tagColumn: string;
  valueColumn: string;
  qualityColumn: string | null;
}

const TAG_WORDS = /\b(tag|tagname|tag ?name|point|point ?name|pointname|name|item|signal|sensor|channel|variable|description)\b/;
const VALUE_WORDS = /\b(value|val|reading|avg|average|mean|pv)\b/;
const QUALITY_WORDS = /\b(quality|qual|status|q|flag)\b/;
const TIME_WORDS = /\b(time ?stamp|timestamp|ts|date ?time|datetime|date|time)\b/;

/** A tall file's columns, or null when the file is not one (a wide file). */
export function detectTallShape(headers: string[], sampleRows: string[][]): TallShape | null {
  if (headers.length < 3 || headers.length > 8 || sampleRows.length === 0) return null;
  const norm = headers.map(normaliseHeader);
  const column = (k: number) => sampleRows.map((r) => (r[k] ?? '').trim()).filter(Boolean);
  const find = (words: RegExp, fits: (values: string[]) => boolean, taken: number[]) =>
    norm.findIndex((n, k) => !taken.includes(k) && words.test(n) && fits(column(k)));
  const ts = find(TIME_WORDS, () => true, []);
  if (ts < 0) return null;
  const tag = find(TAG_WORDS, (v) => v.length > 0 && v.some((c) => !looksNumeric(c)), [ts]);
  if (tag < 0) return null;
  const value = find(VALUE_WORDS, (v) => v.filter(looksNumeric).length >= v.length / 2, [ts, tag]);
  if (value < 0) return null;
  const quality = find(QUALITY_WORDS, () => true, [ts, tag, value]);
  return { timestampColumn: headers[ts]!, tagColumn: headers[tag]!, valueColumn: headers[value]!, qualityColumn: quality >= 0 ? headers[quality]! : null };
}

export interface TagFound {
  name: string;
  /** Rows of the tag in the file. */
  rows: number;
  /** Its first values, as text. */
  samples: string[];
}

export const MAX_TAGS_LISTED = 500;
const SAMPLES_PER_TAG = 10;

/** One pass over the tag column: every tag (the first 500), its row count and first values, and its median spacing. */
export async function listTags(
  filePath: string,
  shape: TallShape,
  sheet?: string,
): Promise<{ tags: TagFound[]; medianSpacingMinutes: number | null; moreTags: boolean }> {
  const table = await openTable(filePath, sheet !== undefined ? { sheet } : {});
  const gi = table.headers.indexOf(shape.tagColumn);
  const vi = table.headers.indexOf(shape.valueColumn);
  const ti = table.headers.indexOf(shape.timestampColumn);
  const found = new Map<string, TagFound & { times: string[] }>();
  let moreTags = false;
  try {
    for await (const chunk of table.chunks)
      for (const row of chunk) {
        const name = (row.cells[gi] ?? '').trim();
        if (name === '') continue;
        let t = found.get(name);
        if (!t) {
          if (found.size >= MAX_TAGS_LISTED) {
            moreTags = true;
            continue;
          }
          found.set(name, (t = { name, rows: 0, samples: [], times: [] }));
        }
        t.rows++;
        if (t.samples.length < SAMPLES_PER_TAG) {
          t.samples.push(row.cells[vi] ?? '');
          t.times.push(row.cells[ti] ?? '');
        }
      }
  } finally {
    await table.close();
  }
  const medianSpacingMinutes = medianSpacingOf([...found.values()].map((t) => t.times));
  return { tags: [...found.values()].map(({ times: _t, ...tag }) => tag), medianSpacingMinutes, moreTags };
}

/** The median spacing of each tag's first ISO-like times, minutes (a rough proposal for the grid; the person chooses). */
export function medianSpacingOf(timesByTag: readonly string[][]): number | null {
  const spacings: number[] = [];
  for (const times of timesByTag) {
    const ms = times.map((x) => Date.parse(x.includes('T') || /[zZ]|[+-]\d\d:?\d\d$/.test(x) ? x : x.replace(' ', 'T'))).filter(Number.isFinite);
    for (let i = 1; i < ms.length; i++) if (ms[i]! > ms[i - 1]!) spacings.push((ms[i]! - ms[i - 1]!) / 60_000);
  }
  spacings.sort((a, b) => a - b);
  return spacings.length ? spacings[Math.floor(spacings.length / 2)]! : null;
}

/** The grid proposed for a spacing: the finest offered grid not finer than the samples. */
export function proposeGrid(spacingMinutes: number | null): (typeof GRID_MINUTES)[number] {
  if (spacingMinutes === null) return 60;
  return GRID_MINUTES.find((g) => g >= spacingMinutes - 0.01) ?? 60;
}

/** A proposed mapping of a tall file: the timestamp from its column, tags to quantities by their names and values. */
export function guessTallMapping(
  shape: TallShape,
  headers: string[],
  sampleRows: string[][],
  tags: TagFound[],
  spacingMinutes: number | null,
  timeZone?: string,
): { guess: MappingGuess; mapping: ImportMappingInput } {
  const names = tags.map((t) => t.name);
  const depth = Math.max(0, ...tags.map((t) => t.samples.length));
  const tagRows = Array.from({ length: depth }, (_, i) => tags.map((t) => t.samples[i] ?? ''));
  const guess = guessMapping(names, tagRows, { timeZone });
  const timestamp = guessMapping(headers, sampleRows, { timeZone }).mapping.timestamp;
  const gridMinutes = proposeGrid(spacingMinutes);
  const mapping: ImportMappingInput = {
    ...guess.mapping,
    ...(timestamp ? { timestamp: { ...timestamp, column: shape.timestampColumn } } : {}),
    ...(shape.qualityColumn ? { quality: { column: shape.qualityColumn, goodValues: ['Good'] } } : {}),
    tall: { tagColumn: shape.tagColumn, valueColumn: shape.valueColumn, gridMinutes, rule: 'nearest', toleranceMinutes: Math.min(30, gridMinutes / 2) },
  };
  return { guess, mapping };
}

/**
 * An averaging interval stated in the title lines or the headers ("Interval: 1 hour average", "Avg (15 min)"), in
 * whole minutes; undefined when none is stated. The person confirms it on the mapping screen.
 */
export function averagingFromText(lines: string[]): number | undefined {
  for (const line of lines) {
    const m = /\b(avg|average[sd]?|mean|interval)\b[^0-9]{0,24}(\d+(?:\.\d+)?)\s*(min(?:ute)?s?|m|h(?:ou)?rs?|hours?|h)\b/i.exec(line);
    if (!m || !/avg|average|mean/i.test(line)) continue;
    const n = Number(m[2]) * (/^h/i.test(m[3]!) ? 60 : 1);
    if (Number.isInteger(n) && n >= 1 && n <= 1440) return n;
  }
  return undefined;
}
