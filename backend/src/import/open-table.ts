/** Opens an uploaded file as a table, CSV or XLSX by its first bytes (the upload's name may lie). */
import { open, stat } from 'node:fs/promises';
import { ImportFileError } from './import-errors.js';
import { openCsvTable, type CsvReadOptions } from './read-csv.js';
import { openXlsxTable } from './read-xlsx.js';
import type { RawTable } from './raw-table.js';

export type TableKind = 'csv' | 'xlsx';

export async function detectTableKind(filePath: string): Promise<TableKind> {
  const { size } = await stat(filePath);
  if (size === 0) throw new ImportFileError('empty-file', 'the file is empty (0 bytes)');
  const fh = await open(filePath, 'r');
  try {
    const sig = Buffer.alloc(4);
    await fh.read(sig, 0, 4, 0);
    return sig[0] === 0x50 && sig[1] === 0x4b && sig[2] === 0x03 && sig[3] === 0x04 ? 'xlsx' : 'csv';
  } finally {
    await fh.close();
  }
}

/** Every failure is an ImportFileError in our words (the readers translate theirs; this catches the rest). */
export async function openTable(filePath: string, options: CsvReadOptions & { kind?: TableKind; sheet?: string } = {}): Promise<RawTable> {
  try {
    const kind = options.kind ?? (await detectTableKind(filePath));
    return await (kind === 'xlsx' ? openXlsxTable(filePath, options) : openCsvTable(filePath, options));
  } catch (e) {
    if (e instanceof ImportFileError) throw e;
    throw new ImportFileError('unreadable-file', 'the file could not be read: upload it again', undefined, e);
  }
}
