// Local Stripe API fake, bound to loopback only. Usage: node stripe-fake.cjs <port> [webhook signing secret]
//
// stripe-stateful-mock answers products, prices, plans, customers and subscription create/retrieve/list. This file
// mounts its Express app behind a few endpoints it lacks, with Stripe's paths and object shapes: price lookup by
// lookup key, subscription create with only a price, subscription update and cancel, Checkout Sessions,
// billing-portal sessions, a customer's invoices, webhook endpoints, and events delivered to those endpoints signed
// with the SDK's own test-header helper. Two small pages stand in for the hosted checkout and portal pages.
// Routes under /_fake/ are this stand-in's own controls for tests and the demo (renewals, failed payments, outages).
/* eslint-disable @typescript-eslint/no-require-imports -- plain CommonJS entry forked as its own process */
const express = require('express');
const Stripe = require('stripe');
const { createExpressApp } = require('stripe-stateful-mock');
const { getRequestAccountId } = require('stripe-stateful-mock/dist/routes');
const { prices } = require('stripe-stateful-mock/dist/api/prices');
const { plans } = require('stripe-stateful-mock/dist/api/plans');
const { subscriptions } = require('stripe-stateful-mock/dist/api/subscriptions');
const { customers } = require('stripe-stateful-mock/dist/api/customers');

const port = Number(process.argv[2] || 12111);
const webhookSecret = process.argv[3] || process.env.STRIPE_WEBHOOK_SECRET || 'whsec_cleancase_local';
const signer = new Stripe('sk_test_cleancase_signer');
const base = `http://127.0.0.1:${port}`;

const now = () => Math.floor(Date.now() / 1000);
let counter = 0;
const newId = (prefix) => `${prefix}_${Date.now().toString(36)}${(counter++).toString(36).padStart(4, '0')}${Math.random().toString(36).slice(2, 8)}`;
const apiError = (res, status, message, code = 'resource_missing') => res.status(status).json({ error: { type: 'invalid_request_error', code, message } });
const list = (data, url) => ({ object: 'list', data, has_more: false, url });
const escapeHtml = (s) => String(s).replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const addMonths = (epoch, months) => {
  const d = new Date(epoch * 1000);
  d.setUTCMonth(d.getUTCMonth() + months);
  return Math.floor(d.getTime() / 1000);
};

const state = {
  checkoutSessions: new Map(),
  portalSessions: new Map(),
  invoices: [],
  endpoints: [],
  events: [],
  /** Answers the next N API calls with this status (an outage of the stand-in, for tests). */
  failNext: { count: 0, status: 500, match: '' },
};

// ---- events and their delivery -------------------------------------------------------------------------------
function emit(type, object) {
  const event = {
    id: newId('evt'),
    object: 'event',
    api_version: Stripe.API_VERSION,
    created: now(),
    data: { object: JSON.parse(JSON.stringify(object)) },
    livemode: false,
    pending_webhooks: state.endpoints.length,
    request: { id: null, idempotency_key: null },
    type,
  };
  state.events.push(event);
  for (const endpoint of state.endpoints) {
    if (endpoint.enabled_events.includes('*') || endpoint.enabled_events.includes(type)) endpoint.queue.push(event);
    void drain(endpoint);
  }
  return event;
}

const RETRY_DELAYS_MS = [0, 500, 2000, 5000];
async function drain(endpoint) {
  if (endpoint.busy) return;
  endpoint.busy = true;
  while (endpoint.queue.length) {
    const event = endpoint.queue.shift();
    for (const delay of RETRY_DELAYS_MS) {
      if (delay) await new Promise((r) => setTimeout(r, delay));
      const payload = JSON.stringify(event);
      const header = signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
      try {
        const res = await fetch(endpoint.url, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload });
        if (res.ok) break;
      } catch {
        // The endpoint is down: tried again after the next delay, then given up (real Stripe keeps trying for days).
      }
    }
  }
  endpoint.busy = false;
}

// ---- objects ----------------------------------------------------------------------------------------------------
function subscriptionOf(req, id) {
  try {
    return subscriptions.retrieve(getRequestAccountId(req), id, 'id');
  } catch {
    return null;
  }
}

