import type { DataSource } from 'typeorm';
import type { CaseView } from '@shared/schemas/cases.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { caseInScope } from './case-access.js';
import { caseViewOf } from './case-view.js';

/** One case as stored (never recomputed on read). */
export async function getCase(ds: DataSource, scope: TenantScope, id: string): Promise<CaseView> {
  return caseViewOf(ds.manager, scope, await caseInScope(ds.manager, scope, id));
}
