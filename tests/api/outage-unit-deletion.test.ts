/**
 * Deleting a unit or a plant that outages take off line (services/outages/outages-of-deleted-units.ts): an approved
 * outage refuses it, naming the outage, with nothing deleted; a draft outage loses the unit and its items, its other
 * items no longer need them, its proposal reads as stale and its own audit says what went. Figures invented for tests.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../backend/src/entities/audit-event.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { OutageItem } from '../../backend/src/entities/outage-item.entity.js';
import { OutageUnit } from '../../backend/src/entities/outage-unit.entity.js';
import { Outage } from '../../backend/src/entities/outage.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { createOutageRecord } from '../factories/outages.js';
import { createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

describe('deleting a unit or plant an outage takes off line', () => {
  it('a plant with a unit in an approved outage is refused with the outage named, nothing deleted', async () => {
    const tenant = await createTenant(t.dataSource, 'outage-del-plant');
    const plant = await createPlant(t.dataSource, tenant.organisation.id);
    const unit = await createUnit(t.dataSource, plant);
    const { outage } = await createOutageRecord(t.dataSource, [unit], tenant.users.admin.id, {
      status: 'approved',
      name: 'Spring outage',
      items: [{ title: 'Lance the tubes', cost: 40_000, durationDays: 3, lane: 'Waterbox A', benefit: 90_000 }],
    });
    const admin = await signedInAgent(t.app, tenant.users.admin.email);

    const res = await admin.delete(`/api/plants/${plant.id}`).set(CSRF);
    expect(res.status).toBe(409);
    expect(res.body.error ?? res.body.message).toMatch(/approved outage “Spring outage”/);
    expect(await t.dataSource.getRepository(Plant).countBy({ id: plant.id })).toBe(1);
    expect(await t.dataSource.getRepository(GeneratingUnit).countBy({ id: unit.id })).toBe(1);
    expect(await t.dataSource.getRepository(OutageUnit).countBy({ outageId: outage.id })).toBe(1);
    expect(await t.dataSource.getRepository(OutageItem).countBy({ outageId: outage.id })).toBe(1);

    // the unit alone is refused the same way
    const unitRes = await admin.delete(`/api/units/${unit.id}`).set(CSRF);
    expect(unitRes.status).toBe(409);
    expect(unitRes.body.error ?? unitRes.body.message).toMatch(/This unit cannot be deleted: the approved outage “Spring outage”/);
  });

  it('a draft outage loses the unit and its items, its proposal turns stale, and its audit says so', async () => {
    const tenant = await createTenant(t.dataSource, 'outage-del-draft');
    const plant = await createPlant(t.dataSource, tenant.organisation.id);
    const unit = await createUnit(t.dataSource, plant);
    const other = await createUnit(t.dataSource, plant);
    const { outage, items } = await createOutageRecord(t.dataSource, [unit, other], tenant.users.admin.id, {
      name: 'Autumn draft',
      items: [
        { title: 'Lance unit tubes', cost: 40_000, durationDays: 3, lane: 'Waterbox A', benefit: 90_000, unit },
        { title: 'Plug after lancing', cost: 10_000, durationDays: 1, lane: 'Waterbox B', benefit: 20_000, unit: other },
      ],
    });
    // the second item needs the first (on the unit about to go)
    await t.dataSource.getRepository(OutageItem).update({ id: items[1]!.id }, { needs: [items[0]!.id] });
    const analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    const optimised = await analyst.post(`/api/outages/${outage.id}/optimise`).set(CSRF).send({});
    expect(optimised.status).toBe(200);
    const before = await analyst.get(`/api/outages/${outage.id}`);
    expect(before.body.proposalStale).toBe(false);
    const planVersion = (await t.dataSource.getRepository(Outage).findOneByOrFail({ id: outage.id })).planVersion;

    expect((await analyst.delete(`/api/units/${unit.id}`).set(CSRF)).status).toBe(204);

    const after = await analyst.get(`/api/outages/${outage.id}`);
    expect(after.status).toBe(200);
    expect(after.body.proposalStale).toBe(true);
    expect(after.body.items.map((i: { title: string }) => i.title)).toEqual(['Plug after lancing']);
    expect(after.body.items[0].needs).toEqual([]);
    expect((await t.dataSource.getRepository(Outage).findOneByOrFail({ id: outage.id })).planVersion).toBe(planVersion + 1);

    const audit = await t.dataSource.getRepository(AuditEvent).findOneByOrFail({ entityType: 'outage', entityId: outage.id, action: 'outage.unit-removed' });
    expect(audit.details).toMatchObject({
      outage: 'Autumn draft',
      units: [{ id: unit.id, name: unit.name }],
      itemsRemoved: [{ id: items[0]!.id, title: 'Lance unit tubes' }],
      noLongerNeededBy: ['Plug after lancing'],
    });
    const unitAudit = await t.dataSource.getRepository(AuditEvent).findOneByOrFail({ entityType: 'unit', entityId: unit.id, action: 'unit.deleted' });
    expect(unitAudit.details).toMatchObject({ draftOutagesChanged: ['Autumn draft'] });
  });
});
