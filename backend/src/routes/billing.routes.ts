import type { Request, RequestHandler, Response } from 'express';
import type { DataSource } from 'typeorm';
import { billingNotice, billingOverview, billingPriceRequest, billingUrlAnswer } from '@shared/schemas/billing.js';
import type { Config } from '../config.js';
import { forbidden } from '../http/app-error.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { createBillingContext, type BillingContext } from '../services/billing/billing-context.js';
import { setCancelAtPeriodEnd } from '../services/billing/cancel-subscription.js';
import { changePlan } from '../services/billing/change-plan.js';
import { getBillingOverview } from '../services/billing/get-billing-overview.js';
import { getBillingNotice } from '../services/billing/get-billing-notice.js';
import { openPortal } from '../services/billing/open-portal.js';
import { receiveWebhook } from '../services/billing/receive-webhook.js';
import { startCheckout } from '../services/billing/start-checkout.js';

/** The webhook's body arrives as the raw bytes Stripe signed (app.ts mounts express.raw for this path): kept aside for the signature check. */
const keepRawEvent: RequestHandler = (req, res, next) => {
  res.locals.rawEvent = req.body;
  req.body = {};
  next();
};

/** Billing is the whole organisation's: an administrator limited to client groups does not manage it. */
const orgOf = (req: Request) => {
  const scope = scopeOf(req.actor);
  if (scope.clientGroupIds) throw forbidden('Only administrators without a client-group limit manage billing');
  return scope.organisationId;
};

export function billingRoutes(ds: DataSource, config: Config, context?: BillingContext): RouteSpec[] {
  const ctx = context ?? createBillingContext(ds, config);
  const done = (res: Response) => res.status(204).end();
  const billing = { access: 'billing.manage', tenantScoped: true, openWhenReadOnly: true } as const;
  return [
    {
      ...billing,
      method: 'get',
      path: '/api/billing',
      response: billingOverview,
      description: 'The subscription: plan, status, trial, usage against each limit, next invoice, invoices and the plans on offer',
      handler: async (req, res) => res.json(await getBillingOverview(ctx, orgOf(req))),
    },
    {
      method: 'get',
      path: '/api/billing/notice',
      access: 'data.read',
      tenantScoped: true,
      response: billingNotice,
      description: "What every member is shown about the subscription: read-only with its reason, the trial's last days",
      handler: async (req, res) => res.json(await getBillingNotice(ds.manager, req.actor!.organisation!)),
    },
    {
      ...billing,
      method: 'post',
      path: '/api/billing/checkout',
      body: billingPriceRequest,
      response: billingUrlAnswer,
      description: "The address of Stripe's Checkout page for a plan on offer (`price` from the plans of GET /api/billing)",
      handler: async (req, res) => res.json(await startCheckout(ctx, orgOf(req), req.body.price)),
    },
    {
      ...billing,
      method: 'post',
      path: '/api/billing/portal',
      response: billingUrlAnswer,
      description: "The address of Stripe's billing portal for the organisation (card, invoices)",
      handler: async (req, res) => res.json(await openPortal(ctx, orgOf(req))),
    },
    {
      ...billing,
      method: 'post',
      path: '/api/billing/change',
      body: billingPriceRequest,
      response: 'empty',
      description: 'Move the running subscription to another plan or interval (a smaller plan only within current usage)',
      handler: async (req, res) => {
        await changePlan(ctx, orgOf(req), req.body.price);
        done(res);
      },
    },
    {
      ...billing,
      method: 'post',
      path: '/api/billing/cancel',
      response: 'empty',
      description: 'End the subscription at the end of the paid period (nothing is deleted)',
      handler: async (req, res) => {
        await setCancelAtPeriodEnd(ctx, orgOf(req), true);
        done(res);
      },
    },
    {
      ...billing,
      method: 'post',
      path: '/api/billing/resume',
      response: 'empty',
      description: 'Keep a subscription that was set to end at the period end',
      handler: async (req, res) => {
        await setCancelAtPeriodEnd(ctx, orgOf(req), false);
        done(res);
      },
    },
    {
      method: 'post',
      path: '/api/billing/webhook',
      access: 'public',
      tenantScoped: false,
      csrf: false,
      before: [keepRawEvent],
      response: 'empty',
      description: "Stripe's events (signature checked on the raw body; no session, no CSRF header)",
      handler: async (req, res) => {
        await receiveWebhook(ctx, res.locals.rawEvent, req.get('stripe-signature'));
        res.status(204).end();
      },
    },
  ];
}
