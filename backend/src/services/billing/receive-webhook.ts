/**
 * POST /api/billing/webhook: Stripe's events, signature-checked on the raw body. Each handled event's effect
 * and its id are committed in one transaction under the organisation's row lock, so a duplicate (however many,
 * however concurrent) does nothing and a crash before the commit leaves nothing for the retry to double.
 * The subscription is re-read from Stripe rather than taken from the event, and an older read never overwrites
 * a newer one, so events arriving out of order end in Stripe's current state. The answer is 2xx only after commit.
 */
import type Stripe from 'stripe';
import { PAST_DUE_GRACE_DAYS } from '@shared/billing-access.js';
import { formatCurrency } from '@shared/text/display-format.js';
import { BillingWebhookEvent } from '../../entities/billing-webhook-event.entity.js';
import { Organisation } from '../../entities/organisation.entity.js';
import { AppError } from '../../http/app-error.js';
import { baseUrl } from '../../http/base-url.js';
import { createOutboxMailer } from '../../mail/mailer.js';
import { paymentFailedMail, receiptMail } from '../../mail/templates.js';
import type { EntityManager } from 'typeorm';
import type { BillingContext } from './billing-context.js';
import { adminAddresses, money } from './billing-view.js';
import { applySubscription, lockOrganisation } from './organisation-billing.js';
import { NO_OPEN_CHECKOUT } from './open-checkout.js';
import { callStripe } from './stripe-client.js';

export const HANDLED_EVENTS = [
  'checkout.session.completed',
  'checkout.session.expired',
  'customer.subscription.created',
  'customer.subscription.updated',
  'customer.subscription.deleted',
  'invoice.paid',
  'invoice.payment_failed',
] as const;

/** Seconds an event's signature stays acceptable (Stripe's own default tolerance). */
export const SIGNATURE_TOLERANCE_S = 300;

/** Test seam: runs inside the transaction after the effect, before the commit (a crash here must leave nothing). */
export const webhookFaults: { afterEffect: ((event: Stripe.Event) => void) | null } = { afterEffect: null };

export type WebhookOutcome = 'applied' | 'duplicate' | 'ignored';

interface Target {
  organisationId: string | null;
  subscriptionId: string | null;
}

const idOf = (x: string | { id: string } | null | undefined) => (x == null ? null : typeof x === 'string' ? x : x.id);

async function byCustomer(ctx: BillingContext, customer: string | null): Promise<string | null> {
  if (!customer) return null;
  return (await ctx.ds.getRepository(Organisation).findOne({ where: { stripeCustomerId: customer }, select: { id: true } }))?.id ?? null;
}

async function byId(ctx: BillingContext, id: string | null | undefined): Promise<string | null> {
  if (!id || !/^[0-9a-f-]{36}$/i.test(id)) return null;
  return (await ctx.ds.getRepository(Organisation).existsBy({ id })) ? id : null;
}

async function targetOf(ctx: BillingContext, event: Stripe.Event): Promise<Target> {
  const object = event.data.object as unknown as Record<string, unknown>;
  const customer = idOf(object.customer as string | { id: string } | null);
  if (event.type === 'checkout.session.completed' || event.type === 'checkout.session.expired') {
    const session = event.data.object;
    const fromSession = (await byId(ctx, session.client_reference_id)) ?? (await byId(ctx, session.metadata?.organisationId));
    return { organisationId: fromSession ?? (await byCustomer(ctx, customer)), subscriptionId: idOf(session.subscription) };
  }
  if (event.type.startsWith('customer.subscription.')) {
    const sub = event.data.object as Stripe.Subscription;
    return { organisationId: (await byCustomer(ctx, customer)) ?? (await byId(ctx, sub.metadata?.organisationId)), subscriptionId: sub.id };
  }
  const invoice = event.data.object as Stripe.Invoice & { subscription?: string | { id: string } | null };
  const subscription = idOf(invoice.parent?.subscription_details?.subscription ?? invoice.subscription ?? null);
  return { organisationId: await byCustomer(ctx, customer), subscriptionId: subscription };
}

async function mailFor(em: EntityManager, ctx: BillingContext, org: Organisation, event: Stripe.Event): Promise<void> {
  if (event.type !== 'invoice.paid' && event.type !== 'invoice.payment_failed') return;
  const invoice = event.data.object;
  const cents = event.type === 'invoice.paid' ? invoice.amount_paid : invoice.amount_due;
  const amount = formatCurrency(Number(money(cents)), invoice.currency.toUpperCase(), 2);
  const link = `${baseUrl(ctx.config)}/settings/billing`;
  const mailer = createOutboxMailer(em);
  for (const admin of await adminAddresses(em, org.id)) {
    await mailer.send(
      event.type === 'invoice.paid'
        ? receiptMail({
            to: admin.email,
            organisationName: org.name,
            amount,
            number: invoice.number ?? invoice.id ?? '',
            invoiceUrl: invoice.hosted_invoice_url ?? null,
            link,
          })
        : paymentFailedMail({ to: admin.email, organisationName: org.name, amount, graceDays: PAST_DUE_GRACE_DAYS, link }),
    );
  }
}

export function verifyEvent(ctx: BillingContext, raw: unknown, signature: string | undefined): Stripe.Event {
  if (!Buffer.isBuffer(raw)) throw new AppError(400, 'The event must arrive as Stripe sends it (the raw body)');
  try {
    return ctx.stripe.webhooks.constructEvent(raw, signature ?? '', ctx.config.STRIPE_WEBHOOK_SECRET, SIGNATURE_TOLERANCE_S);
  } catch {
    throw new AppError(
      400,
      `The event's Stripe signature is missing, does not match, or is more than ${SIGNATURE_TOLERANCE_S} seconds old: nothing was changed`,
    );
  }
}

export async function receiveWebhook(ctx: BillingContext, raw: unknown, signature: string | undefined): Promise<WebhookOutcome> {
  const event = verifyEvent(ctx, raw, signature);
  if (!(HANDLED_EVENTS as readonly string[]).includes(event.type)) return 'ignored';
  if (await ctx.ds.getRepository(BillingWebhookEvent).existsBy({ id: event.id })) return 'duplicate';
  const target = await targetOf(ctx, event);
  // Not one of ours (another installation's customer, or an organisation deleted since): nothing to do.
  if (!target.organisationId) return 'ignored';
  const organisationId = target.organisationId;
  const readAt = new Date();
  const subscription = target.subscriptionId ? await callStripe('subscription', () => ctx.stripe.subscriptions.retrieve(target.subscriptionId!)) : null;
  return ctx.ds.transaction(async (em) => {
    const org = await lockOrganisation(em, organisationId);
    // Under the organisation's lock, deliveries of one event take turns: the later ones find it stored.
    if (await em.getRepository(BillingWebhookEvent).existsBy({ id: event.id })) return 'duplicate';
    await em.getRepository(BillingWebhookEvent).insert({ id: event.id, type: event.type, organisationId, eventCreatedAt: new Date(event.created * 1000) });
    if (subscription) await applySubscription(em, org, subscription, readAt);
    // The Checkout page can no longer be paid: its plan's limits stop holding the organisation.
    if (event.type === 'checkout.session.expired' && org.checkoutSessionId === event.data.object.id) {
      await em.getRepository(Organisation).update({ id: org.id }, NO_OPEN_CHECKOUT);
    }
    await mailFor(em, ctx, org, event);
    webhookFaults.afterEffect?.(event);
    return 'applied';
  });
}