/** The 2025+ API shape: each item carries its own period; the top-level fields are kept for older readers. */
function shapeSubscription(sub, price, periodStart, periodEnd) {
  sub.current_period_start = periodStart;
  sub.current_period_end = periodEnd;
  for (const item of sub.items.data) {
    if (price) {
      item.price = price;
      item.plan = { ...item.plan, id: price.id, amount: price.unit_amount, interval: price.recurring && price.recurring.interval };
    }
    item.current_period_start = periodStart;
    item.current_period_end = periodEnd;
  }
  return sub;
}

function ensurePlanFor(accountId, price) {
  try {
    plans.retrieve(accountId, price.id, 'plan');
  } catch {
    plans.create(accountId, {
      id: price.id,
      currency: price.currency,
      interval: (price.recurring && price.recurring.interval) || 'month',
      product: price.product,
      amount: String(price.unit_amount),
    });
  }
}

function createSubscription(accountId, params) {
  const price = prices.retrieve(accountId, params.price, 'price');
  ensurePlanFor(accountId, price);
  const sub = subscriptions.create(accountId, {
    customer: params.customer,
    items: [{ price: price.id, plan: price.id, quantity: 1 }],
    metadata: params.metadata,
  });
  const interval = price.recurring && price.recurring.interval === 'year' ? 12 : 1;
  shapeSubscription(sub, price, sub.created, addMonths(sub.created, interval));
  return sub;
}

function createInvoice(sub, status) {
  const item = sub.items.data[0];
  const amount = item && item.price ? item.price.unit_amount : 0;
  const id = newId('in');
  const invoice = {
    id,
    object: 'invoice',
    customer: sub.customer,
    subscription: sub.id,
    parent: { type: 'subscription_details', subscription_details: { subscription: sub.id, metadata: sub.metadata } },
    status,
    currency: (item && item.price && item.price.currency) || 'usd',
    amount_due: amount,
    amount_paid: status === 'paid' ? amount : 0,
    amount_remaining: status === 'paid' ? 0 : amount,
    total: amount,
    number: `CC-${String(state.invoices.length + 1).padStart(5, '0')}`,
    created: now(),
    period_start: sub.current_period_start,
    period_end: sub.current_period_end,
    hosted_invoice_url: `${base}/invoice/${id}`,
    invoice_pdf: `${base}/invoice/${id}`,
    livemode: false,
  };
  state.invoices.push(invoice);
  sub.latest_invoice = id;
  return invoice;
}

// ---- the app ----------------------------------------------------------------------------------------------------
const app = express();
app.disable('x-powered-by');
app.set('query parser', 'extended');
app.use(express.urlencoded({ extended: true }));
app.use((req, _res, next) => {
  if (process.env.STRIPE_FAKE_DEBUG) process.stderr.write(`${req.method} ${req.url} ${req.get('content-type')} ${JSON.stringify(req.body)}\n`);
  // The mock's own body parser (body-parser 1) skips a body already read only when it sees this flag.
  req._body = true;
  next();
});

// An outage of the stand-in, switched on by a test: every API call answers with the chosen status.
app.post('/_fake/fail-next', (req, res) => {
  state.failNext = { count: Number(req.body.count || 1), status: Number(req.body.status || 500), match: req.body.match || '' };
  res.json({ ok: true });
});
app.use('/v1', (req, res, next) => {
  if (!/^Bearer sk_test_/.test(req.get('authorization') || ''))
    return apiError(res, 401, 'This stand-in takes test secret keys (sk_test_…) only', 'api_key_invalid');
  // With `match`, only calls whose path or parameters contain it fail (tests sharing the stand-in leave each other alone).
  const matches = !state.failNext.match || `${req.originalUrl} ${JSON.stringify(req.body || {})}`.includes(state.failNext.match);
  if (state.failNext.count > 0 && matches) {
    state.failNext.count -= 1;
    return res.status(state.failNext.status).json({ error: { type: 'api_error', message: 'The Stripe stand-in was told to fail this call' } });
  }
  next();
});

app.get('/v1/prices', (req, res, next) => {
  const keys = req.query.lookup_keys;
  if (!keys) return next();
  const wanted = Array.isArray(keys) ? keys : Object.values(keys);
  const found = prices.list(getRequestAccountId(req), {}).data.filter((p) => wanted.includes(p.lookup_key) && p.active);
  res.json(list(found, '/v1/prices'));
});

