import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { PlantView, UnitSummary } from '@shared/schemas/plant.js';
import type { PlantInput, unitInput } from '@shared/schemas/unit-setup.js';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Plant } from '../entities/plant.entity.js';
import { AppError, badRequest } from '../http/app-error.js';
import { seesClientGroup, type TenantScope } from '../policies/tenant-scope.js';
import { assertClientGroupsInTenant } from '../repositories/client-group.repository.js';
import { foundInScope } from '../repositories/found-in-scope.js';
import { findPlant, findUnit, plantsInScope, unitsInScope } from '../repositories/plant.repository.js';
import { recordAudit } from './audit.service.js';
import { dropDraftCasesOrRefuse, isCaseStillReferencing } from './cases/cases-of-deleted-units.js';
import { assertWithinPlanLimit } from './billing/plan-limits.js';
import { refuseApprovedOutagesOrDetach } from './outages/outages-of-deleted-units.js';
import { removeUploadFiles, uploadPathsOfUnits } from './upload-housekeeping.js';

/** A case written between the check and the delete: the foreign key refuses, answered as the check would. */
const refuseWhileCasesRemain = (what: 'unit' | 'plant') => (err: unknown) => {
  if (isCaseStillReferencing(err)) throw new AppError(409, `This ${what} cannot be deleted: a cleaning case was started on it meanwhile; try again`);
  throw err;
};

export type { PlantView };

export const unitSummary = (u: GeneratingUnit): UnitSummary => ({
  id: u.id,
  name: u.name,
  ratingMw: u.turbine?.ratingMw ?? null,
  setupComplete: !!(u.condenser && u.turbine && u.economics),
});

export async function listPlants(ds: DataSource, scope: TenantScope): Promise<PlantView[]> {
  const plants = await plantsInScope(ds.manager, scope);
  const units = await unitsInScope(ds.manager, scope);
  return plants.map((p) => ({
    id: p.id,
    name: p.name,
    timeZone: p.timeZone,
    clientGroupId: p.clientGroupId,
    units: units.filter((u) => u.plantId === p.id).map(unitSummary),
  }));
}

export async function getPlant(ds: DataSource, scope: TenantScope, id: string): Promise<PlantView> {
  const plant = await foundInScope(findPlant(ds.manager, scope, id), 'No such plant');
  const units = await unitsInScope(ds.manager, scope, plant.id);
  return { id: plant.id, name: plant.name, timeZone: plant.timeZone, clientGroupId: plant.clientGroupId, units: units.map(unitSummary) };
}

async function assertGroupUsable(ds: DataSource, scope: TenantScope, clientGroupId: string | null) {
  if (clientGroupId && !(await assertClientGroupsInTenant(ds.manager, scope.organisationId, [clientGroupId]))) throw badRequest('Unknown client group');
  if (!seesClientGroup(scope, clientGroupId)) {
    throw badRequest('Choose one of your client groups: a plant outside them would be hidden from you');
  }
}

export async function createPlant(ds: DataSource, scope: TenantScope, input: PlantInput): Promise<PlantView> {
  await assertGroupUsable(ds, scope, input.clientGroupId);
  if (await ds.getRepository(Plant).existsBy({ organisationId: scope.organisationId, name: input.name }))
    throw new AppError(409, `A plant named “${input.name}” exists already`);
  const plant = await ds.transaction(async (em) => {
    const saved = await em.getRepository(Plant).save({ organisationId: scope.organisationId, ...input });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'plant.created',
      entityType: 'plant',
      entityId: saved.id,
      details: { name: input.name },
    });
    return saved;
  });
  return { id: plant.id, name: plant.name, timeZone: plant.timeZone, clientGroupId: plant.clientGroupId, units: [] };
}

export async function updatePlant(ds: DataSource, scope: TenantScope, id: string, input: PlantInput): Promise<PlantView> {
  const plant = await foundInScope(findPlant(ds.manager, scope, id), 'No such plant');
  await assertGroupUsable(ds, scope, input.clientGroupId);
  const clash = await ds.getRepository(Plant).findOneBy({ organisationId: scope.organisationId, name: input.name });
  if (clash && clash.id !== id) throw new AppError(409, `A plant named “${input.name}” exists already`);
  await ds.transaction(async (em) => {
    await em.getRepository(Plant).update({ id, organisationId: scope.organisationId }, input);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'plant.updated',
      entityType: 'plant',
      entityId: id,
      details: { from: { name: plant.name, timeZone: plant.timeZone, clientGroupId: plant.clientGroupId }, to: input },
    });
  });
  return getPlant(ds, { ...scope, clientGroupIds: null }, id);
}

