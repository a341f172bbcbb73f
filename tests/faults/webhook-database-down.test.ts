/**
 * A Stripe event arrives while the database is stopped, on a real app process, a private MariaDB of this file and
 * a Stripe stand-in of its own: the webhook answers 5xx in our words (so Stripe delivers it again) and writes
 * nothing; once MariaDB is back the app reconnects by itself, the same event delivered again is applied exactly
 * once (the organisation's row and the processed-event record), and a third delivery changes nothing more.
 * Two events: a subscription change (the organisation's row only) and a paid renewal (the row and a receipt mail).
 */
import Stripe from 'stripe';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildDataSource } from '../../backend/src/data-source.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { HANDLED_EVENTS } from '../../backend/src/services/billing/receive-webhook.js';
import { freePort } from '../../scripts/lib/free-port.js';
import { startStripeFake, type StripeFake } from '../../scripts/lib/local-services.js';
import { createTenant, CSRF, type TenantFixture } from '../factories/accounts.js';
import { makeTempDir } from '../helpers/historian-files.js';
import { signedInCookie, startAppProcess, startPrivateDatabase, stopAppProcess, until, type AppProcess, type PrivateDatabase } from './app-process.js';

/** The app's default signing secret for the local stand-in (config.ts), which the stand-in signs with too. */
const WEBHOOK_SECRET = 'whsec_cleancase_local';

let db: PrivateDatabase;
let ds: DataSource;
let stand: StripeFake;
let stripe: Stripe;
let tenant: TenantFixture;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let app: AppProcess | undefined;
let subscriptionId: string;
let customerId: string;

const org = () => ds.getRepository(Organisation).findOneByOrFail({ id: tenant.organisation.id });
const processedRecords = async (eventId: string) =>
  (await ds.query('SELECT organisationId, type FROM billing_webhook_event WHERE id = ?', [eventId])) as { organisationId: string; type: string }[];

/** Every event the stand-in made about the customer, oldest first. */
async function eventsOfCustomer(): Promise<Stripe.Event[]> {
  const res = await fetch(`${stand.apiBase}/_fake/events?customer=${encodeURIComponent(customerId)}`);
  return ((await res.json()) as { data: Stripe.Event[] }).data;
}

/** The newest event of `type` the stand-in made after the first `since` events. */
async function eventAfter(since: number, type: string): Promise<Stripe.Event> {
  const found = (await eventsOfCustomer()).slice(since).find((e) => e.type === type);
  if (!found) throw new Error(`the stand-in made no ${type}`);
  return found;
}

/** POSTs the event to the app's webhook as Stripe does (and does again on a retry): the exact bytes, freshly signed. */
async function deliver(event: Stripe.Event) {
  const payload = JSON.stringify(event);
  const signature = stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET });
  return request(app!.url).post('/api/billing/webhook').set('content-type', 'application/json').set('stripe-signature', signature).send(payload);
}

/** Stops MariaDB, runs `during` (the deliveries that must fail), starts it again and waits until the app reads from it by itself. */
async function withDatabaseDown(cookie: string, during: () => Promise<void>): Promise<void> {
  await db.stop();
  try {
    await during();
  } finally {
    await db.start();
  }
  // No restart of the app process: its pool reconnects on its own.
  await until(
    'the app reading from the database again',
    async () => (await request(app!.url).get('/api/plants').set('Cookie', cookie)).status,
    (status) => status === 200,
    60_000,
  );
  expect(app!.child.exitCode, app!.output()).toBeNull();
}

/** A delivery during the outage: 5xx so that Stripe retries, said in our words, with no driver detail. */
function expectRefusedForOutage(res: request.Response) {
  expect(res.status, JSON.stringify(res.body)).toBeGreaterThanOrEqual(500);
  expect(res.status).toBeLessThan(600);
  expect(res.status, 'an outage is temporary: 503, not a 500 bug answer').toBe(503);
  expect(res.body.error).toMatch(/database/i);
  expect(res.body.error).not.toMatch(/ECONNREFUSED|errno|connect |stack/i);
}

