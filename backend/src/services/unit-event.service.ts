import type { DataSource, EntityManager } from 'typeorm';
import type { UnitEventInput, UnitEventView } from '@shared/schemas/unit-event.js';
import { CleaningMethodRecord } from '../entities/cleaning-method.entity.js';
import { UnitEvent } from '../entities/unit-event.entity.js';
import { badRequest } from '../http/app-error.js';
import { enqueueRecompute } from '../jobs/job-queue.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { eventsOfUnitInScope, findEventInScope } from '../repositories/event.repository.js';
import { foundInScope } from '../repositories/found-in-scope.js';
import { findUnit } from '../repositories/plant.repository.js';
import { recordAudit } from './audit.service.js';

export const eventView = (e: UnitEvent): UnitEventView => ({
  id: e.id,
  unitId: e.unitId,
  kind: e.kind,
  startDate: e.startDate,
  endDate: e.endDate,
  methodId: e.methodId,
  cost: e.cost === null ? null : Number(e.cost),
  cleanlinessBefore: e.cleanlinessBefore,
  cleanlinessAfter: e.cleanlinessAfter,
  pluggedTubesAfter: e.pluggedTubesAfter,
  notes: e.notes,
  createdAt: e.createdAt.toISOString(),
});

/** Events that change derived data: a cleaning restarts the trend, plugging changes the tube count. */
const changesDerivedData = (kind: string) => kind === 'cleaning' || kind === 'tube-plugging';

/** The method must be in the organisation's own library; its row stays locked until the event is saved. */
async function assertMethodInLibrary(em: EntityManager, scope: TenantScope, methodId: string | null): Promise<void> {
  if (methodId === null) return;
  const found = await em
    .getRepository(CleaningMethodRecord)
    .createQueryBuilder('m')
    .select('m.id')
    .setLock('pessimistic_read')
    .where('m.organisationId = :org AND m.methodKey = :key', { org: scope.organisationId, key: methodId })
    .getOne();
  if (!found) {
    const message = 'Unknown cleaning method: choose one from your organisation’s library';
    throw badRequest(message, { fieldErrors: [{ path: 'methodId', message }] });
  }
}

export async function listEvents(ds: DataSource, scope: TenantScope, unitId: string): Promise<UnitEventView[]> {
  return (await foundInScope(eventsOfUnitInScope(ds.manager, scope, unitId), 'No such unit')).map(eventView);
}

export async function addEvent(ds: DataSource, scope: TenantScope, unitId: string, input: UnitEventInput): Promise<UnitEventView> {
  await foundInScope(findUnit(ds.manager, scope, unitId), 'No such unit');
  return ds.transaction(async (em) => {
    await assertMethodInLibrary(em, scope, input.methodId);
    const saved = await em.getRepository(UnitEvent).save({
      organisationId: scope.organisationId,
      unitId,
      ...input,
      cost: input.cost === null ? null : input.cost.toFixed(2),
      createdByUserId: scope.userId,
    });
    if (changesDerivedData(input.kind)) await enqueueRecompute(em, scope.organisationId, unitId, `${input.kind} recorded`);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'event.added',
      entityType: 'unit-event',
      entityId: saved.id,
      details: { kind: input.kind, startDate: input.startDate },
    });
    return eventView(saved);
  });
}

const eventInScope = (ds: DataSource, scope: TenantScope, id: string): Promise<UnitEvent> =>
  foundInScope(findEventInScope(ds.manager, scope, id), 'No such event');

export async function updateEvent(ds: DataSource, scope: TenantScope, id: string, input: UnitEventInput): Promise<UnitEventView> {
  const e = await eventInScope(ds, scope, id);
  return ds.transaction(async (em) => {
    await assertMethodInLibrary(em, scope, input.methodId);
    await em.getRepository(UnitEvent).update({ id }, { ...input, cost: input.cost === null ? null : input.cost.toFixed(2) });
    if (changesDerivedData(e.kind) || changesDerivedData(input.kind)) await enqueueRecompute(em, scope.organisationId, e.unitId, 'event changed');
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'event.updated',
      entityType: 'unit-event',
      entityId: id,
      details: { kind: input.kind },
    });
    return eventView(await em.getRepository(UnitEvent).findOneByOrFail({ id }));
  });
}

export async function deleteEvent(ds: DataSource, scope: TenantScope, id: string): Promise<void> {
  const e = await eventInScope(ds, scope, id);
  await ds.transaction(async (em) => {
    await em.getRepository(UnitEvent).delete({ id });
    if (changesDerivedData(e.kind)) await enqueueRecompute(em, scope.organisationId, e.unitId, 'event deleted');
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'event.deleted',
      entityType: 'unit-event',
      entityId: id,
      details: { kind: e.kind, startDate: e.startDate },
    });
  });
}
