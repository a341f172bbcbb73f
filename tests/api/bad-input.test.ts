/**
 * Bad input answers 400 with a message in the product's words and changes nothing: broken text, a cut-off
 * upload, setup numbers outside what a condenser can physically be.
 */
import { readdir } from 'node:fs/promises';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { User } from '../../backend/src/entities/user.entity.js';
import { createTenant, CSRF, signedInAgent, uniqueEmail, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';
import { makeTempDir } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let tenant: TenantFixture;
let analyst: TestAgent;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;

beforeAll(async () => {
  tmp = await makeTempDir();
  t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
  tenant = await createTenant(t.dataSource, 'bad-input');
  analyst = await signedInAgent(t.app, tenant.users.analyst.email);
});
afterAll(async () => {
  await t?.close();
  await tmp?.cleanup();
});

describe('text that is not well-formed Unicode (a lone surrogate)', () => {
  it('in a plant name answers 400 naming the field, and no plant is stored', async () => {
    const before = await t.dataSource.getRepository(Plant).countBy({ organisationId: tenant.organisation.id });
    const res = await analyst
      .post('/api/plants')
      .set(CSRF)
      .set('content-type', 'application/json')
      .send('{"name":"Plant \\ud800","timeZone":"America/Chicago"}');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/character/i);
    expect(res.body.details.fieldErrors).toEqual([{ path: 'name', message: expect.stringMatching(/broken character/) }]);
    expect(await t.dataSource.getRepository(Plant).countBy({ organisationId: tenant.organisation.id })).toBe(before);
  });

  it('in a unit rename and in an event note answers 400 and leaves the unit as it was', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const rename = await analyst.patch(`/api/units/${unit.id}`).set(CSRF).send({ name: 'Unit \udc00 two' });
    expect(rename.status).toBe(400);
    expect((await t.dataSource.getRepository(GeneratingUnit).findOneByOrFail({ id: unit.id })).name).toBe(unit.name);
    const event = await analyst.post(`/api/units/${unit.id}/events`).set(CSRF).send({ kind: 'other', startDate: '2026-01-05', notes: 'a\ud83d' });
    expect(event.status).toBe(400);
    expect(event.body.details.fieldErrors[0].path).toBe('notes');
    expect((await analyst.get(`/api/units/${unit.id}/events`).expect(200)).body.events).toEqual([]);
  });

  it('in a sign-up (no session yet) answers 400 and creates no account', async () => {
    const email = uniqueEmail('surrogate');
    const res = await request(t.app)
      .post('/api/sign-up')
      .set(CSRF)
      .send({ name: '\ud800', email, password: 'a long enough password 42', organisationName: 'Org \udfff' });
    expect(res.status).toBe(400);
    expect(await t.dataSource.getRepository(User).countBy({ email })).toBe(0);
  });
});

describe('a multipart upload that is cut off before its end', () => {
  it('answers 400 with a message, keeps no import and no file', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const body = [
      '--cut',
      'Content-Disposition: form-data; name="file"; filename="history.csv"',
      'Content-Type: text/csv',
      '',
      'Timestamp,Gross MW',
      '2024-01-01T00:00Z,480',
      '2024-01-01T00:01Z,4',
    ].join('\r\n');
    const res = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).set('content-type', 'multipart/form-data; boundary=cut').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/upload .*(cut off|incomplete)/i);
    expect(await t.dataSource.getRepository(DataImport).countBy({ unitId: unit.id })).toBe(0);
    expect(await readdir(tmp.file('uploads'))).toEqual([]);
  });
});

describe('an upload that is not a readable table', () => {
  const LIBRARY_TEXT = /Cannot read|undefined|FILE_ENDED|invalid distance|Error:|errno/i;

  it.each([
    [
      'a workbook cut short',
      'cut.xlsx',
      () => Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(3000, 0x41)]),
      /not a readable XLSX workbook/,
    ],
    [
      'binary data named .csv',
      'binary.csv',
      () => {
        const b = Buffer.alloc(4096);
        let x = 11;
        for (let i = 0; i < b.length; i++) b[i] = x = (x * 1103515245 + 12345) & 0xff;
        return b;
      },
      /binary data.*not CSV text/,
    ],
  ])('%s answers 400 saying what is wrong in our words, and keeps no import and no file', async (_label, name, bytes, words) => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const res = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', bytes(), name);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(words);
    expect(res.body.error).not.toMatch(LIBRARY_TEXT);
    expect(await t.dataSource.getRepository(DataImport).countBy({ unitId: unit.id })).toBe(0);
    expect(await readdir(tmp.file('uploads'))).toEqual([]);
  });
});

