/** Historian imports, looked up within the caller's scope. */
import { In, type EntityManager } from 'typeorm';
import { DataImport } from '../entities/data-import.entity.js';
import { User } from '../entities/user.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { findUnit } from './plant.repository.js';
import { restrictUnitRecordsToScope } from './scope-filter.js';

/** How many imports a unit's history lists. */
const HISTORY_LENGTH = 200;

/** The import, or null when it does not exist or its unit lies outside the scope. */
export function findImportInScope(em: EntityManager, scope: TenantScope, id: string): Promise<DataImport | null> {
  const qb = em.getRepository(DataImport).createQueryBuilder('i').where('i.id = :id', { id });
  return restrictUnitRecordsToScope(qb, 'i', scope, { ownTenantColumn: true }).getOne();
}

/** A unit's imports, newest first, each with the name of who uploaded it; null when the unit lies outside the scope. */
export async function importsOfUnitInScope(
  em: EntityManager,
  scope: TenantScope,
  unitId: string,
): Promise<{ record: DataImport; uploadedBy: string | null }[] | null> {
  if (!(await findUnit(em, scope, unitId))) return null;
  const rows = await em
    .getRepository(DataImport)
    .find({ where: { unitId, organisationId: scope.organisationId }, order: { createdAt: 'DESC' }, take: HISTORY_LENGTH });
  const ids = [...new Set(rows.map((r) => r.uploadedByUserId).filter((id): id is string => !!id))];
  const names = new Map((ids.length ? await em.getRepository(User).findBy({ id: In(ids) }) : []).map((u) => [u.id, u.name]));
  return rows.map((record) => ({ record, uploadedBy: record.uploadedByUserId ? (names.get(record.uploadedByUserId) ?? null) : null }));
}