export async function deletePlant(ds: DataSource, scope: TenantScope, id: string): Promise<void> {
  const plant = await foundInScope(findPlant(ds.manager, scope, id), 'No such plant');
  let uploads: string[] = [];
  await ds
    .transaction(async (em) => {
      const units = await em
        .getRepository(GeneratingUnit)
        .find({ where: { plantId: id, organisationId: scope.organisationId }, select: { id: true, name: true } });
      const unitIds = units.map((u) => u.id);
      uploads = await uploadPathsOfUnits(em, unitIds);
      const draftCasesDeleted = await dropDraftCasesOrRefuse(em, scope.organisationId, unitIds, 'plant');
      const draftOutagesChanged = await refuseApprovedOutagesOrDetach(em, { organisationId: scope.organisationId, userId: scope.userId, units, what: 'plant' });
      await em.getRepository(Plant).delete({ id, organisationId: scope.organisationId });
      await recordAudit(em, {
        organisationId: scope.organisationId,
        userId: scope.userId,
        action: 'plant.deleted',
        entityType: 'plant',
        entityId: id,
        details: {
          name: plant.name,
          ...(draftCasesDeleted.length ? { draftCasesDeleted } : {}),
          ...(draftOutagesChanged.length ? { draftOutagesChanged } : {}),
        },
      });
    })
    .catch(refuseWhileCasesRemain('plant'));
  // committed: the files of the plant's uploads go too
  await removeUploadFiles(uploads);
}

export async function createUnit(ds: DataSource, scope: TenantScope, plantId: string, input: z.infer<typeof unitInput>) {
  const plant = await foundInScope(findPlant(ds.manager, scope, plantId), 'No such plant');
  if (await ds.getRepository(GeneratingUnit).existsBy({ plantId, name: input.name }))
    throw new AppError(409, `${plant.name} has a unit named “${input.name}” already`);
  return ds.transaction(async (em) => {
    await assertWithinPlanLimit(em, scope.organisationId, 'units');
    const unit = await em
      .getRepository(GeneratingUnit)
      .save({ organisationId: scope.organisationId, plantId, name: input.name, condenser: null, turbine: null, economics: null, savedMapping: null });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'unit.created',
      entityType: 'unit',
      entityId: unit.id,
      details: { name: input.name, plant: plant.name },
    });
    return unit;
  });
}

export async function renameUnit(ds: DataSource, scope: TenantScope, id: string, input: z.infer<typeof unitInput>) {
  const unit = await foundInScope(findUnit(ds.manager, scope, id), 'No such unit');
  const clash = await ds.getRepository(GeneratingUnit).findOneBy({ plantId: unit.plantId, name: input.name });
  if (clash && clash.id !== id) throw new AppError(409, `This plant has a unit named “${input.name}” already`);
  await ds.transaction(async (em) => {
    await em.getRepository(GeneratingUnit).update({ id, organisationId: scope.organisationId }, { name: input.name });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'unit.renamed',
      entityType: 'unit',
      entityId: id,
      details: { from: unit.name, to: input.name },
    });
  });
  return { ...unit, name: input.name };
}

export async function deleteUnit(ds: DataSource, scope: TenantScope, id: string): Promise<void> {
  const unit = await foundInScope(findUnit(ds.manager, scope, id), 'No such unit');
  let uploads: string[] = [];
  await ds
    .transaction(async (em) => {
      uploads = await uploadPathsOfUnits(em, [id]);
      const draftCasesDeleted = await dropDraftCasesOrRefuse(em, scope.organisationId, [id], 'unit');
      const draftOutagesChanged = await refuseApprovedOutagesOrDetach(em, {
        organisationId: scope.organisationId,
        userId: scope.userId,
        units: [{ id, name: unit.name }],
        what: 'unit',
      });
      await em.getRepository(GeneratingUnit).delete({ id, organisationId: scope.organisationId });
      await recordAudit(em, {
        organisationId: scope.organisationId,
        userId: scope.userId,
        action: 'unit.deleted',
        entityType: 'unit',
        entityId: id,
        details: {
          name: unit.name,
          ...(draftCasesDeleted.length ? { draftCasesDeleted } : {}),
          ...(draftOutagesChanged.length ? { draftOutagesChanged } : {}),
        },
      });
    })
    .catch(refuseWhileCasesRemain('unit'));
  await removeUploadFiles(uploads);
}