describe('setup numbers outside a physical range', () => {
  const put = (unitId: string, part: string, body: object) => analyst.put(`/api/units/${unitId}/${part}`).set(CSRF).send(body);

  it.each([
    ['condenser', 'tubeCount', { ...TEST_CONDENSER, tubeCount: 100_000_000 }, /200,000/],
    ['condenser', 'surfaceM2', { ...TEST_CONDENSER, surfaceM2: 5e7 }, /m²/],
    ['condenser', 'designCwFlowM3s', { ...TEST_CONDENSER, designCwFlowM3s: 1e6 }, /m³\/s/],
    ['condenser', 'designDutyMw', { ...TEST_CONDENSER, designDutyMw: 1e7 }, /MW/],
    ['condenser', 'designBackpressureKpa', { ...TEST_CONDENSER, designBackpressureKpa: 0.001 }, /kPa/],
    ['condenser', 'pluggedTubes', { ...TEST_CONDENSER, pluggedTubes: 1e12 }, /./],
    ['turbine', 'ratingMw', { ...TEST_TURBINE, ratingMw: 1e9 }, /MW/],
    ['turbine', 'designHeatRateBtuKwh', { ...TEST_TURBINE, designHeatRateBtuKwh: 10 }, /Btu\/kWh/],
    [
      'turbine',
      'heatBalanceDuty',
      {
        ...TEST_TURBINE,
        heatBalanceDuty: [
          { loadFraction: 0.5, dutyMw: 1e9 },
          { loadFraction: 1, dutyMw: 520 },
        ],
      },
      /MW/,
    ],
    [
      'turbine',
      'correctionCurve',
      {
        ...TEST_TURBINE,
        correctionCurve: {
          basis: 'heat-rate',
          label: 'x',
          curves: [
            {
              loadFraction: 1,
              points: [
                { backpressureKpa: 1e6, changePct: 0 },
                { backpressureKpa: 2e6, changePct: 1e9 },
              ],
            },
          ],
        },
      },
      /kPa|%/,
    ],
    ['economics', 'currency', { ...TEST_ECONOMICS, currency: '$$$' }, /currency/i],
  ])('%s %s is refused with the range named, and the saved setup is unchanged', async (part, field, body, range) => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const res = await put(unit.id, part, body as object);
    expect(res.status).toBe(400);
    const issue = res.body.details.fieldErrors.find((e: { path: string }) => e.path.split('.')[0] === field);
    expect(issue?.message).toMatch(range);
    const stored = await t.dataSource.getRepository(GeneratingUnit).findOneByOrFail({ id: unit.id });
    expect(stored.setupVersion).toBe(unit.setupVersion);
    expect(stored[part as 'condenser']).toEqual(part === 'condenser' ? TEST_CONDENSER : part === 'turbine' ? TEST_TURBINE : TEST_ECONOMICS);
  });

  it('a condenser within the ranges is still saved', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    await put(unit.id, 'condenser', { ...TEST_CONDENSER, tubeCount: 60_000, surfaceM2: 56_000 }).expect(200);
  });
});

describe('event and cleaning-method numbers outside a physical range', () => {
  it('an event with 10 million plugged tubes or a cleanliness of 0.01 is refused with the range, and no event is stored', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const plugged = await analyst
      .post(`/api/units/${unit.id}/events`)
      .set(CSRF)
      .send({ kind: 'tube-plugging', startDate: '2026-01-05', pluggedTubesAfter: 10_000_000 });
    expect(plugged.status).toBe(400);
    expect(plugged.body.details.fieldErrors[0]).toEqual({ path: 'pluggedTubesAfter', message: expect.stringMatching(/between 0 and 200,000/) });
    const dirty = await analyst.post(`/api/units/${unit.id}/events`).set(CSRF).send({ kind: 'other', startDate: '2026-01-05', cleanlinessBefore: 0.01 });
    expect(dirty.status).toBe(400);
    expect(dirty.body.details.fieldErrors[0].message).toMatch(/between 0\.2 and 1\.2/);
    expect((await analyst.get(`/api/units/${unit.id}/events`).expect(200)).body.events).toEqual([]);
  });
});
