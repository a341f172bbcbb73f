import { z } from 'zod';
import { REJECTION_REASONS, type RejectionReason } from '../domain/validity/rejection-reasons.js';
import { ALIGNMENT_RULES, IMPORT_QUANTITY_UNITS, type ImportMappingInput } from './import-mapping.js';

/** Files of one tag each imported together (uploaded side by side, or in one ZIP), at most. */
export const MAX_TAG_FILES = 20;

/** An import's life: mapping → checking → (rejected | importing → complete | failed); a complete one can be undone. */
export const IMPORT_STATUSES = ['mapping', 'checking', 'rejected', 'importing', 'complete', 'failed', 'undone'] as const;
export type ImportStatus = (typeof IMPORT_STATUSES)[number];

export const rowError = z
  .object({
    /** 1-based line of the file (CSV) or row number of the sheet (XLSX) */
    row: z.number().int(),
    /** header text of the column, as in the file */
    column: z.string(),
    value: z.string(),
    message: z.string(),
  })
  .strict();
export type RowErrorView = z.infer<typeof rowError>;

/** Outcome counts: while checking only the rows read; when stored, every outcome and reason. */
export const importCounts = z
  .object({
    rowsRead: z.number().int(),
    stored: z.number().int(),
    skippedIdentical: z.number().int(),
    /** rows at a stored time with other values: reported, not stored */
    conflicting: z.number().int(),
    /** the first conflicting times */
    conflicts: z.array(z.object({ timestampUtc: z.iso.datetime() }).strict()),
    rowsOk: z.number().int(),
    rowsByReason: z.partialRecord(z.enum(Object.keys(REJECTION_REASONS) as [RejectionReason, ...RejectionReason[]]), z.number().int()),
    flowAssumedRows: z.number().int(),
    /** rows kept out as instrument-status, by the status word or quality value that marked them */
    rowsByMarker: z.record(z.string().max(60), z.number().int()),
    /** a tall file or one file per tag: how its tags were put on one time grid */
    alignment: z
      .object({
        gridMinutes: z.number(),
        rule: z.enum(ALIGNMENT_RULES),
        toleranceMinutes: z.number(),
        gridTimes: z.number().int(),
        aligned: z.number().int(),
        /** grid times left out, by the first required tag without a value */
        leftOutByTag: z.record(z.string(), z.number().int()),
        samplesByTag: z.record(z.string(), z.number().int()),
        unmappedTags: z.array(z.string()),
        emptyValues: z.number().int(),
      })
      .strict(),
  })
  .partial()
  .strict();
export type ImportCounts = z.infer<typeof importCounts>;

/** A column mapping as stored: the proposed draft may still be incomplete, so it is checked only when an import starts. */
const storedMapping = z.custom<ImportMappingInput>((v) => typeof v === 'object' && v !== null && !Array.isArray(v), 'a mapping object');

export const importView = z
  .object({
    id: z.string(),
    unitId: z.string(),
    fileName: z.string(),
    fileBytes: z.number().int().nonnegative(),
    fileKind: z.string().nullable(),
    status: z.enum(IMPORT_STATUSES),
    /** 0 to 1 */
    progress: z.number(),
    message: z.string().nullable(),
    /** outcome counts: rows read, stored, by validity reason, skipped identical, conflicting */
    counts: importCounts.nullable(),
    errorCount: z.number().int().nonnegative(),
    /** the first errors by row and column (all of them in the CSV report) */
    errors: z.array(rowError),
    notes: z
      .object({ assumptions: z.array(z.string()), warnings: z.array(z.string()) })
      .strict()
      .nullable(),
    firstTimestamp: z.iso.datetime().nullable(),
    lastTimestamp: z.iso.datetime().nullable(),
    createdAt: z.iso.datetime(),
    finishedAt: z.iso.datetime().nullable(),
    /** the column mapping used or proposed (see the mapping request schema) */
    mapping: storedMapping.nullable(),
    uploadedBy: z.string().nullable(),
  })
  .strict();
export type ImportView = z.infer<typeof importView>;

export const importsResponse = z.object({ imports: z.array(importView) }).strict();
export type ImportsResponse = z.infer<typeof importsResponse>;

const guessedQuantity = z.enum([...(Object.keys(IMPORT_QUANTITY_UNITS) as (keyof typeof IMPORT_QUANTITY_UNITS)[]), 'timestamp']);

export const uploadResponse = z
  .object({
    import: importView,
    /**
     * wide: one column per quantity; tall: one row per tag per time (map tags, listed in `tags`); per-tag-files:
     * several files of one tag each (or a ZIP of them), read together as a tall file (map tags, listed in `files`)
     */
    shape: z.enum(['wide', 'tall', 'per-tag-files']),
    /** a tall file's tags (or the files' tags): name, rows and first values (at most 500; `moreTags` when the file has more) */
    tags: z.array(z.object({ name: z.string(), rows: z.number().int(), samples: z.array(z.string()) }).strict()),
    moreTags: z.boolean(),
    /** per-tag-files: each file with its tag, its rows and its first and last time as written */
    files: z.array(
      z
        .object({
          name: z.string(),
          tag: z.string(),
          rows: z.number().int(),
          bytes: z.number().int(),
          firstTime: z.string(),
          lastTime: z.string(),
          hasQuality: z.boolean(),
        })
        .strict(),
    ),
    headers: z.array(z.string()),
    /** per column, the units row's text under its name ('' where none); empty when the file has no units row */
    units: z.array(z.string()),
    /** lines above the header (export notes, the query's time range) */
    titleLines: z.array(z.string()),
    /** XLSX: every sheet of the workbook and the one read (choose another with POST /api/imports/:id/sheet) */
    sheets: z.array(z.string()),
    sheet: z.string().nullable(),
    /** the file's first rows, as text */
    sampleRows: z.array(z.array(z.string())),
    guess: z
      .object({
        columns: z.array(
          z
            .object({
              header: z.string(),
              index: z.number().int(),
              quantity: guessedQuantity.nullable(),
              unit: z.string().nullable(),
              /** 0 to 1 */
              confidence: z.number(),
              note: z.string().optional(),
            })
            .strict(),
        ),
        mapping: storedMapping,
        complete: z.boolean(),
        problems: z.array(z.string()),
      })
      .strict(),
    proposedMapping: storedMapping,
    mappingSource: z.enum(['saved', 'guessed']),
  })
  .strict();
export type UploadResponse = z.infer<typeof uploadResponse>;

export const chooseSheetBody = z.object({ sheet: z.string().trim().min(1, 'choose a sheet').max(31, 'sheet names are at most 31 characters') }).strict();
