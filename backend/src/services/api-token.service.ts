import type { DataSource, EntityManager } from 'typeorm';
import { IsNull } from 'typeorm';
import type { ApiTokenView, CreatedApiToken } from '@shared/schemas/accounts.js';
import { hashSecretToken, newSecretToken } from '../auth/secret-token.js';
import { ApiToken } from '../entities/api-token.entity.js';
import { notFound } from '../http/app-error.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { recordAudit } from './audit.service.js';

export const API_TOKEN_PREFIX = 'cct_';

const view = (t: ApiToken): ApiTokenView => ({
  id: t.id,
  name: t.name,
  prefix: t.prefix,
  createdAt: t.createdAt.toISOString(),
  lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
});

/** The caller's own live tokens in the active tenant. */
export async function listApiTokens(ds: DataSource, scope: TenantScope): Promise<ApiTokenView[]> {
  const rows = await ds
    .getRepository(ApiToken)
    .find({ where: { organisationId: scope.organisationId, userId: scope.userId, revokedAt: IsNull() }, order: { createdAt: 'DESC' } });
  return rows.map(view);
}

/** The secret is shown once, in this answer; only its hash is kept. */
export async function createApiToken(ds: DataSource, scope: TenantScope, name: string): Promise<CreatedApiToken> {
  const { token, hash } = newSecretToken(API_TOKEN_PREFIX);
  return ds.transaction(async (em) => {
    const saved = await em.getRepository(ApiToken).save({
      organisationId: scope.organisationId,
      userId: scope.userId,
      name,
      prefix: token.slice(0, 10),
      tokenHash: hash,
      lastUsedAt: null,
      revokedAt: null,
    });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'api-token.created',
      entityType: 'api-token',
      entityId: saved.id,
      details: { name },
    });
    return { ...view(saved), token };
  });
}

export async function revokeApiToken(ds: DataSource, scope: TenantScope, id: string): Promise<void> {
  await ds.transaction(async (em) => {
    const t = await em.getRepository(ApiToken).findOneBy({ id, organisationId: scope.organisationId, userId: scope.userId, revokedAt: IsNull() });
    if (!t) throw notFound('No such API token');
    await em.getRepository(ApiToken).update({ id }, { revokedAt: new Date() });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'api-token.revoked',
      entityType: 'api-token',
      entityId: id,
      details: { name: t.name },
    });
  });
}

/** A new password ends every token the old one may have let someone create (change or reset). */
export async function revokeAllApiTokensOf(em: EntityManager, userId: string): Promise<void> {
  await em.getRepository(ApiToken).update({ userId, revokedAt: IsNull() }, { revokedAt: new Date() });
}

export async function findLiveApiToken(ds: DataSource, token: string): Promise<ApiToken | null> {
  if (!token.startsWith(API_TOKEN_PREFIX)) return null;
  const t = await ds.getRepository(ApiToken).findOneBy({ tokenHash: hashSecretToken(token), revokedAt: IsNull() });
  if (t) await ds.getRepository(ApiToken).update({ id: t.id }, { lastUsedAt: new Date() });
  return t;
}
