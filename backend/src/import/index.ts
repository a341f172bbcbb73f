export { guessMapping, normaliseHeader, type ColumnGuess, type MappingGuess, type GuessOptions } from './column-mapping.js';
export { openCsvTable, detectDelimiter } from './read-csv.js';
export { openXlsxTable } from './read-xlsx.js';
export { openTable, detectTableKind, type TableKind } from './open-table.js';
export type { RawRow, RawTable } from './raw-table.js';
export {
  checkImportFile,
  importSamples,
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
