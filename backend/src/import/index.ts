/**
 * The historian-import library. How a route (or the seed) uses it:
 *
 *   const table = await openTable(path);                        // headers + sample rows for the mapping screen
 *   const guess = guessMapping(table.headers, table.sampleRows, { timeZone: plant.timeZone });
 *   await table.close();
 *   // … the user corrects guess.mapping; it is saved per unit …
 *   const check = await checkImportFile(path, { mapping });     // pass 1: no writes
 *   if (!check.ok) return { fileError: check.fileError, errors: check.errors, report: formatRowErrorReportCsv(check.errors, check.errorsNotListed) };
 *   const summary = await importSamples(path, {                 // pass 2: batches in time order
 *     mapping, fileOrder: check.order, steadiness: { ratingMw: unit.ratingMw },
 *     onBatch: (samples) => repository.insertSamples(importId, samples),
 *   });
 */
export { guessMapping, normaliseHeader, type ColumnGuess, type MappingGuess, type GuessOptions } from './column-mapping.js';
export { openCsvTable, detectDelimiter } from './read-csv.js';
export { openXlsxTable } from './read-xlsx.js';
export { openTable, detectTableKind, type TableKind } from './open-table.js';
export type { RawRow, RawTable } from './raw-table.js';
export {
  checkImportFile,
  checkAndImportSamples,
  importSamples,
  type CheckedImport,
  type ImportCheck,
  type ImportSample,
  type ImportSummary,
  type ImportSamplesOptions,
  type ImportFileOptions,
  type SteadinessSettings,
  type SampleValidity,
  type FileOrder,
} from './parse-rows.js';
export { ImportFileError, formatRowErrorReportCsv, neutraliseCell, type RowError, type ImportFileErrorCode } from './import-errors.js';
