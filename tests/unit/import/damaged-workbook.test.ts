/**
 * A damaged workbook is refused, never waited on for ever: the fixture is a two-sheet workbook (an empty notes sheet,
 * then 24 hourly rows) with 64 bytes flipped at 12 % of the file, one of the damages the upload fuzz found to leave
 * the streaming reader waiting for data that never comes.
 */
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { openXlsxTable, XLSX_STALL_MS } from '../../../backend/src/import/read-xlsx';

const FIXTURE = path.join(import.meta.dirname, 'fixtures', 'damaged-two-sheet-workbook.xlsx');

describe('a damaged workbook', () => {
  it('ends with the damaged-workbook message once the file stops being read', { timeout: XLSX_STALL_MS * 3 }, async () => {
    const started = Date.now();
    const read = (async () => {
      const table = await openXlsxTable(FIXTURE);
      let rows = 0;
      for await (const chunk of table.chunks) rows += chunk.length;
      return rows;
    })();
    await expect(read).rejects.toMatchObject({ code: 'not-xlsx', message: expect.stringMatching(/not a readable XLSX workbook/) });
    expect(Date.now() - started).toBeLessThan(XLSX_STALL_MS * 2.5);
  });
});