app.post('/v1/subscriptions', (req, res) => {
  const items = req.body.items ? Object.values(req.body.items) : [];
  if (items.length !== 1 || !items[0].price) return apiError(res, 400, 'This stand-in takes exactly one item with a price', 'parameter_missing');
  const sub = createSubscription(getRequestAccountId(req), { customer: req.body.customer, price: items[0].price, metadata: req.body.metadata });
  const invoice = createInvoice(sub, 'paid');
  emit('customer.subscription.created', sub);
  emit('invoice.paid', invoice);
  res.json(sub);
});

app.post('/v1/subscriptions/:id', (req, res) => {
  const sub = subscriptionOf(req, req.params.id);
  if (!sub) return apiError(res, 404, `No such subscription: '${req.params.id}'`);
  if (sub.status === 'canceled') return apiError(res, 400, 'A canceled subscription can only be looked at', 'resource_invalid');
  const accountId = getRequestAccountId(req);
  const items = req.body.items ? Object.values(req.body.items) : [];
  if (items.length) {
    const wanted = items[0];
    if (wanted.id && !sub.items.data.some((i) => i.id === wanted.id)) return apiError(res, 400, `No such subscription item: '${wanted.id}'`);
    if (wanted.price) {
      const price = prices.retrieve(accountId, wanted.price, 'price');
      ensurePlanFor(accountId, price);
      shapeSubscription(sub, price, sub.current_period_start, sub.current_period_end);
    }
  }
  if (req.body.cancel_at_period_end !== undefined) {
    sub.cancel_at_period_end = req.body.cancel_at_period_end === 'true';
    sub.cancel_at = sub.cancel_at_period_end ? sub.current_period_end : null;
    sub.canceled_at = sub.cancel_at_period_end ? now() : null;
  }
  if (req.body.metadata) Object.assign(sub.metadata, req.body.metadata);
  emit('customer.subscription.updated', sub);
  res.json(sub);
});

function cancelNow(sub) {
  sub.status = 'canceled';
  sub.canceled_at = sub.canceled_at || now();
  sub.ended_at = now();
  emit('customer.subscription.deleted', sub);
}
app.delete('/v1/subscriptions/:id', (req, res) => {
  const sub = subscriptionOf(req, req.params.id);
  if (!sub) return apiError(res, 404, `No such subscription: '${req.params.id}'`);
  if (sub.status !== 'canceled') cancelNow(sub);
  res.json(sub);
});

app.get('/v1/invoices', (req, res) => {
  if (!req.query.customer) return apiError(res, 400, 'This stand-in lists invoices of one customer', 'parameter_missing');
  const found = state.invoices.filter((i) => i.customer === req.query.customer).sort((a, b) => b.created - a.created);
  res.json(list(found.slice(0, Number(req.query.limit || 10)), '/v1/invoices'));
});
app.get('/v1/invoices/:id', (req, res) => {
  const invoice = state.invoices.find((i) => i.id === req.params.id);
  return invoice ? res.json(invoice) : apiError(res, 404, `No such invoice: '${req.params.id}'`);
});

app.post('/v1/checkout/sessions', (req, res) => {
  const items = req.body.line_items ? Object.values(req.body.line_items) : [];
  if (req.body.mode !== 'subscription' || items.length !== 1 || !items[0].price) {
    return apiError(res, 400, 'This stand-in makes subscription sessions with one price', 'parameter_missing');
  }
  const price = prices.retrieve(getRequestAccountId(req), items[0].price, 'price');
  const id = newId('cs_test');
  const session = {
    id,
    object: 'checkout.session',
    mode: 'subscription',
    status: 'open',
    payment_status: 'unpaid',
    customer: req.body.customer || null,
    client_reference_id: req.body.client_reference_id || null,
    metadata: req.body.metadata || {},
    subscription: null,
    success_url: req.body.success_url,
    cancel_url: req.body.cancel_url || null,
    url: `${base}/pay/${id}`,
    amount_total: price.unit_amount,
    currency: price.currency,
    created: now(),
    expires_at: now() + 24 * 3600,
    livemode: false,
    _price: price.id,
    _subscription_metadata: (req.body.subscription_data && req.body.subscription_data.metadata) || {},
    _accountId: getRequestAccountId(req),
  };
  state.checkoutSessions.set(id, session);
  res.json(publicSession(session));
});
const publicSession = (s) => Object.fromEntries(Object.entries(s).filter(([k]) => !k.startsWith('_')));
app.get('/v1/checkout/sessions/:id', (req, res) => {
  const s = state.checkoutSessions.get(req.params.id);
  return s ? res.json(publicSession(s)) : apiError(res, 404, `No such checkout.session: '${req.params.id}'`);
});

