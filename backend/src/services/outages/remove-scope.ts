/**
 * Removes a saved scope of a draft outage, so the planner can keep another alternative in its place. Approval
 * freezes the outage with its scopes (409 then); the audit names the scope removed.
 */
import type { DataSource } from 'typeorm';
import type { OutageView } from '@shared/schemas/outages.js';
import { OutageScope } from '../../entities/outage-scope.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import { notFound } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { recordAudit } from '../audit.service.js';
import { assertMayOutage, outageInScope, touch } from './outage-access.js';
import { outageViewOf } from './outage-view.js';

export async function removeScope(ds: DataSource, scope: TenantScope, outageId: string, scopeId: string): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const outage = await outageInScope(em, scope, outageId, true);
    assertMayOutage('saveScope', outage, scope);
    const saved = await em.getRepository(OutageScope).findOneBy({ id: scopeId, outageId: outage.id });
    if (!saved) throw notFound('This outage has no saved scope by that link');
    await em.getRepository(OutageScope).delete({ id: saved.id });
    touch(outage, false);
    await em.getRepository(Outage).save(outage);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.scope-removed',
      entityType: 'outage',
      entityId: outage.id,
      details: { outage: outage.name, scope: saved.name },
    });
    return outageViewOf(em, scope, outage);
  });
}
