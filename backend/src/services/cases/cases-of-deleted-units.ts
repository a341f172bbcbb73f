/**
 * What happens to cleaning cases when their unit (or its plant) is deleted. A case that was submitted is a record
 * of a decision asked for or made — submitted, approved, returned or archived — and is kept: the unit is not
 * deleted while it has one (409 saying so). Drafts are work in progress of the unit and go with it; their titles
 * are written to the deletion's audit entry. The foreign key is RESTRICT, so the database refuses too.
 */
import { In, type EntityManager } from 'typeorm';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import { AppError } from '../../http/app-error.js';

const DELETED_WITH_UNIT = 'draft';

export async function dropDraftCasesOrRefuse(em: EntityManager, organisationId: string, unitIds: string[], what: 'unit' | 'plant'): Promise<string[]> {
  if (unitIds.length === 0) return [];
  const cases = await em.getRepository(CleaningCase).find({
    where: { organisationId, unitId: In(unitIds) },
    select: { id: true, title: true, status: true },
    lock: { mode: 'pessimistic_write' },
  });
  const kept = cases.filter((c) => c.status !== DELETED_WITH_UNIT);
  if (kept.length) {
    const counts = new Map<string, number>();
    for (const c of kept) counts.set(c.status, (counts.get(c.status) ?? 0) + 1);
    const list = [...counts].map(([status, n]) => `${n} ${status}`).join(', ');
    throw new AppError(
      409,
      `This ${what} cannot be deleted: it has ${kept.length} cleaning case${kept.length === 1 ? '' : 's'} that went to a decision (${list}), kept as records of it. ` +
        'Only a unit whose cases are all drafts can be deleted (the drafts go with it).',
    );
  }
  if (cases.length) await em.getRepository(CleaningCase).delete({ organisationId, id: In(cases.map((c) => c.id)) });
  return cases.map((c) => c.title);
}

/** The database's own refusal (a case submitted meanwhile) answered like the check above. */
export function isCaseStillReferencing(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { errno?: number }).errno === 1451;
}