app.post('/v1/billing_portal/sessions', (req, res) => {
  if (!req.body.customer) return apiError(res, 400, 'Missing required param: customer.', 'parameter_missing');
  const id = newId('bps');
  const session = {
    id,
    object: 'billing_portal.session',
    customer: req.body.customer,
    return_url: req.body.return_url || null,
    url: `${base}/portal/${id}`,
    created: now(),
    livemode: false,
  };
  state.portalSessions.set(id, { ...session, _accountId: getRequestAccountId(req) });
  res.json(session);
});

app.post('/v1/webhook_endpoints', (req, res) => {
  const enabled = req.body.enabled_events ? Object.values(req.body.enabled_events) : ['*'];
  let endpoint = state.endpoints.find((e) => e.url === req.body.url);
  if (!endpoint) {
    endpoint = { id: newId('we'), url: req.body.url, enabled_events: enabled, queue: [], busy: false };
    state.endpoints.push(endpoint);
  }
  endpoint.enabled_events = enabled;
  res.json({
    id: endpoint.id,
    object: 'webhook_endpoint',
    url: endpoint.url,
    enabled_events: enabled,
    status: 'enabled',
    secret: webhookSecret,
    livemode: false,
  });
});

// ---- the pages standing in for hosted checkout and portal ---------------------------------------------------------
const page = (title, body) =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>` +
  '<style>body{font-family:sans-serif;max-width:36rem;margin:3rem auto;color:#1d2430}button{margin:.3rem .5rem .3rem 0;padding:.5rem 1rem}' +
  '.note{background:#fff6d6;padding:.5rem;border:1px solid #e0c870}</style></head><body>' +
  `<p class="note">Local payment stand-in: no money moves and no card is asked for.</p>${body}</body></html>`;

function completeCheckout(session, outcome) {
  if (outcome === 'decline') return false;
  const sub = createSubscription(session._accountId, { customer: session.customer, price: session._price, metadata: session._subscription_metadata });
  const invoice = createInvoice(sub, 'paid');
  session.status = 'complete';
  session.payment_status = 'paid';
  session.subscription = sub.id;
  emit('checkout.session.completed', publicSession(session));
  emit('customer.subscription.created', sub);
  emit('invoice.paid', invoice);
  return true;
}

app.get('/pay/:id', (req, res) => {
  const s = state.checkoutSessions.get(req.params.id);
  if (!s) return res.status(404).send(page('Not found', '<h1>No such payment page</h1>'));
  if (s.status !== 'open') return res.send(page('Paid', `<h1>Already paid</h1><p><a href="${escapeHtml(s.success_url)}">Back to the app</a></p>`));
  const amount = (s.amount_total / 100).toFixed(2);
  res.send(
    page(
      'Pay',
      `<h1>Subscribe</h1><p>Price: ${escapeHtml(s._price)}</p><p>Amount: ${amount} ${escapeHtml(s.currency.toUpperCase())}</p>` +
        `<form method="post" action="/pay/${escapeHtml(s.id)}"><button name="outcome" value="pay">Pay with the test card</button>` +
        `<button name="outcome" value="decline">Try a declined card</button></form>` +
        (s.cancel_url ? `<p><a href="${escapeHtml(s.cancel_url)}">Back without paying</a></p>` : ''),
    ),
  );
});
app.post('/pay/:id', (req, res) => {
  const s = state.checkoutSessions.get(req.params.id);
  if (!s || s.status !== 'open') return res.status(404).send(page('Not found', '<h1>No open payment page here</h1>'));
  if (!completeCheckout(s, req.body.outcome)) {
    return res.status(402).send(page('Declined', `<h1>The card was declined</h1><p><a href="/pay/${escapeHtml(s.id)}">Try again</a></p>`));
  }
  res.redirect(303, s.success_url);
});

app.get('/portal/:id', (req, res) => {
  const p = state.portalSessions.get(req.params.id);
  if (!p) return res.status(404).send(page('Not found', '<h1>No such page</h1>'));
  const subs = subscriptions.list(p._accountId, { customer: p.customer }).data;
  const rows = subs
    .map(
      (s) =>
        `<li>${escapeHtml(s.id)}: ${escapeHtml(s.status)}${s.cancel_at_period_end ? ' (ends at the period end)' : ''}` +
        (s.status === 'canceled'
          ? ''
          : `<form method="post" action="/portal/${escapeHtml(p.id)}"><input type="hidden" name="subscription" value="${escapeHtml(s.id)}">` +
            `<button name="action" value="${s.cancel_at_period_end ? 'resume' : 'cancel'}">${s.cancel_at_period_end ? 'Keep it' : 'End at the period end'}</button></form>`) +
        '</li>',
    )
    .join('');
  const invoices = state.invoices.filter((i) => i.customer === p.customer);
  res.send(
    page(
      'Billing',
      `<h1>Billing</h1><ul>${rows || '<li>No subscriptions</li>'}</ul><p>${invoices.length} invoice(s)</p>` +
        (p.return_url ? `<p><a href="${escapeHtml(p.return_url)}">Back to the app</a></p>` : ''),
    ),
  );
});
app.post('/portal/:id', (req, res) => {
  const p = state.portalSessions.get(req.params.id);
  const sub = p && subscriptions.list(p._accountId, { customer: p.customer }).data.find((s) => s.id === req.body.subscription);
  if (!sub || sub.status === 'canceled') return res.status(404).send(page('Not found', '<h1>No such subscription</h1>'));
  sub.cancel_at_period_end = req.body.action === 'cancel';
  sub.cancel_at = sub.cancel_at_period_end ? sub.current_period_end : null;
  emit('customer.subscription.updated', sub);
  res.redirect(303, `/portal/${p.id}`);
});

app.get('/invoice/:id', (req, res) => {
  const i = state.invoices.find((x) => x.id === req.params.id);
  if (!i) return res.status(404).send(page('Not found', '<h1>No such invoice</h1>'));
  res.send(
    page(
      `Invoice ${i.number}`,
      `<h1>Invoice ${escapeHtml(i.number)}</h1><p>${(i.total / 100).toFixed(2)} ${escapeHtml(i.currency.toUpperCase())}: ${escapeHtml(i.status)}</p>`,
    ),
  );
});

// ---- this stand-in's own controls -------------------------------------------------------------------------------
/** The next period begins: a paid invoice, or the end of a subscription set to cancel. */
app.post('/_fake/subscriptions/:id/renew', (req, res) => {
  const sub = subscriptionOf(req, req.params.id);
  if (!sub) return apiError(res, 404, 'No such subscription');
  if (sub.cancel_at_period_end) cancelNow(sub);
  else {
    const months = sub.items.data[0].price.recurring.interval === 'year' ? 12 : 1;
    shapeSubscription(sub, null, sub.current_period_end, addMonths(sub.current_period_end, months));
    sub.status = 'active';
    const invoice = createInvoice(sub, 'paid');
    emit('invoice.paid', invoice);
    emit('customer.subscription.updated', sub);
  }
  res.json(sub);
});
/** The renewal's payment fails: the subscription falls past due. */
app.post('/_fake/subscriptions/:id/payment-failed', (req, res) => {
  const sub = subscriptionOf(req, req.params.id);
  if (!sub) return apiError(res, 404, 'No such subscription');
  const invoice = createInvoice(sub, 'open');
  sub.status = 'past_due';
  emit('invoice.payment_failed', invoice);
  emit('customer.subscription.updated', sub);
  res.json(sub);
});
app.post('/_fake/checkout/sessions/:id/complete', (req, res) => {
  const s = state.checkoutSessions.get(req.params.id);
  if (!s || s.status !== 'open') return apiError(res, 404, 'No open checkout session');
  completeCheckout(s, 'pay');
  res.json(publicSession(s));
});
app.get('/_fake/events', (req, res) => {
  const customer = req.query.customer;
  const matches = (e) => !customer || e.data.object.customer === customer;
  res.json(list(state.events.filter(matches), '/_fake/events'));
});
app.get('/_fake/customers/:id', (req, res) => {
  try {
    res.json(customers.retrieve(getRequestAccountId(req), req.params.id, 'id'));
  } catch {
    apiError(res, 404, 'No such customer');
  }
});

app.use(createExpressApp());

const server = app.listen(port, '127.0.0.1', () => {
  process.stdout.write(`stripe-fake listening on ${port}\n`);
});
const stop = () => {
  server.close(() => process.exit(0));
  // The SDK keeps its connections alive: close them, or closing would wait for the app to go first.
  server.closeAllConnections();
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
// Exit with the parent: never outlive the process that started us.
process.on('disconnect', stop);
