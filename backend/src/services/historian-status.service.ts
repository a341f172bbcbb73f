/**
 * The historian status words of an organisation: the defaults every organisation has, and its own (an
 * administrator edits them). An import reads them when it checks a file (services/import-job/check-file.ts).
 */
import type { DataSource, EntityManager } from 'typeorm';
import { DEFAULT_STATUS_WORDS, statusWordsBody, statusWordsOf, type StatusWordsResponse } from '@shared/schemas/historian-status.js';
import { Organisation } from '../entities/organisation.entity.js';
import { can } from '@shared/permissions.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { recordAudit } from './audit.service.js';

const ownWords = (o: Organisation | null): string[] => statusWordsBody.shape.words.safeParse(o?.historianStatusWords ?? []).data ?? [];

export async function getStatusWords(ds: DataSource, scope: TenantScope): Promise<StatusWordsResponse> {
  const org = await ds.getRepository(Organisation).findOneBy({ id: scope.organisationId });
  return { defaults: [...DEFAULT_STATUS_WORDS], words: ownWords(org), mayEdit: can(scope.role, 'members.manage') };
}

export async function setStatusWords(ds: DataSource, scope: TenantScope, words: string[]): Promise<StatusWordsResponse> {
  await ds.transaction(async (em) => {
    await em.getRepository(Organisation).update({ id: scope.organisationId }, { historianStatusWords: words });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'organisation.status-words-changed',
      entityType: 'organisation',
      entityId: scope.organisationId,
      details: { words },
    });
  });
  return getStatusWords(ds, scope);
}

/** Every status word an import of the organisation recognises (defaults first). */
export async function statusWordsOfOrganisation(em: EntityManager, organisationId: string): Promise<string[]> {
  const org = await em.getRepository(Organisation).findOneBy({ id: organisationId });
  return statusWordsOf(org?.historianStatusWords ?? []);
}
