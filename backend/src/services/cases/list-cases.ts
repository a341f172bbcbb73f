/** The cases a member may see: in the tenant, on units of plants in their client groups, approved only for viewers. */
import type { DataSource } from 'typeorm';
import type { CaseListQuery, CaseSummary } from '@shared/schemas/cases.js';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { Plant } from '../../entities/plant.entity.js';
import { User } from '../../entities/user.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { unitForCases } from './case-access.js';

interface Row {
  id: string;
  unitId: string;
  unitName: string;
  plantId: string;
  plantName: string;
  currency: string;
  title: string;
  status: CaseSummary['status'];
  npv: string | number;
  firstDate: string | null;
  firstMethod: string | null;
  authorName: string | null;
  updatedAt: Date | string;
  decidedAt: Date | string | null;
}

const isoTime = (d: Date | string) => (d instanceof Date ? d : new Date(`${d.replace(' ', 'T')}Z`)).toISOString();

export async function listCases(ds: DataSource, scope: TenantScope, q: CaseListQuery): Promise<CaseSummary[]> {
  if (q.unitId) await unitForCases(ds.manager, scope, q.unitId);
  // Only the figures a list shows are read out of the results (not the daily path or the Monte Carlo histogram).
  const qb = ds
    .getRepository(CleaningCase)
    .createQueryBuilder('c')
    .innerJoin(GeneratingUnit, 'u', 'u.id = c.unitId')
    .innerJoin(Plant, 'p', 'p.id = u.plantId')
    .leftJoin(User, 'a', 'a.id = c.authorId')
    .select([
      'c.id AS id',
      'c.unitId AS unitId',
      // a case once submitted keeps the names it was submitted under (case-view.ts namesShown)
      `CASE WHEN c.status <> 'draft' AND c.unitNameAtSubmit IS NOT NULL THEN c.unitNameAtSubmit ELSE u.name END AS unitName`,
      'p.id AS plantId',
      `CASE WHEN c.status <> 'draft' AND c.plantNameAtSubmit IS NOT NULL THEN c.plantNameAtSubmit ELSE p.name END AS plantName`,
      'c.currency AS currency',
      'c.title AS title',
      'c.status AS status',
      'a.name AS authorName',
      'c.updatedAt AS updatedAt',
      'c.decidedAt AS decidedAt',
    ])
    .addSelect("JSON_VALUE(c.results, '$.businessCase.npv')", 'npv')
    .addSelect("JSON_VALUE(c.results, '$.cleanings[0].date')", 'firstDate')
    .addSelect("JSON_VALUE(c.results, '$.cleanings[0].methodName')", 'firstMethod')
    .where('c.organisationId = :org', { org: scope.organisationId })
    .andWhere('p.organisationId = :org', { org: scope.organisationId });
  if (scope.clientGroupIds !== null) {
    if (scope.clientGroupIds.length === 0) qb.andWhere('1 = 0');
    else qb.andWhere('p.clientGroupId IN (:...groups)', { groups: scope.clientGroupIds });
  }
  if (scope.role === 'viewer') qb.andWhere("c.status = 'approved'");
  if (q.status) qb.andWhere('c.status = :status', { status: q.status });
  if (q.unitId) qb.andWhere('c.unitId = :unitId', { unitId: q.unitId });
  const rows: Row[] = await qb.orderBy('c.updatedAt', 'DESC').addOrderBy('c.id', 'ASC').limit(500).getRawMany();
  return rows.map((r) => ({
    id: r.id,
    unitId: r.unitId,
    unitName: r.unitName,
    plantId: r.plantId,
    plantName: r.plantName,
    currency: r.currency,
    title: r.title,
    status: r.status,
    npv: Number(r.npv),
    firstCleaning: r.firstDate ? { date: r.firstDate, methodName: r.firstMethod ?? '' } : null,
    authorName: r.authorName ?? 'a former member',
    updatedAt: isoTime(r.updatedAt),
    decidedAt: r.decidedAt ? isoTime(r.decidedAt) : null,
  }));
}
