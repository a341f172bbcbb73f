/**
 * The organisation's cleaning-method library. New organisations start with the typical methods (values
 * marked typical, to be replaced by the plant's own quotes); every method carries its safety cautions.
 */
import type { DataSource, EntityManager } from 'typeorm';
import { cautionsFor, TYPICAL_CLEANING_METHODS, type CleaningMethod, type CleaningMethodView } from '@shared/schemas/cleaning-method.js';
import { CleaningMethodRecord } from '../entities/cleaning-method.entity.js';
import { AppError, notFound } from '../http/app-error.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { recordAudit } from './audit.service.js';

export function toMethod(r: CleaningMethodRecord): CleaningMethod {
  return {
    id: r.methodKey,
    name: r.name,
    fixedCost: Number(r.fixedCost),
    costPerTube: Number(r.costPerTube),
    durationDays: r.durationDays,
    unitDuringCleaning: r.unitDuringCleaning,
    deratePct: r.deratePct,
    recoveredCleanliness: r.recoveredCleanliness,
    foulingRateMultiplier: r.foulingRateMultiplier,
    cautions: r.cautions,
    typical: r.typical,
    ...(r.note ? { note: r.note } : {}),
  };
}

const view = (r: CleaningMethodRecord): CleaningMethodView => ({ recordId: r.id, ...toMethod(r), cautionTexts: cautionsFor(r) });

const columns = (m: CleaningMethod) => ({
  methodKey: m.id,
  name: m.name,
  fixedCost: m.fixedCost.toFixed(2),
  costPerTube: m.costPerTube.toFixed(2),
  durationDays: m.durationDays,
  unitDuringCleaning: m.unitDuringCleaning,
  deratePct: m.deratePct,
  recoveredCleanliness: m.recoveredCleanliness,
  foulingRateMultiplier: m.foulingRateMultiplier,
  cautions: m.cautions,
  typical: m.typical,
  note: m.note ?? null,
});

export async function seedTypicalMethods(em: EntityManager, organisationId: string): Promise<void> {
  for (const m of TYPICAL_CLEANING_METHODS) await em.getRepository(CleaningMethodRecord).save({ organisationId, ...columns(m) });
}

export async function methodsOf(em: EntityManager, organisationId: string): Promise<CleaningMethod[]> {
  return (await em.getRepository(CleaningMethodRecord).find({ where: { organisationId }, order: { name: 'ASC' } })).map(toMethod);
}

export async function listMethods(ds: DataSource, scope: TenantScope): Promise<CleaningMethodView[]> {
  return (await ds.getRepository(CleaningMethodRecord).find({ where: { organisationId: scope.organisationId }, order: { name: 'ASC' } })).map(view);
}

export async function createMethod(ds: DataSource, scope: TenantScope, m: CleaningMethod): Promise<CleaningMethodView> {
  if (await ds.getRepository(CleaningMethodRecord).existsBy({ organisationId: scope.organisationId, methodKey: m.id }))
    throw new AppError(409, `A method with the id “${m.id}” exists already`);
  return ds.transaction(async (em) => {
    const saved = await em.getRepository(CleaningMethodRecord).save({ organisationId: scope.organisationId, ...columns(m) });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'cleaning-method.created',
      entityType: 'cleaning-method',
      entityId: saved.id,
      details: { name: m.name },
    });
    return view(saved);
  });
}

export async function updateMethod(ds: DataSource, scope: TenantScope, recordId: string, m: CleaningMethod): Promise<CleaningMethodView> {
  const existing = await ds.getRepository(CleaningMethodRecord).findOneBy({ id: recordId, organisationId: scope.organisationId });
  if (!existing) throw notFound('No such cleaning method');
  const clash = await ds.getRepository(CleaningMethodRecord).findOneBy({ organisationId: scope.organisationId, methodKey: m.id });
  if (clash && clash.id !== recordId) throw new AppError(409, `A method with the id “${m.id}” exists already`);
  return ds.transaction(async (em) => {
    await em.getRepository(CleaningMethodRecord).update({ id: recordId }, columns(m));
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'cleaning-method.updated',
      entityType: 'cleaning-method',
      entityId: recordId,
      details: { from: toMethod(existing), to: m } as unknown as Record<string, unknown>,
    });
    return view(await em.getRepository(CleaningMethodRecord).findOneByOrFail({ id: recordId }));
  });
}

export async function deleteMethod(ds: DataSource, scope: TenantScope, recordId: string): Promise<void> {
  const existing = await ds.getRepository(CleaningMethodRecord).findOneBy({ id: recordId, organisationId: scope.organisationId });
  if (!existing) throw notFound('No such cleaning method');
  await ds.transaction(async (em) => {
    await em.getRepository(CleaningMethodRecord).delete({ id: recordId });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'cleaning-method.deleted',
      entityType: 'cleaning-method',
      entityId: recordId,
      details: { name: existing.name },
    });
  });
}
