/**
 * One file per tag: several files uploaded together (or unpacked from one ZIP) that form one import. Each file holds
 * one tag's series — a time column and a value column (a quality column too, at times), the tag named by the value
 * column's header, by a title line ("Tag,U1.GEN.MW") or by the file's name — or is a tall file of a single tag.
 *
 * The upload's folder holds the files as 1.upload, 2.upload, … (never by the names they came with) and a manifest
 * of what each one is. Together they read as one tall table with the columns below, so the mapping step, the saved
 * mapping and the time grid are those of a tall file; the check reads the files one after another
 * (`tagFilesSource`) and refuses, before anything is stored, a tag in two files and a file whose times do not
 * overlap another's.
 */
import { readFile, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';
import type { ImportMapping } from '@shared/schemas/import-mapping.js';
import { normaliseHeader } from './column-mapping.js';
import { ImportFileError, type RowErrorList } from './import-errors.js';
import { openTable } from './open-table.js';
import { looksLikeDateTime, looksNumeric, type RawTable } from './raw-table.js';
import type { SampleSource } from './tall-alignment.js';
import { detectTallShape } from './tall-detection.js';

/** The columns the files read as together: map these as a tall file's. */
export const TAG_FILE_COLUMNS = { timestamp: 'Timestamp', tag: 'Tag', value: 'Value', quality: 'Quality' } as const;
export const TAG_FILES_MANIFEST = 'files.json';

export class TagFilesRefusal extends Error {}

const tagFileEntry = z
  .object({
    /** the file in the folder: `<n>.upload` */
    file: z.string().regex(/^\d{1,3}\.upload$/),
    /** the name it came with, for display only */
    name: z.string().max(255),
    bytes: z.number().int().nonnegative(),
    kind: z.enum(['csv', 'xlsx']),
    tag: z.string().min(1).max(200),
    timeColumn: z.string(),
    valueColumn: z.string(),
    qualityColumn: z.string().nullable(),
    /** a tall file of one tag: the column naming it */
    tagColumn: z.string().nullable(),
    rows: z.number().int().nonnegative(),
    firstTime: z.string(),
    lastTime: z.string(),
    samples: z.array(z.string()),
    times: z.array(z.string()),
  })
  .strict();
export type TagFileEntry = z.infer<typeof tagFileEntry>;
const manifestSchema = z.array(tagFileEntry).min(1);

const TIME_WORDS = /\b(time ?stamp|timestamp|ts|date ?time|datetime|date|time)\b/;
const QUALITY_WORDS = /\b(quality|qual|status|q|flag)\b/;
/** Value column headers that name no tag ("Value", "PV"): the tag is then in a title line or the file's name. */
const GENERIC_VALUE = /^(value|val|values|reading|pv|avg|average|mean|data|sample|y)$/;
const TAG_TITLE = /^(tag|tag ?name|tagname|point|point ?name|signal|name|item)\s*:?\s+(.+)$/i;

/** The shape of one file: which column holds what, and its tag; a refusal in our words when it is no tag series. */
export function describeTagFile(
  name: string,
  table: Pick<RawTable, 'headers' | 'titleLines' | 'sampleRows'>,
): Omit<TagFileEntry, 'file' | 'name' | 'bytes' | 'kind' | 'rows' | 'firstTime' | 'lastTime' | 'samples' | 'times'> {
  const { headers, sampleRows } = table;
  const tall = detectTallShape(headers, sampleRows);
  if (tall) {
    const tag = sampleRows.map((r) => (r[headers.indexOf(tall.tagColumn)] ?? '').trim()).find(Boolean);
    if (!tag) throw new TagFilesRefusal(`"${name}" names no tag in its "${tall.tagColumn}" column`);
    // the tag is read back by its full name, so one a mapping cannot name (over 200 characters) is refused here
    if (tag.length > 200) throw new TagFilesRefusal(`"${name}" names a tag of ${tag.length} characters; at most 200 are read: shorten the tag's name`);
    return { tag, timeColumn: tall.timestampColumn, valueColumn: tall.valueColumn, qualityColumn: tall.qualityColumn, tagColumn: tall.tagColumn };
  }
  const norm = headers.map(normaliseHeader);
  const column = (k: number) => sampleRows.map((r) => (r[k] ?? '').trim()).filter(Boolean);
  const time = norm.findIndex((n, k) => TIME_WORDS.test(n) || (column(k).length > 0 && column(k).every(looksLikeDateTime)));
  const quality = norm.findIndex((n, k) => k !== time && QUALITY_WORDS.test(n));
  const values = headers.map((_, k) => k).filter((k) => k !== time && k !== quality);
  const notSeries = `"${name}" is not the series of one tag (a time column and one value column): `;
  if (time < 0) throw new TagFilesRefusal(`${notSeries}no column of times was found`);
  if (values.length !== 1)
    throw new TagFilesRefusal(`${notSeries}it has ${headers.length} columns (${headers.slice(0, 6).join(', ')}); import a file of several columns on its own`);
  const value = values[0]!;
  const v = column(value);
  if (v.length > 0 && v.filter(looksNumeric).length < v.length / 2) throw new TagFilesRefusal(`${notSeries}its "${headers[value]}" column holds no numbers`);
  const titled = table.titleLines.map((l) => TAG_TITLE.exec(l.trim())?.[2]?.trim()).find(Boolean);
  // a mapping names a tag trimmed: so is the tag taken from the file's name
  const tag = !GENERIC_VALUE.test(norm[value]!) ? headers[value]! : (titled ?? name.replace(/\.(csv|txt|xlsx|tsv)$/i, '').trim());
  if (tag.trim() === '') throw new TagFilesRefusal(`"${name}" names no tag (its value column says only "${headers[value]}"): name the file after its tag`);
  return {
    tag: tag.slice(0, 200).trim(),
    timeColumn: headers[time]!,
    valueColumn: headers[value]!,
    qualityColumn: quality >= 0 ? headers[quality]! : null,
    tagColumn: null,
  };
}

export interface UploadedTagFile {
  /** The name it came with (display only). */
  name: string;
  /** Where it lies: `<folder>/<n>.upload`. */
  path: string;
  bytes: number;
}

const SAMPLES = 10;

/**
 * Reads every file once (its shape, rows, first and last time, first values) and writes the folder's manifest.
 * Refuses a file that is no tag series, a file of several tags, an empty file and a tag in two files.
 */
export async function surveyTagFiles(folder: string, files: readonly UploadedTagFile[]): Promise<TagFileEntry[]> {
  const entries: TagFileEntry[] = [];
  for (const f of files) {
    if (path.dirname(path.resolve(f.path)) !== path.resolve(folder)) throw new Error('a tag file outside its upload folder');
    let table: RawTable;
    try {
      table = await openTable(f.path);
    } catch (e) {
      throw new TagFilesRefusal(`"${f.name}" cannot be read as a table: ${e instanceof Error ? e.message : String(e)}`);
    }
    let shape: ReturnType<typeof describeTagFile>;
    try {
      shape = describeTagFile(f.name, table);
    } catch (e) {
      await table.close();
      throw e;
    }
    const entry: TagFileEntry = {
      file: path.basename(f.path),
      name: f.name,
      bytes: f.bytes,
      kind: table.kind,
      rows: 0,
      firstTime: '',
      lastTime: '',
      samples: [],
      times: [],
      ...shape,
    };
    const ti = table.headers.indexOf(entry.timeColumn);
    const vi = table.headers.indexOf(entry.valueColumn);
    const gi = entry.tagColumn === null ? -1 : table.headers.indexOf(entry.tagColumn);
    try {
      for await (const chunk of table.chunks)
        for (const row of chunk) {
          if (gi >= 0) {
            const other = (row.cells[gi] ?? '').trim();
            if (other !== '' && other !== entry.tag)
              throw new TagFilesRefusal(`"${f.name}" holds more than one tag ("${entry.tag}", "${other}"): upload a file of several tags on its own`);
          }
          const time = (row.cells[ti] ?? '').trim();
          entry.rows++;
          if (entry.firstTime === '') entry.firstTime = time;
          entry.lastTime = time;
          if (entry.samples.length < SAMPLES) {
            entry.samples.push(row.cells[vi] ?? '');
            entry.times.push(time);
          }
        }
    } finally {
      await table.close();
    }
    if (entry.rows === 0) throw new TagFilesRefusal(`"${f.name}" holds no values`);
    const twin = entries.find((e) => e.tag === entry.tag);
    if (twin) throw new TagFilesRefusal(`Tag "${entry.tag}" is in two files, "${twin.name}" and "${f.name}": upload each tag once`);
    entries.push(entry);
  }
  await writeFile(path.join(folder, TAG_FILES_MANIFEST), JSON.stringify(entries), 'utf8');
  return entries;
}

/** Whether a stored upload is a folder of one-tag files (a file, or nothing there, is not: its reader says what is wrong). */
export const isTagFilesFolder = (storedPath: string): Promise<boolean> =>
  stat(storedPath).then(
    (s) => s.isDirectory(),
    () => false,
  );

export async function readTagFilesManifest(folder: string): Promise<TagFileEntry[]> {
  const parsed = manifestSchema.safeParse(JSON.parse(await readFile(path.join(folder, TAG_FILES_MANIFEST), 'utf8')));
  if (!parsed.success) throw new ImportFileError('unreadable-file', 'the uploaded files could not be read: upload them again');
  return parsed.data;
}

const when = (ms: number) => new Date(ms).toISOString().replace('.000Z', 'Z');

/**
 * The files read one after another into the mapped tags' series. A file's wrong cells are listed by its line and
 * "<file name>: <column>"; a tag in two files and a file whose times do not overlap another's are listed too, so the
 * import is refused before anything is stored.
 */
export function tagFilesSource(folder: string, mapping: ImportMapping): SampleSource {
  return {
    async read(series, parseTime, readValue, errors: RowErrorList, unmapped) {
      const entries = await readTagFilesManifest(folder);
      const seen = new Map<string, string>();
      const spans: { name: string; tag: string; from: number; to: number }[] = [];
      let rows = 0;
      for (const e of entries) {
        const twin = seen.get(e.tag);
        if (twin !== undefined) {
          errors.add(0, '', e.tag, `tag "${e.tag}" is in two files, "${twin}" and "${e.name}": upload each tag once`);
          continue;
        }
        seen.set(e.tag, e.name);
        const s = series.get(e.tag);
        if (!s) {
          if (unmapped.size < 50) unmapped.add(e.tag);
          continue;
        }
        const table = await openTable(path.join(folder, e.file), { kind: e.kind });
        let from = Infinity;
        let to = -Infinity;
        try {
          const at = (header: string | null) => {
            if (header === null) return -1;
            const k = table.headers.indexOf(header);
            if (k < 0) throw new ImportFileError('column-not-found', `column "${header}" of "${e.name}" not found: upload the files again`);
            return k;
          };
          const [ti, vi, qi, gi] = [at(e.timeColumn), at(e.valueColumn), mapping.quality ? at(e.qualityColumn) : -1, at(e.tagColumn)];
          const width = Math.max(ti, vi, qi, gi) + 1;
          const col = (h: string) => `${e.name}: ${h}`;
          for await (const chunk of table.chunks)
            for (const row of chunk) {
              rows++;
              const cells = row.cells;
              if (cells.length < width) {
                errors.add(row.line, col(table.headers[cells.length] ?? ''), '', `the row has ${cells.length} columns; the header has ${table.headers.length}`);
                continue;
              }
              if (gi >= 0 && cells[gi]!.trim() !== e.tag) {
                errors.add(row.line, col(e.tagColumn!), cells[gi]!, `a second tag in a file of tag "${e.tag}"`);
                continue;
              }
              const t = parseTime.parse(cells[ti]!);
              if (Number.isNaN(t)) {
                errors.add(row.line, col(e.timeColumn), cells[ti]!, `bad timestamp: ${parseTime.error}`);
                continue;
              }
              const v = readValue(cells[vi]!, qi >= 0 ? cells[qi]! : null);
              if (v === 'empty') continue;
              if (v === null) {
                errors.add(row.line, col(e.valueColumn), cells[vi]!, `not a number${mapping.decimalSeparator === ',' ? ' (decimal comma expected)' : ''}`);
                continue;
              }
              if (t < from) from = t;
              if (t > to) to = t;
              s.push(t, v.value, v.marker, row.line);
            }
        } finally {
          await table.close();
        }
        if (from <= to) spans.push({ name: e.name, tag: e.tag, from, to });
      }
      // every file's times must share some time with every other's: a file of another month joins nothing
      const told = new Set<string>();
      for (const a of spans)
        for (const b of spans) {
          if (a === b || told.has(a.name) || told.has(b.name) || (a.from <= b.to && b.from <= a.to)) continue;
          const [early, late] = a.to < b.from ? [a, b] : [b, a];
          told.add(late.name);
          errors.add(
            0,
            '',
            late.tag,
            `the times of "${late.name}" (${when(late.from)} to ${when(late.to)}) do not overlap those of "${early.name}" (${when(early.from)} to ${when(early.to)}): upload files of the same period`,
          );
        }
      return rows;
    },
  };
}
