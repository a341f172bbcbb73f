/** A stored case as the API answers it: the snapshot as built, plus what is read now (newer data, the asker's actions). */
import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { daysBetween } from '@shared/domain/calendar/plant-date.js';
import type { CaseView } from '@shared/schemas/cases.js';
import type { CleaningCase } from '../../entities/cleaning-case.entity.js';
import { User } from '../../entities/user.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import type { CaseInScope } from './case-access.js';
import { actionsFor } from './case-rules.js';
import { caseWarnings } from './case-prefill.js';
import { lastDataDayOf } from './unit-history.js';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export async function namesOf(em: EntityManager, ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((x): x is string => !!x))];
  if (wanted.length === 0) return new Map();
  const users = await em.getRepository(User).find({ where: { id: In(wanted) }, select: { id: true, name: true } });
  return new Map(users.map((u) => [u.id, u.name]));
}

/** Newer data than the case was built on: the unit's last day now and how many days later it is. */
export function newerDataOf(builtOn: string | null, lastNow: string | null): CaseView['newerData'] {
  if (!builtOn || !lastNow || lastNow <= builtOn) return null;
  return { lastDataDay: lastNow, days: daysBetween(builtOn, lastNow) };
}

/** The unit's and plant's names as the case shows them: as they were when submitted, once it was; a draft shows today's. */
export function namesShown(record: Pick<CleaningCase, 'status' | 'unitNameAtSubmit' | 'plantNameAtSubmit'>, unit: { name: string }, plant: { name: string }) {
  const kept = record.status !== 'draft';
  return {
    unitName: (kept ? record.unitNameAtSubmit : null) ?? unit.name,
    plantName: (kept ? record.plantNameAtSubmit : null) ?? plant.name,
  };
}

export async function caseViewOf(em: EntityManager, scope: TenantScope, { record, unit, plant }: CaseInScope): Promise<CaseView> {
  const names = await namesOf(em, [record.authorId, record.decidedById]);
  const person = (id: string) => ({ id, name: names.get(id) ?? 'a former member' });
  return {
    id: record.id,
    organisationId: record.organisationId,
    unitId: unit.id,
    unitName: namesShown(record, unit, plant).unitName,
    plantId: plant.id,
    plantName: namesShown(record, unit, plant).plantName,
    timeZone: plant.timeZone,
    currency: record.currency,
    title: record.title,
    status: record.status,
    inputs: record.inputs,
    inputSources: record.inputSources,
    results: record.results,
    // judged on the day the case was last changed, so a submitted case reads the same on any later day
    caseWarnings: record.lastDataDay
      ? caseWarnings({ inputs: record.inputs, inputSources: record.inputSources, lastDataDay: record.lastDataDay }, record.updatedAt.toISOString().slice(0, 10))
      : [],
    engineVersion: record.engineVersion,
    builtFrom: { lastDataDay: record.lastDataDay, setupVersion: record.setupVersion },
    newerData: newerDataOf(record.lastDataDay, await lastDataDayOf(em, unit.id)),
    author: person(record.authorId),
    decidedBy: record.decidedById ? person(record.decidedById) : null,
    returnReason: record.returnReason,
    createdAt: record.createdAt.toISOString(),
    updatedAt: record.updatedAt.toISOString(),
    submittedAt: iso(record.submittedAt),
    decidedAt: iso(record.decidedAt),
    archivedAt: iso(record.archivedAt),
    copiedFromId: record.copiedFromId,
    actions: actionsFor(record, { userId: scope.userId, role: scope.role }),
  };
}

export type { CleaningCase };
