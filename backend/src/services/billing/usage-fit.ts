/** A plan change or a new subscription must hold what the organisation has already (downgrades within usage only). */
import type { EntityManager } from 'typeorm';
import { LIMIT_NAMES } from '@shared/schemas/billing.js';
import { AppError } from '../../http/app-error.js';
import { usageOf } from './organisation-billing.js';
import { LIMIT_WORDS, type PlanDefinition } from './plan-catalogue.js';

export async function assertUsageFits(em: EntityManager, organisationId: string, plan: PlanDefinition): Promise<void> {
  const usage = await usageOf(em, organisationId);
  const over = LIMIT_NAMES.filter((l) => usage[l] > plan.limits[l]);
  if (!over.length) return;
  const parts = over.map((l) => `${usage[l]} ${LIMIT_WORDS[l].many} (the ${plan.name} plan allows ${plan.limits[l]})`);
  throw new AppError(409, `This organisation has ${parts.join(' and ')}: remove some first, or choose a larger plan`);
}
