/**
 * A plain tall CSV file is scanned line by line without the CSV parser (only the cells the mapping reads); it must
 * come to the same check — every error by line and column, the same aligned samples — as the parser's reading of
 * the same table (forced here by one quoted cell, which the parser reads as the bare text).
 */
import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkAnyShape } from '@backend/import/prepare-file.js';
import { plainLineEnds } from '@backend/import/read-csv.js';
import { makeTempDir, writeCsv } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

const TAGS = ['U7.MW', 'U7.BP', 'U7.CWI', 'U7.CWO', 'U7.CWF', 'U7.SPARE'];
const VALUES = ['480.5', '2.11', '75.2', '92.4', '181000', '1'];
const mapping = {
  timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
  columns: {
    grossLoad: { column: TAGS[0], unit: 'MW' },
    backpressure: { column: TAGS[1], unit: 'inHg' },
    cwInletTemperature: { column: TAGS[2], unit: 'degF' },
    cwOutletTemperature: { column: TAGS[3], unit: 'degF' },
    cwFlow: { column: TAGS[4], unit: 'gpm' },
  },
  quality: { column: 'Quality', goodValues: ['Good'] },
  tall: { tagColumn: 'Tag', valueColumn: 'Value', gridMinutes: 60, rule: 'nearest', toleranceMinutes: 5 },
};

function lines(): string[] {
  const out = ['Historian export (demo)', 'Tag,Timestamp,Value,Quality'];
  for (let h = 0; h < 30; h++)
    TAGS.forEach((tag, k) =>
      out.push([tag, new Date(Date.UTC(2025, 7, 1, h, 0, k * 7)).toISOString(), VALUES[k], h === 4 && k === 2 ? 'Bad' : 'Good'].join(',')),
    );
  out.splice(20, 0, '');
  out.splice(33, 0, 'U7.MW,2025-08-01T05:00:00Z');
  return out;
}

async function checked(file: string) {
  const { check, prepared } = await checkAnyShape(file, { mapping });
  const aligned = prepared ? await readFile(prepared.path, 'utf8') : null;
  await prepared?.dispose();
  return { errors: check.errors, dataRows: check.dataRows, assumptions: check.assumptions, aligned };
}

describe('a plain tall file scanned without the CSV parser', () => {
  it('comes to the same aligned samples as the parser, with CR LF line ends and a blank line', async () => {
    const plain = await writeCsv(
      tmp.file('plain.csv'),
      lines().filter((l) => l.split(',').length !== 2),
      '\r\n',
    );
    const all = lines().filter((l) => l.split(',').length !== 2);
    const k = all.findIndex((l) => l.startsWith('U7.BP,'));
    all[k] = all[k]!.replace(/^U7\.BP,/, '"U7.BP",');
    const quoted = await writeCsv(tmp.file('quoted.csv'), all, '\r\n');
    expect(await plainLineEnds(plain)).toBe('crlf');
    expect(await plainLineEnds(quoted)).toBeNull();
    const a = await checked(plain);
    expect(a.errors).toEqual([]);
    expect(a.aligned?.split('\n').length).toBeGreaterThan(30);
    expect(a).toEqual(await checked(quoted));
  });

  it('lists the same errors by line and column: a short row, a bad time and a bad value', async () => {
    const all = lines();
    all[8] = all[8]!.replace(/,\d{4}-[^,]*,/, ',yesterday,');
    const bad = all.findIndex((l, i) => i > 10 && l.includes(',92.4,'));
    all[bad] = all[bad]!.replace(/,92\.4,/, ',9 2,');
    expect(bad).toBe(11);
    const plain = await writeCsv(tmp.file('wrong-plain.csv'), all);
    const q = all.findIndex((l, i) => i > 40 && l.startsWith('U7.CWF,'));
    all[q] = all[q]!.replace(/^U7\.CWF,/, '"U7.CWF",');
    const quoted = await writeCsv(tmp.file('wrong-quoted.csv'), all);
    const a = await checked(plain);
    expect(a.errors.map((e) => [e.row, e.column])).toEqual([
      [9, 'Timestamp'],
      [12, 'Value'],
      [34, 'Value'],
    ]);
    expect(a).toEqual(await checked(quoted));
  });
});
