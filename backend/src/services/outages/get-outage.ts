import type { DataSource } from 'typeorm';
import type { OutageView } from '@shared/schemas/outages.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { outageInScope } from './outage-access.js';
import { outageViewOf } from './outage-view.js';

/** One outage as stored (an approved one shows its frozen snapshot). */
export async function getOutage(ds: DataSource, scope: TenantScope, id: string): Promise<OutageView> {
  return outageViewOf(ds.manager, scope, await outageInScope(ds.manager, scope, id));
}
