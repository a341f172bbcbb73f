/**
 * Loading an outage or an item within the caller's scope (repositories/outage.repository.ts: every unit of the
 * outage visible to the member) and, for viewers, approved only. Anything else is not found.
 */
import type { EntityManager } from 'typeorm';
import type { OutageItem } from '../../entities/outage-item.entity.js';
import type { Outage } from '../../entities/outage.entity.js';
import { AppError, notFound } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { findOutageInScope, findOutageItemInScope } from '../../repositories/outage.repository.js';
import { outageRefusal, outageVisibleTo, type OutageAction } from './outage-rules.js';

export const outageNotFound = () => notFound('No such outage');

export async function outageInScope(em: EntityManager, scope: TenantScope, id: string, lock = false): Promise<Outage> {
  const outage = await findOutageInScope(em, scope, id, lock);
  if (!outage || !outageVisibleTo(scope.role, outage.status)) throw outageNotFound();
  return outage;
}

export async function itemInScope(em: EntityManager, scope: TenantScope, itemId: string, lock = false): Promise<{ item: OutageItem; outage: Outage }> {
  const found = await findOutageItemInScope(em, scope, itemId, lock);
  if (!found || !outageVisibleTo(scope.role, found.outage.status)) throw notFound('No such outage item');
  return found;
}

export function assertMayOutage(action: OutageAction, outage: Outage, scope: TenantScope): void {
  const no = outageRefusal(action, outage.status, scope.role);
  if (no) throw new AppError(no.status, no.message);
}

/** A decision or change naming the version it read is refused when the outage changed since. */
export function assertSeen(outage: Outage, seenUpdatedAt: string | undefined): void {
  if (seenUpdatedAt !== undefined && new Date(seenUpdatedAt).getTime() !== outage.updatedAt.getTime()) {
    throw new AppError(409, 'The outage changed since you opened it: reload it and look again before deciding');
  }
}

/** Marks a change: the updated time and version rise; `plan` also makes the latest proposal stale. */
export function touch(outage: Outage, plan: boolean, now = new Date()): void {
  outage.updatedAt = now;
  outage.version += 1;
  if (plan) outage.planVersion += 1;
}
