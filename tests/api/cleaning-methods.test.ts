import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTION_TEXT, GENERAL_CAUTION, TYPICAL_CLEANING_METHODS } from '../../shared/schemas/cleaning-method.js';
import { CSRF, uniqueEmail } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('the cleaning-method library', () => {
  let t: TestApp;
  let admin: ReturnType<typeof request.agent>;
  beforeAll(async () => {
    t = await createTestApp();
    admin = request.agent(t.app);
    const email = uniqueEmail('lib');
    await admin
      .post('/api/sign-up')
      .set(CSRF)
      .send({ name: 'Lib Admin', email, password: 'tube bundles need cleaning', organisationName: 'Library Test Power' })
      .expect(201);
    // Sign-up answers alike for new and known addresses, so it starts no session: the new account signs in.
    await admin.post('/api/session').set(CSRF).send({ email, password: 'tube bundles need cleaning' }).expect(200);
  });
  afterAll(async () => t?.close());

  it('starts a new organisation with the typical methods, marked typical, each with its cautions', async () => {
    const res = await admin.get('/api/cleaning-methods').expect(200);
    expect(res.body.methods.map((m: { id: string }) => m.id).sort()).toEqual(TYPICAL_CLEANING_METHODS.map((m) => m.id).sort());
    for (const m of res.body.methods) {
      expect(m.typical).toBe(true);
      expect(m.cautionTexts[0]).toBe(GENERAL_CAUTION);
    }
    const lancing = res.body.methods.find((m: { id: string }) => m.id === 'hp-water-lancing');
    expect(lancing.cautionTexts).toContain(CAUTION_TEXT['water-jetting']);
    expect(lancing.cautionTexts).toContain(CAUTION_TEXT['confined-space']);
  });

  it('takes the plant’s own figures in place of the typical ones', async () => {
    const list = (await admin.get('/api/cleaning-methods')).body.methods;
    const lancing = list.find((m: { id: string }) => m.id === 'hp-water-lancing');
    const { recordId, cautionTexts: _c, ...method } = lancing;
    const res = await admin
      .put(`/api/cleaning-methods/${recordId}`)
      .set(CSRF)
      .send({ ...method, fixedCost: 142_500, recoveredCleanliness: 0.91, typical: false })
      .expect(200);
    expect(res.body).toMatchObject({ fixedCost: 142500, recoveredCleanliness: 0.91, typical: false });
    const audit = (await admin.get('/api/audit-events?entityType=cleaning-method').expect(200)).body.events;
    expect(audit[0].action).toBe('cleaning-method.updated');
  });

  it('refuses a derate method without a derate, with the field named', async () => {
    const res = await admin
      .post('/api/cleaning-methods')
      .set(CSRF)
      .send({ ...TYPICAL_CLEANING_METHODS[0], id: 'bad-derate', unitDuringCleaning: 'derate', deratePct: 0 });
    expect(res.status).toBe(400);
    expect(res.body.details.fieldErrors).toEqual([expect.objectContaining({ path: 'deratePct' })]);
  });
});
