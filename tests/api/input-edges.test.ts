/**
 * Input at the edges that must be refused or kept as typed: control characters in names, event dates outside
 * any plausible record, a client group named twice, upload file names in UTF-8, two changes colliding.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import { Membership } from '../../backend/src/entities/membership.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { makeTempDir, writeCsvLines } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { importView as importViewSchema } from '../../shared/schemas/imports.js';

let t: TestApp;
let tenant: TenantFixture;
let analyst: TestAgent;
let admin: TestAgent;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;

beforeAll(async () => {
  tmp = await makeTempDir();
  t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
  tenant = await createTenant(t.dataSource, 'edges');
  analyst = await signedInAgent(t.app, tenant.users.analyst.email);
  admin = await signedInAgent(t.app, tenant.users.admin.email);
});
afterAll(async () => {
  await t?.close();
  await tmp?.cleanup();
});

describe('control characters in text', () => {
  it('a plant name holding a NUL is refused with a message naming the field, and nothing is stored', async () => {
    const before = await t.dataSource.getRepository(Plant).countBy({ organisationId: tenant.organisation.id });
    const res = await analyst.post('/api/plants').set(CSRF).send({ name: 'Plant\u0000B', timeZone: 'America/Chicago' });
    expect(res.status).toBe(400);
    expect(res.body.details.fieldErrors).toEqual([{ path: 'name', message: expect.stringMatching(/control character/) }]);
    expect(await t.dataSource.getRepository(Plant).countBy({ organisationId: tenant.organisation.id })).toBe(before);
  });

  it('notes keep their line breaks and tabs', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const res = await analyst
      .post(`/api/units/${unit.id}/events`)
      .set(CSRF)
      .send({ kind: 'other', startDate: '2026-01-05', notes: 'line one\n\tline two\r\n' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });
});

describe('event dates', () => {
  it('a date outside 1900–2200 is refused: no condenser record reaches back to year 0 or ahead to 9999', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    for (const [startDate, endDate] of [
      ['0000-01-01', null],
      ['2026-01-01', '9999-12-31'],
      ['1899-12-31', null],
    ] as const) {
      const res = await analyst
        .post(`/api/units/${unit.id}/events`)
        .set(CSRF)
        .send({ kind: 'outage', startDate, endDate: endDate ?? '2026-02-01' });
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body.details.fieldErrors)).toMatch(/1900.*2200/);
    }
    expect((await analyst.get(`/api/units/${unit.id}/events`).expect(200)).body.events).toEqual([]);
  });
});

describe('a client group named twice in a limit', () => {
  it('is stored once', async () => {
    const member = await addMember(t.dataSource, tenant.organisation.id, await createUser(t.dataSource, 'twice'), 'viewer', [tenant.groups[0].id]);
    await admin
      .patch(`/api/members/${member.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [tenant.groups[1].id, tenant.groups[1].id] })
      .expect(204);
    expect((await t.dataSource.getRepository(Membership).findOneByOrFail({ id: member.id })).clientGroupIds).toEqual([tenant.groups[1].id]);
  });
});

describe('an import whose stored JSON does not fit its schema', () => {
  it('answers with the shared import shape: unknown counts read as none, malformed errors as no errors', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const file = await writeCsvLines(tmp.file('odd.csv'), ['Timestamp,Gross MW', '2026-01-01 00:00,300']);
    const up = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', file).expect(201);
    await t.dataSource.query('UPDATE data_import SET counts = ?, errors = ? WHERE id = ?', [
      JSON.stringify({ bogus: 1 }),
      JSON.stringify('not a list'),
      up.body.import.id,
    ]);
    const res = await analyst.get(`/api/imports/${up.body.import.id}`).expect(200);
    const parsed = importViewSchema.safeParse(res.body);
    expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
    expect(res.body.counts).toBeNull();
    expect(res.body.errors).toEqual([]);
  });
});

describe('upload file names', () => {
  it('keep their accents and symbols as the person named the file (UTF-8, not Latin-1)', async () => {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const file = await writeCsvLines(tmp.file('source.csv'), ['Timestamp,Gross MW', '2026-01-01 00:00,300']);
    const up = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', file, 'Kühlwasser Südblock °C.csv');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    expect((await t.dataSource.getRepository(DataImport).findOneByOrFail({ id: up.body.import.id })).fileName).toBe('Kühlwasser Südblock °C.csv');
  });
});
