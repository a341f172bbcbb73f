/**
 * Loading a case within the caller's scope: the case's tenant, its unit's plant in the member's client groups,
 * and for viewers an approved case only. Anything else is not found.
 */
import type { EntityManager } from 'typeorm';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import type { Plant } from '../../entities/plant.entity.js';
import { AppError, notFound } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { findUnitWithPlant } from '../../repositories/plant.repository.js';
import { refusal, visibleTo, type CaseAction } from './case-rules.js';

export interface CaseInScope {
  record: CleaningCase;
  unit: GeneratingUnit;
  plant: Plant;
}

const caseNotFound = () => notFound('No such cleaning case');

/** The case, its unit and plant; `lock` takes the case's row for the rest of the transaction. */
export async function caseInScope(em: EntityManager, scope: TenantScope, id: string, lock = false): Promise<CaseInScope> {
  const record = await em
    .getRepository(CleaningCase)
    .findOne({ where: { id, organisationId: scope.organisationId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  if (!record || !visibleTo(scope.role, record.status)) throw caseNotFound();
  const found = await findUnitWithPlant(em, scope, record.unitId);
  if (!found) throw caseNotFound();
  return { record, ...found };
}

/** The unit a case is built on, within the scope (404 outside it). */
export async function unitForCases(em: EntityManager, scope: TenantScope, unitId: string): Promise<{ unit: GeneratingUnit; plant: Plant }> {
  const found = await findUnitWithPlant(em, scope, unitId);
  if (!found) throw notFound('No such unit');
  return found;
}

export function assertMay(action: CaseAction, record: CleaningCase, scope: TenantScope): void {
  const no = refusal(action, record, { userId: scope.userId, role: scope.role });
  if (no) throw new AppError(no.status, no.message);
}
