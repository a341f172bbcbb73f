/**
 * Historian exports as plants write them, through the HTTP API: status words and quality flags, an
 * organisation's own status words (administrators edit them), and — in the later describes — the other
 * shapes of file. Every shape must store the same samples as the wide file of the same data.
 */
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import ExcelJS from 'exceljs';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { buildZip } from '../helpers/zip-builder.js';
import { DEMO_SHAPE_MAPPINGS, DEMO_TAGS, writeDemoPerTagCsvs, writeDemoWideCsv } from '../../backend/src/seed/demo-data/demo-historian-shapes.js';
import type { DemoHour } from '../../backend/src/seed/demo-data/generate-demo-data.js';
import { csvLines, makeTempDir, physicalHistory, US_HEADERS, US_MAPPING, writeCsvLines, type HistorianRow } from '../helpers/historian-files.js';

const START_UTC = Date.UTC(2024, 5, 3, 0, 0);

interface StoredRow {
  ts: Date;
  loadMw: number | null;
  backpressureKpa: number | null;
  cwInletC: number | null;
  cwOutletC: number | null;
  cwFlowM3s: number | null;
  validity: string;
}

describe('historian shapes through the API', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let analyst: TestAgent;
  let admin: TestAgent;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'shapes');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    admin = await signedInAgent(t.app, tenant.users.admin.email);
  });
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  const newUnit = async (): Promise<GeneratingUnit> => createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id, null));
  const drain = () => drainJobs(t.dataSource, JOB_HANDLERS);
  const day = (hours = 48): HistorianRow[] => physicalHistory({ startUtc: START_UTC, hours, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });

  async function importFile(unitId: string, filePath: string, mapping?: unknown) {
    const up = await analyst.post(`/api/units/${unitId}/uploads`).set(CSRF).attach('file', filePath);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const started = await analyst
      .post(`/api/imports/${up.body.import.id}/start`)
      .set(CSRF)
      .send({ mapping: mapping ?? up.body.proposedMapping });
    expect(started.status, JSON.stringify(started.body)).toBe(202);
    await drain();
    return { upload: up.body, imp: (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body };
  }

  const samplesOf = (unitId: string): Promise<StoredRow[]> =>
    t.dataSource.query(
      'SELECT timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s, validity FROM performance_sample WHERE unitId = ? ORDER BY timestampUtc',
      [unitId],
    );

  describe('status words', () => {
    it('stores a marked row as instrument-status with its readings empty and counts it per word; the recompute leaves it out', async () => {
      const unit = await newUnit();
      const rows = day();
      rows[5]!.cells[2] = 'Bad';
      rows[9]!.cells[1] = ' no data ';
      rows[30]!.cells[3] = 'Comm Failure';
      const file = await writeCsvLines(tmp.file('markers.csv'), csvLines(rows));
      const { imp } = await importFile(unit.id, file, US_MAPPING);
      expect(imp.status, imp.message).toBe('complete');
      expect(imp.counts).toMatchObject({
        rowsRead: 48,
        stored: 48,
        rowsByReason: { 'instrument-status': 3 },
        rowsByMarker: { Bad: 1, 'No Data': 1, 'Comm Failure': 1 },
      });
      const stored = await samplesOf(unit.id);
      expect(stored).toHaveLength(48);
      expect(stored.filter((s) => s.validity === 'instrument-status').map((s) => new Date(s.ts).getTime())).toEqual(
        [5, 9, 30].map((h) => START_UTC + h * 3_600_000),
      );
      expect(stored[5]).toMatchObject({ backpressureKpa: null, validity: 'instrument-status' });
      expect(stored[9]).toMatchObject({ loadMw: null });
      expect(stored[5]!.loadMw).toBeCloseTo(rows[5]!.loadMw, 3);
    });

    it('refuses a file with other text in a number cell and stores nothing', async () => {
      const unit = await newUnit();
      const rows = day(10);
      rows[4]!.cells[2] = 'Bad reading at 04:00';
      const { imp } = await importFile(unit.id, await writeCsvLines(tmp.file('phrase.csv'), csvLines(rows)), US_MAPPING);
      expect(imp.status).toBe('rejected');
      expect(imp.errors).toEqual([{ row: 6, column: 'BP inHgA', value: 'Bad reading at 04:00', message: 'not a number' }]);
      expect(await samplesOf(unit.id)).toEqual([]);
    });

    it("uses the organisation's own words, which only an administrator may change", async () => {
      const before = await analyst.get('/api/organisation/historian-status-words').expect(200);
      expect(before.body.defaults).toContain('Bad Quality');
      expect(before.body).toMatchObject({ words: [], mayEdit: false });
      expect((await admin.get('/api/organisation/historian-status-words').expect(200)).body.mayEdit).toBe(true);
      await analyst
        .put('/api/organisation/historian-status-words')
        .set(CSRF)
        .send({ words: ['I/O Timeout'] })
        .expect(403);
      const bad = await admin
        .put('/api/organisation/historian-status-words')
        .set(CSRF)
        .send({ words: ['42'] });
      expect(bad.status).toBe(400);
      const set = await admin
        .put('/api/organisation/historian-status-words')
        .set(CSRF)
        .send({ words: ['I/O Timeout', 'Scan Off'] });
      expect(set.status, JSON.stringify(set.body)).toBe(200);
      expect(set.body.words).toEqual(['I/O Timeout', 'Scan Off']);

      const unit = await newUnit();
      const rows = day(10);
      rows[2]!.cells[4] = 'i/o timeout';
      const { imp } = await importFile(unit.id, await writeCsvLines(tmp.file('own-word.csv'), csvLines(rows)), US_MAPPING);
      expect(imp.status, imp.message).toBe('complete');
      expect(imp.counts.rowsByMarker).toEqual({ 'I/O Timeout': 1 });
      await admin.put('/api/organisation/historian-status-words').set(CSRF).send({ words: [] }).expect(200);
    });
  });

  describe('header shapes', () => {
    it('answers the units row and the title lines of an upload, and proposes the units', async () => {
      const unit = await newUnit();
      const rows = day(6);
      const lines = [
        'Unit 2 condenser export',
        `Range,${new Date(START_UTC).toISOString()},${new Date(START_UTC + 6 * 3_600_000).toISOString()}`,
        'Timestamp,Gross,BP,CW In Temp,CW Out Temp,CW Flow',
        ',MW,inHgA,F,F,gpm',
        ...rows.map((r) => r.cells.join(',')),
      ];
      const up = await analyst
        .post(`/api/units/${unit.id}/uploads`)
        .set(CSRF)
        .attach('file', await writeCsvLines(tmp.file('two-row.csv'), lines));
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      expect(up.body.units).toEqual(['', 'MW', 'inHgA', 'F', 'F', 'gpm']);
      expect(up.body.titleLines).toHaveLength(2);
      expect(up.body.proposedMapping.columns).toMatchObject({
        backpressure: { column: 'BP (inHgA)', unit: 'inHg' },
        cwFlow: { column: 'CW Flow (gpm)', unit: 'gpm' },
      });
      expect(up.body.sheets).toEqual([]);
    });

    it('lets the person choose the sheet of a workbook, and imports that sheet', async () => {
      const unit = await newUnit();
      const rows = day(12);
      const file = tmp.file('sheets.xlsx');
      const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: file, useStyles: false, useSharedStrings: true });
      const notes = wb.addWorksheet('About');
      notes.addRow(['Exported for the condenser review']).commit();
      notes.commit();
      const data = wb.addWorksheet('Hourly');
      data.addRow([...US_HEADERS]).commit();
      for (const r of rows) data.addRow(r.cells.map((c, k) => (k === 0 ? c : Number(c)))).commit();
      data.commit();
      await wb.commit();

      const up = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', file);
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      expect(up.body).toMatchObject({ sheets: ['About', 'Hourly'], sheet: 'Hourly', headers: [...US_HEADERS] });
      expect(up.body.proposedMapping.sheet).toBe('Hourly');
      // the notes sheet is no table; the data sheet chosen again answers its columns
      const aboutSheet = await analyst.post(`/api/imports/${up.body.import.id}/sheet`).set(CSRF).send({ sheet: 'About' });
      expect(aboutSheet.status).toBe(400);
      expect(aboutSheet.body.error).toMatch(/no header row/);
      const missing = await analyst.post(`/api/imports/${up.body.import.id}/sheet`).set(CSRF).send({ sheet: 'Daily' });
      expect(missing.body.error).toMatch(/no sheet named "Daily"; its sheets are "About", "Hourly"/);
      const again = await analyst.post(`/api/imports/${up.body.import.id}/sheet`).set(CSRF).send({ sheet: 'Hourly' });
      expect(again.status, JSON.stringify(again.body)).toBe(200);
      const started = await analyst
        .post(`/api/imports/${up.body.import.id}/start`)
        .set(CSRF)
        .send({ mapping: { ...US_MAPPING, sheet: 'Hourly' } });
      expect(started.status, JSON.stringify(started.body)).toBe(202);
      await drain();
      const imp = (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
      expect(imp.status, imp.message).toBe('complete');
      expect(imp.counts.stored).toBe(12);
    });
  });

  describe('a tall file', () => {
    const TAGS = ['U1:GEN_MW', 'U1:COND_BP', 'U1:CWIT', 'U1:CWOT', 'U1:CWFLOW'];
    /** One row per tag per hour, tag by tag, each tag's times off the hour by up to ±90 s, quality Good. */
    const tallOf = (rows: HistorianRow[]) => {
      const out = ['Tag Name,Time Stamp,Value,Quality'];
      TAGS.forEach((tag, k) =>
        rows.forEach((r, h) =>
          out.push([tag, new Date(r.timestampUtc + (((h * 5 + k * 11) % 19) - 9) * 10_000).toISOString(), r.cells[k + 1], 'Good'].join(',')),
        ),
      );
      return out;
    };

    const mapping = {
      timestamp: { column: 'Time Stamp', format: 'iso-8601-offset' },
      columns: Object.fromEntries(Object.entries(US_MAPPING.columns).map(([q, ref], k) => [q, { column: TAGS[k], unit: ref!.unit }])),
      quality: { column: 'Quality', goodValues: ['Good'] },
      tall: { tagColumn: 'Tag Name', valueColumn: 'Value', gridMinutes: 60, rule: 'nearest', toleranceMinutes: 5 },
    };

    it('lists its tags, takes a tag mapping with a grid, and stores the same samples as the wide file of the same data', async () => {
      const rows = day(48);
      rows[7]!.cells[2] = 'Bad';
      const wideUnit = await newUnit();
      const wide = await importFile(wideUnit.id, await writeCsvLines(tmp.file('same-wide.csv'), csvLines(rows)), US_MAPPING);
      expect(wide.imp.status, wide.imp.message).toBe('complete');

      const unit = await newUnit();
      const up = await analyst
        .post(`/api/units/${unit.id}/uploads`)
        .set(CSRF)
        .attach('file', await writeCsvLines(tmp.file('same-tall.csv'), tallOf(rows)));
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      expect(up.body.shape).toBe('tall');
      expect(up.body.tags.map((t: { name: string; rows: number }) => [t.name, t.rows])).toEqual(TAGS.map((t) => [t, 48]));
      expect(up.body.proposedMapping.tall).toMatchObject({ tagColumn: 'Tag Name', valueColumn: 'Value', gridMinutes: 60, rule: 'nearest' });
      const started = await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping });
      expect(started.status, JSON.stringify(started.body)).toBe(202);
      await drain();
      const imp = (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
      expect(imp.status, imp.message).toBe('complete');
      expect(imp.counts).toMatchObject({ stored: 48, rowsByMarker: { Bad: 1 }, alignment: { gridTimes: 48, aligned: 48, leftOutByTag: {} } });
      const strip = (xs: StoredRow[]) => xs.map(({ ts, ...v }) => ({ t: new Date(ts).getTime(), ...v }));
      expect(strip(await samplesOf(unit.id))).toEqual(strip(await samplesOf(wideUnit.id)));
      // the mapping is kept for the unit's next tall file
      const again = await analyst
        .post(`/api/units/${unit.id}/uploads`)
        .set(CSRF)
        .attach('file', await writeCsvLines(tmp.file('same-tall-2.csv'), tallOf(rows)));
      expect(again.body.mappingSource).toBe('saved');
    });

    it('refuses a truly wrong tall file and stores nothing', async () => {
      const unit = await newUnit();
      const lines = tallOf(day(6));
      lines[4] = lines[4]!.replace(/,[^,]*,Good$/, ',1.2.3,Good');
      const up = await analyst
        .post(`/api/units/${unit.id}/uploads`)
        .set(CSRF)
        .attach('file', await writeCsvLines(tmp.file('wrong-tall.csv'), lines));
      await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping }).expect(202);
      await drain();
      const imp = (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
      expect(imp.status).toBe('rejected');
      expect(imp.errors).toEqual([{ row: 5, column: 'Value', value: '1.2.3', message: 'not a number' }]);
      expect(await samplesOf(unit.id)).toEqual([]);
    });
  });
  describe('files of one tag each', () => {
    /** Fictional steady hours of the demo generator's shapes (the generator writes each tag's times off the hour). */
    const HOURS: DemoHour[] = Array.from({ length: 36 }, (_, h) => ({
      timestampUtc: START_UTC + h * 3_600_000,
      loadMw: 480 + 10 * Math.sin((2 * Math.PI * h) / 24),
      backpressureKpa: 6.8 + 0.2 * Math.sin((2 * Math.PI * h) / 24),
      cwInletC: 24 + Math.sin(h / 50),
      cwOutletC: 32 + Math.sin(h / 50),
      cwFlowM3s: 12,
      hotwellC: 38,
      dissolvedOxygenPpb: 7,
      airRemovalKgS: 0.002,
      barometerKpa: 101,
      truth: { cleanliness: 0.85, effectiveCleanliness: 0.85, dutyMw: 400, cwFlowM3s: 12, backpressureKpa: 6.8, offline: false, airLeak: false, fault: null },
    }));
    const uploadDir = () => tmp.file('uploads');
    let set = 0;
    const tagFiles = async (hours = HOURS) => writeDemoPerTagCsvs(hours, tmp.file(`per-tag-${++set}`));
    const importsOf = async (unitId: string): Promise<number> =>
      Number((await t.dataSource.query('SELECT COUNT(*) AS n FROM data_import WHERE unitId = ?', [unitId]))[0].n);
    const uploadMany = (unitId: string, files: (string | { name: string; data: Buffer })[]) => {
      let req = analyst.post(`/api/units/${unitId}/uploads`).set(CSRF);
      for (const f of files) req = typeof f === 'string' ? req.attach('file', f) : req.attach('file', f.data, f.name);
      return req;
    };
    /** A refused upload: the status and message, nothing new left in the upload folder, no import recorded. */
    async function refused(unitId: string, files: Parameters<typeof uploadMany>[1], status: number, message: RegExp | string) {
      const before = await readdir(uploadDir());
      const res = await uploadMany(unitId, files);
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      const said = (res.body as { error?: string }).error ?? JSON.stringify(res.body);
      if (typeof message === 'string') expect(said).toBe(message);
      else expect(said).toMatch(message);
      expect(await readdir(uploadDir())).toEqual(before);
      expect(await importsOf(unitId)).toBe(0);
    }
    const zipOf = async (files: string[]) =>
      buildZip(await Promise.all(files.map(async (f) => ({ name: `export/${path.basename(f)}`, data: await readFile(f) }))));

    it('takes several files, lists each with its tag, and stores the same samples as the wide file of the same data', async () => {
      const wideUnit = await newUnit();
      const wide = await importFile(wideUnit.id, await writeDemoWideCsv(HOURS, tmp.file('demo-wide.csv')), DEMO_SHAPE_MAPPINGS.wide);
      expect(wide.imp.status, wide.imp.message).toBe('complete');

      const unit = await newUnit();
      const before = await readdir(uploadDir());
      const up = await uploadMany(unit.id, await tagFiles());
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      expect(up.body.shape).toBe('per-tag-files');
      expect(up.body.files.map((f: { name: string; tag: string; rows: number }) => [f.name, f.tag, f.rows])).toEqual(DEMO_TAGS.map((t) => [`${t}.csv`, t, 36]));
      expect(up.body.files[0].firstTime).toBe('2024-06-02T23:59:30Z');
      expect(up.body.headers).toEqual(['Timestamp', 'Tag', 'Value']);
      expect(up.body.tags.map((x: { name: string }) => x.name)).toEqual([...DEMO_TAGS]);
      expect(up.body.proposedMapping.tall).toMatchObject({ tagColumn: 'Tag', valueColumn: 'Value', gridMinutes: 60 });
      expect(up.body.import).toMatchObject({ fileKind: 'per-tag', fileName: `5 files: ${DEMO_TAGS.map((x) => `${x}.csv`).join(', ')}` });
      const started = await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: DEMO_SHAPE_MAPPINGS.perTag });
      expect(started.status, JSON.stringify(started.body)).toBe(202);
      await drain();
      const imp = (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
      expect(imp.status, imp.message).toBe('complete');
      expect(imp.counts).toMatchObject({ stored: 36, alignment: { gridTimes: 36, aligned: 36 } });
      const strip = (xs: StoredRow[]) => xs.map(({ ts, ...v }) => ({ t: new Date(ts).getTime(), ...v }));
      expect(strip(await samplesOf(unit.id))).toEqual(strip(await samplesOf(wideUnit.id)));
      // the folder of files is gone once imported
      expect(await readdir(uploadDir())).toEqual(before);
      // the tag mapping is kept for the unit's next set of files; undoing it removes its folder
      const again = await uploadMany(unit.id, await tagFiles());
      expect(again.body.mappingSource).toBe('saved');
      expect((await readdir(uploadDir())).length).toBe(before.length + 1);
      await analyst.delete(`/api/imports/${again.body.import.id}`).set(CSRF).expect(200);
      expect(await readdir(uploadDir())).toEqual(before);
    });

    it('takes a ZIP of the files and stores the same samples', async () => {
      const wideUnit = await newUnit();
      await importFile(wideUnit.id, await writeDemoWideCsv(HOURS, tmp.file('demo-wide-2.csv')), DEMO_SHAPE_MAPPINGS.wide);
      const unit = await newUnit();
      const up = await uploadMany(unit.id, [{ name: 'tags.zip', data: await zipOf(await tagFiles()) }]);
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      expect(up.body.shape).toBe('per-tag-files');
      expect(up.body.import).toMatchObject({ fileName: 'tags.zip', fileKind: 'per-tag' });
      await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: DEMO_SHAPE_MAPPINGS.perTag }).expect(202);
      await drain();
      const imp = (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
      expect(imp.status, imp.message).toBe('complete');
      expect((await samplesOf(unit.id)).length).toBe(36);
      expect(await samplesOf(unit.id)).toEqual(await samplesOf(wideUnit.id));
    });

    it('refuses a tag mapped to two quantities, and a wide mapping of the files, before anything is stored', async () => {
      const unit = await newUnit();
      const up = await uploadMany(unit.id, await tagFiles());
      const twice = structuredClone(DEMO_SHAPE_MAPPINGS.perTag) as { columns: Record<string, { column: string; unit: string }> };
      twice.columns.cwOutletTemperature = { column: DEMO_TAGS[2], unit: 'degF' };
      const res = await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: twice });
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body)).toContain(`column \\"${DEMO_TAGS[2]}\\" is already mapped to cwInletTemperature`);
      const { tall: _tall, ...wide } = DEMO_SHAPE_MAPPINGS.perTag;
      const res2 = await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: wide });
      expect(res2.status).toBe(400);
      expect(res2.body.error).toMatch(/mapped tag by tag/);
      expect((await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body.status).toBe('mapping');
      expect(await samplesOf(unit.id)).toEqual([]);
    });

    it('rejects files whose times do not overlap, storing nothing', async () => {
      const unit = await newUnit();
      const files = await tagFiles();
      const later = await writeDemoPerTagCsvs(
        HOURS.map((h) => ({ ...h, timestampUtc: h.timestampUtc + 90 * 86_400_000 })),
        tmp.file(`per-tag-later-${++set}`),
      );
      files[4] = later[4]!;
      const before = await readdir(uploadDir());
      const up = await uploadMany(unit.id, files);
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: DEMO_SHAPE_MAPPINGS.perTag }).expect(202);
      await drain();
      const imp = (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
      expect(imp.status).toBe('rejected');
      expect(imp.errors.map((e: { message: string }) => e.message)).toContainEqual(
        expect.stringMatching(new RegExp(`^the times of "${DEMO_TAGS[4]}.csv" \\(2024-09-01T00:00:38Z to .* do not overlap those of "${DEMO_TAGS[0]}.csv"`)),
      );
      expect(await samplesOf(unit.id)).toEqual([]);
      expect(await readdir(uploadDir())).toEqual(before);
    });

    it('refuses at the upload, leaving nothing: a tag in two files, a file that is no tag series, an empty file, a ZIP among files', async () => {
      const unit = await newUnit();
      const files = await tagFiles();
      await refused(unit.id, [...files, { name: 'copy.csv', data: await readFile(files[0]!) }], 400, /^Tag "U1.GEN.MW" is in two files/);
      const wide = await writeDemoWideCsv(HOURS, tmp.file('wide-among.csv'));
      await refused(unit.id, [...files.slice(0, 2), wide], 400, /^"wide-among.csv" is not the series of one tag .*\(nothing was stored\)$/);
      await refused(unit.id, [files[0]!, { name: 'empty.csv', data: Buffer.alloc(0) }], 400, '"empty.csv" is empty (0 bytes): nothing was stored');
      const zip = { name: 'inner.zip', data: await zipOf(files.slice(0, 2)) };
      await refused(unit.id, [files[0]!, zip], 400, '"inner.zip" is a ZIP: upload a ZIP on its own, or the files in it (nothing was stored)');
      const many = Array.from({ length: 21 }, (_, k) => ({ name: `t${k}.csv`, data: Buffer.from(`Time,T${k}\n2024-06-03T00:00:00Z,1\n`) }));
      await refused(unit.id, many, 400, 'Upload one file, or at most 20 files of one tag each together');
    });

    it('refuses hostile ZIPs, leaving nothing: a bomb, a nested ZIP, a lying size, too many files', async () => {
      const unit = await newUnit();
      const csv = 'Time,T1\r\n2024-06-03T00:00:00Z,1\r\n';
      // a directory stating 600 MB unpacked is refused before a byte is inflated (the inflating count: the lying size below)
      const bomb = buildZip([{ name: 'bomb.csv', data: Buffer.alloc(64 * 1024, 0x31), statedBytes: 600 * 1024 * 1024 }]);
      await refused(unit.id, [{ name: 'bomb.zip', data: bomb }], 413, /^The files in the ZIP come to 600 MB unpacked; at most 512 MB/);
      const liar = buildZip([{ name: 'liar.csv', data: Buffer.alloc(5 * 1024 * 1024, 0x31), statedBytes: 10 }]);
      await refused(unit.id, [{ name: 'liar.zip', data: liar }], 400, /"liar.csv" in the ZIP holds more than its stated size/);
      const nested = buildZip([
        { name: 'a.csv', data: csv },
        { name: 'more.zip', data: buildZip([{ name: 'b.csv', data: csv }]) },
      ]);
      await refused(unit.id, [{ name: 'nested.zip', data: nested }], 400, /"more.zip" is an archive or workbook inside the ZIP/);
      const many = buildZip(Array.from({ length: 21 }, (_, k) => ({ name: `t${k}.csv`, data: csv })));
      await refused(unit.id, [{ name: 'many.zip', data: many }], 400, /^The ZIP holds 21 files; at most 20/);
      await refused(unit.id, [{ name: 'cut.zip', data: bomb.subarray(0, 100) }], 400, /^The ZIP file is damaged/);
    });

    it('writes a ZIP entry named ../ only as a numbered file in the upload folder', async () => {
      const unit = await newUnit();
      const files = await tagFiles(HOURS.slice(0, 4));
      const zip = buildZip(
        await Promise.all(files.map(async (f, k) => ({ name: k === 0 ? '../../../escaped.csv' : `/abs/${path.basename(f)}`, data: await readFile(f) }))),
      );
      const before = await readdir(uploadDir());
      const up = await uploadMany(unit.id, [{ name: 'evil.zip', data: zip }]);
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      expect(up.body.files[0]).toMatchObject({ name: 'escaped.csv', tag: DEMO_TAGS[0] });
      const [folder] = (await readdir(uploadDir())).filter((f) => !before.includes(f));
      expect((await readdir(path.join(uploadDir(), folder!))).sort()).toEqual(['1.upload', '2.upload', '3.upload', '4.upload', '5.upload', 'files.json']);
      expect(await readdir(tmp.dir)).not.toContain('escaped.csv');
      await analyst.delete(`/api/imports/${up.body.import.id}`).set(CSRF).expect(200);
      expect(await readdir(uploadDir())).toEqual(before);
    });

    it("answers 404 for another organisation's import of files, and leaves it as it was", async () => {
      const unit = await newUnit();
      const up = await uploadMany(unit.id, await tagFiles(HOURS.slice(0, 4)));
      const other = await createTenant(t.dataSource, 'shapes-other');
      const outsider = await signedInAgent(t.app, other.users.analyst.email);
      await outsider.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: DEMO_SHAPE_MAPPINGS.perTag }).expect(404);
      await outsider.delete(`/api/imports/${up.body.import.id}`).set(CSRF).expect(404);
      expect((await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body.status).toBe('mapping');
      await analyst.delete(`/api/imports/${up.body.import.id}`).set(CSRF).expect(200);
    });
  });
});
