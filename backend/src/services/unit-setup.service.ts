import type { DataSource } from 'typeorm';
import type { UnitDetail } from '@shared/schemas/plant.js';
import type { CondenserSetup, EconomicsSetup, TurbineSetup } from '@shared/schemas/unit-setup.js';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { enqueueRecompute } from '../jobs/job-queue.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { foundInScope } from '../repositories/found-in-scope.js';
import { recentJobsOfUnit } from '../repositories/job.repository.js';
import { findUnit, findUnitWithPlant } from '../repositories/plant.repository.js';
import { sampleSpanOfUnit } from '../repositories/sample.repository.js';
import { recordAudit } from './audit.service.js';

export type SetupPart = 'condenser' | 'turbine' | 'economics';

export async function unitDetail(ds: DataSource, scope: TenantScope, id: string): Promise<UnitDetail> {
  const { unit, plant } = await foundInScope(findUnitWithPlant(ds.manager, scope, id), 'No such unit');
  const jobs = await recentJobsOfUnit(ds.manager, id, 5);
  const samples = await sampleSpanOfUnit(ds.manager, id);
  return {
    id: unit.id,
    name: unit.name,
    plant: { id: plant.id, name: plant.name, timeZone: plant.timeZone, clientGroupId: plant.clientGroupId },
    condenser: unit.condenser,
    turbine: unit.turbine,
    economics: unit.economics,
    setupVersion: unit.setupVersion,
    setupComplete: !!(unit.condenser && unit.turbine && unit.economics),
    samples,
    jobs: jobs.map((j) => ({
      id: j.id,
      kind: j.kind,
      status: j.status,
      progress: j.progress,
      message: j.message,
      createdAt: j.createdAt.toISOString(),
      finishedAt: j.finishedAt?.toISOString() ?? null,
    })),
  };
}

/** Saves one part of the setup; derived data is recomputed in the background. */
export async function saveSetupPart(
  ds: DataSource,
  scope: TenantScope,
  id: string,
  part: SetupPart,
  value: CondenserSetup | TurbineSetup | EconomicsSetup,
): Promise<UnitDetail> {
  const unit = await foundInScope(findUnit(ds.manager, scope, id), 'No such unit');
  await ds.transaction(async (em) => {
    await em.getRepository(GeneratingUnit).update({ id, organisationId: scope.organisationId }, { [part]: value, setupVersion: unit.setupVersion + 1 });
    await enqueueRecompute(em, scope.organisationId, id, `${part} setup changed`);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: `unit.${part}-saved`,
      entityType: 'unit',
      entityId: id,
      details: { from: unit[part], to: value } as Record<string, unknown>,
    });
  });
  return unitDetail(ds, scope, id);
}
