/** Shared pieces of the billing answers: money in main units, the plans on offer, the organisation's admins. */
import Decimal from 'decimal.js';
import type { EntityManager } from 'typeorm';
import type { BillingPlanOffer } from '@shared/schemas/billing.js';
import { Membership } from '../../entities/membership.entity.js';
import { User } from '../../entities/user.entity.js';
import { AppError } from '../../http/app-error.js';
import type { Catalogue, CataloguePrice } from './catalogue-sync.js';

export const money = (cents: number) => new Decimal(cents).div(100).toFixed(2);

export function offers(catalogue: Catalogue): BillingPlanOffer[] {
  return [...catalogue.values()].map((p) => ({
    plan: p.plan.code,
    name: p.plan.name,
    price: p.lookupKey,
    interval: p.interval,
    amount: money(p.cents),
    currency: p.currency,
    limits: p.plan.limits,
  }));
}

/** The price a request names, from the catalogue only. */
export function priceOnOffer(catalogue: Catalogue, key: string): CataloguePrice {
  const price = catalogue.get(key);
  if (!price) throw new AppError(400, 'Choose one of the plans on offer', { fieldErrors: [{ path: 'price', message: 'Not a plan on offer' }] });
  return price;
}

/** Addresses of the organisation's administrators: billing mail goes to them. */
export async function adminAddresses(em: EntityManager, organisationId: string): Promise<{ email: string; name: string }[]> {
  return em
    .getRepository(Membership)
    .createQueryBuilder('m')
    .innerJoin(User, 'u', 'u.id = m.userId')
    .select(['u.email AS email', 'u.name AS name'])
    .where('m.organisationId = :organisationId AND m.role = :role', { organisationId, role: 'admin' })
    .orderBy('u.email')
    .getRawMany<{ email: string; name: string }>();
}