/** Receipts with this invoice number for the address: still in the outbox, and delivered to the local sink. */
async function receipts(email: string, invoiceNumber: string): Promise<{ waiting: number; delivered: number }> {
  const subject = `Receipt ${invoiceNumber} %`;
  const [w] = (await ds.query('SELECT COUNT(*) AS n FROM mail_outbox WHERE recipient = ? AND subject LIKE ?', [email, subject])) as { n: string }[];
  const [d] = (await ds.query('SELECT COUNT(*) AS n FROM sink_message WHERE recipient = ? AND subject LIKE ?', [email.toLowerCase(), subject])) as {
    n: string;
  }[];
  return { waiting: Number(w!.n), delivered: Number(d!.n) };
}

describe('a Stripe webhook while the database is down', { timeout: 240_000 }, () => {
  let cookie: string;

  beforeAll(async () => {
    db = await startPrivateDatabase('webhook');
    ds = buildDataSource(db.connection);
    await ds.initialize();
    await ds.runMigrations({ transaction: 'each' });
    tenant = await createTenant(ds, 'hookdown');
    tmp = await makeTempDir();
    stand = await startStripeFake(await freePort(), WEBHOOK_SECRET);
    const base = new URL(stand.apiBase);
    stripe = new Stripe('sk_test_cleancase_local', { host: base.hostname, port: Number(base.port), protocol: 'http', maxNetworkRetries: 0 });
    app = await startAppProcess(db.connection, tmp.file('uploads'), { STRIPE_API_BASE: stand.apiBase });
    cookie = await signedInCookie(app.url, tenant.users.admin.email);

    // The organisation subscribes while everything is up; the stand-in delivers the checkout's events itself.
    const checkout = await request(app.url).post('/api/billing/checkout').set('Cookie', cookie).set(CSRF).send({ price: 'cleancase_station_month' });
    expect(checkout.status, JSON.stringify(checkout.body)).toBe(200);
    const paid = await fetch(checkout.body.url as string, { method: 'POST', body: new URLSearchParams({ outcome: 'pay' }), redirect: 'manual' });
    expect(paid.status).toBe(303);
    const active = await until('the subscription applied from the stand-in’s own deliveries', org, (o) => o.subscriptionStatus === 'active', 30_000);
    subscriptionId = active.stripeSubscriptionId!;
    customerId = active.stripeCustomerId!;
    // From here on the test delivers each event itself, first during the outage and then as Stripe's retries would:
    // the stand-in is told to send this endpoint nothing more, so no delivery of its own races the test's.
    await stripe.webhookEndpoints.create({ url: `${app.url}/api/billing/webhook`, enabled_events: ['account.updated'] });
    // Events it had queued before are still delivered: wait until each of the checkout's events is stored as applied,
    // so none lands later and moves the organisation's billing state under the tests.
    await until(
      'every event of the checkout applied',
      async () => ({
        made: (await eventsOfCustomer()).filter((e) => (HANDLED_EVENTS as readonly string[]).includes(e.type)).length,
        applied: Number((await ds.query('SELECT COUNT(*) AS n FROM billing_webhook_event WHERE organisationId = ?', [tenant.organisation.id]))[0].n),
      }),
      (v) => v.made > 0 && v.applied === v.made,
      30_000,
    );
  }, 180_000);

  afterAll(async () => {
    await stopAppProcess(app);
    await ds?.destroy().catch(() => undefined);
    await db?.remove();
    await stand?.stop();
    await tmp?.cleanup();
  }, 120_000);

  it('a subscription change: 503 while MariaDB is stopped and nothing stored; after it is back the retry applies it once, a third delivery changes nothing', async () => {
    const before = await org();
    expect(before.cancelAtPeriodEnd).toBe(false);
    const since = (await eventsOfCustomer()).length;
    await stripe.subscriptions.update(subscriptionId, { cancel_at_period_end: true });
    const event = await eventAfter(since, 'customer.subscription.updated');

    await withDatabaseDown(cookie, async () => {
      expectRefusedForOutage(await deliver(event));
      // Stripe's quick retry lands in the same outage: refused the same way.
      expectRefusedForOutage(await deliver(event));
    });
    // The refused deliveries wrote nothing.
    expect(await processedRecords(event.id)).toHaveLength(0);
    const untouched = await org();
    expect(untouched.cancelAtPeriodEnd).toBe(false);
    expect(untouched.billingStateAt?.getTime()).toBe(before.billingStateAt?.getTime());

    const retry = await deliver(event);
    expect(retry.status, JSON.stringify(retry.body)).toBe(204);
    const applied = await org();
    expect(applied.cancelAtPeriodEnd).toBe(true);
    expect(applied.subscriptionStatus).toBe('active');
    expect(applied.billingStateAt!.getTime()).toBeGreaterThan(before.billingStateAt!.getTime());
    expect(await processedRecords(event.id)).toEqual([{ organisationId: tenant.organisation.id, type: 'customer.subscription.updated' }]);

    const third = await deliver(event);
    expect(third.status, JSON.stringify(third.body)).toBe(204);
    expect(await processedRecords(event.id)).toHaveLength(1);
    // A second effect would have read Stripe again and moved the time of the organisation's billing state.
    const after = await org();
    expect(after.billingStateAt!.getTime()).toBe(applied.billingStateAt!.getTime());
    expect(after.cancelAtPeriodEnd).toBe(true);
  });

  it('a paid renewal: 503 while MariaDB is stopped with no receipt queued; after it is back the retry applies it and mails one receipt, a third delivery mails none', async () => {
    // The subscription runs on (the previous test set it to end at the period end, which a renewal would turn into a cancel).
    await stripe.subscriptions.update(subscriptionId, { cancel_at_period_end: false });
    const since = (await eventsOfCustomer()).length;
    const renewed = await fetch(`${stand.apiBase}/_fake/subscriptions/${subscriptionId}/renew`, { method: 'POST' });
    expect(renewed.status).toBe(200);
    const event = await eventAfter(since, 'invoice.paid');
    const invoice = event.data.object as Stripe.Invoice;
    expect(invoice.number).toBeTruthy();
    const newPeriodEnd = ((await renewed.json()) as { items: { data: { current_period_end: number }[] } }).items.data[0]!.current_period_end;
    const before = await org();
    expect(before.currentPeriodEnd!.getTime()).toBeLessThan(newPeriodEnd * 1000);
    const admin = tenant.users.admin.email;
    expect(await receipts(admin, invoice.number!)).toEqual({ waiting: 0, delivered: 0 });

    await withDatabaseDown(cookie, async () => {
      expectRefusedForOutage(await deliver(event));
    });
    expect(await processedRecords(event.id)).toHaveLength(0);
    expect(await receipts(admin, invoice.number!)).toEqual({ waiting: 0, delivered: 0 });
    expect((await org()).currentPeriodEnd!.getTime()).toBe(before.currentPeriodEnd!.getTime());

    const retry = await deliver(event);
    expect(retry.status, JSON.stringify(retry.body)).toBe(204);
    expect((await org()).currentPeriodEnd!.getTime()).toBe(newPeriodEnd * 1000);
    expect(await processedRecords(event.id)).toEqual([{ organisationId: tenant.organisation.id, type: 'invoice.paid' }]);
    // The receipt leaves through the outbox after the answer: wait until it has arrived, then count.
    expect(
      await until(
        'the receipt delivered',
        () => receipts(admin, invoice.number!),
        (r) => r.waiting === 0 && r.delivered >= 1,
        30_000,
      ),
    ).toEqual({
      waiting: 0,
      delivered: 1,
    });

    const third = await deliver(event);
    expect(third.status, JSON.stringify(third.body)).toBe(204);
    expect(await processedRecords(event.id)).toHaveLength(1);
    // A second effect would have queued a second receipt in the same transaction as its answer: none is waiting or sent.
    expect(await receipts(admin, invoice.number!)).toEqual({ waiting: 0, delivered: 1 });
  });
});
