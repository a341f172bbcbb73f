/**
 * The two kinds of import problems (PRODUCT.md step 2): a file-level error stops the import before
 * any row is read (empty file, binary garbage, an over-long line, a mapped column missing), and
 * row errors ("the file is wrong") are all collected so the user can fix the file in one go.
 * Rows the plant produced while unsteady or non-physical are not errors: they carry a validity code.
 */

export type ImportFileErrorCode =
  | 'empty-file'
  | 'no-data-rows'
  | 'no-header-row'
  | 'line-too-long'
  | 'not-text'
  | 'malformed-csv'
  | 'not-xlsx'
  | 'unsupported-encoding'
  | 'bad-mapping'
  | 'column-not-found'
  | 'duplicate-column'
  | 'file-changed'
  | 'unreadable-file'
  | 'no-such-sheet';

/** A problem with the file as a whole; nothing is imported. */
export class ImportFileError extends Error {
  readonly code: ImportFileErrorCode;
  /** 1-based file line, when one line is to blame. */
  readonly line?: number;
  /** The message is ours; what a library said goes in `cause` (for the log), never in the message. */
  constructor(code: ImportFileErrorCode, message: string, line?: number, cause?: unknown) {
    super(message, cause === undefined ? undefined : { cause });
    this.name = 'ImportFileError';
    this.code = code;
    this.line = line;
  }
}

/** One wrong cell or row. `value` is already truncated and safe to echo into a spreadsheet. */
/** A workbook the XLSX reader cannot get through, whatever the library underneath said. */
export const NOT_A_READABLE_WORKBOOK =
  'the file is not a readable XLSX workbook: it may be damaged or cut short. Open it in your spreadsheet program, save it again as .xlsx (or as CSV) and upload that';

export interface RowError {
  /** 1-based line of the file (CSV) or row number of the sheet (XLSX). */
  row: number;
  /** Header text of the column, as in the file. */
  column: string;
  value: string;
  message: string;
}

export const ECHOED_VALUE_MAX_CHARS = 60;
export const DEFAULT_MAX_ROW_ERRORS = 10_000;

/**
 * A cell that starts with = + - @ tab or CR may run as a formula when a downloaded report is opened
 * in a spreadsheet (OWASP "CSV injection"); a leading apostrophe makes it text.
 */
export function neutraliseCell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function echoValue(raw: string): string {
  const short = raw.length > ECHOED_VALUE_MAX_CHARS ? `${raw.slice(0, ECHOED_VALUE_MAX_CHARS)}…` : raw;
  return neutraliseCell(short);
}

/** Collects row errors up to a cap and counts the rest. */
export class RowErrorList {
  readonly errors: RowError[] = [];
  notListed = 0;
  constructor(private readonly max = DEFAULT_MAX_ROW_ERRORS) {}

  add(row: number, column: string, value: string, message: string): void {
    if (this.errors.length < this.max) this.errors.push({ row, column: echoValue(column), value: echoValue(value), message });
    else this.notListed++;
  }

  get total(): number {
    return this.errors.length + this.notListed;
  }
}

const csvField = (text: string): string => {
  const safe = neutraliseCell(text);
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
};

/** The downloadable error report: one CSV line per error, every text field neutralised and quoted. */
export function formatRowErrorReportCsv(errors: readonly RowError[], notListed = 0): string {
  const lines = ['row,column,value,problem'];
  for (const e of errors) lines.push([String(e.row), csvField(e.column), csvField(e.value), csvField(e.message)].join(','));
  if (notListed > 0) lines.push(`,,,${csvField(`${notListed} more errors not listed`)}`);
  return `${lines.join('\r\n')}\r\n`;
}
