/**
 * The mail server is down: the action that sends mail still succeeds (mail leaves through the outbox after the
 * answer), a failed delivery is kept with its error and a later due time, and the mail arrives once, exactly
 * once, when the server is back.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailOutbox } from '../../backend/src/entities/mail-outbox.entity.js';
import { Invitation } from '../../backend/src/entities/invitation.entity.js';
import { startSmtpSink, type SmtpSink } from '../../backend/src/mail/smtp-sink.js';
import { createTenant, CSRF, signedInAgent, uniqueEmail, type TenantFixture } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let tenant: TenantFixture;
let admin: TestAgent;
let revived: SmtpSink | undefined;

describe('SMTP down', { timeout: 60_000 }, () => {
  beforeAll(async () => {
    t = await createTestApp();
    tenant = await createTenant(t.dataSource, 'smtp-down');
    admin = await signedInAgent(t.app, tenant.users.admin.email);
  });
  afterAll(async () => {
    await revived?.close();
    await t?.close();
  });

  it('an invitation is made while the mail server is down; its mail waits, is retried later, and arrives once when the server is back', async () => {
    const port = t.smtpSink.port;
    await t.smtpSink.close();

    const email = uniqueEmail('invited-while-down');
    const res = await admin.post('/api/invitations').set(CSRF).send({ email, role: 'viewer' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(await t.dataSource.getRepository(Invitation).countBy({ email })).toBe(1);

    // A delivery attempt while the server is down fails and keeps the mail, due again later.
    const attemptedAt = Date.now();
    expect(await t.deliverMail()).toBeGreaterThanOrEqual(1);
    const [waiting] = await t.dataSource.getRepository(MailOutbox).findBy({ recipient: email });
    expect(waiting).toBeDefined();
    expect(waiting!.attempts).toBe(1);
    expect(waiting!.failedAt).toBeNull();
    expect(waiting!.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(waiting!.availableAt.getTime()).toBeGreaterThan(attemptedAt + 20_000);
    // Not due yet: another pass leaves it alone.
    await t.deliverMail();
    expect((await t.dataSource.getRepository(MailOutbox).findOneByOrFail({ id: waiting!.id })).attempts).toBe(1);

    // The server is back on its port; the retry falls due (moved to now instead of waiting out the back-off).
    revived = await startSmtpSink({ port, dataSource: t.dataSource });
    await t.dataSource.query('UPDATE mail_outbox SET availableAt = NOW(3) WHERE id = ?', [waiting!.id]);
    const received = await t.mailTo(email);
    expect(received).toHaveLength(1);
    expect(received[0]!.subject).toMatch(/invit/i);
    expect(await t.dataSource.getRepository(MailOutbox).countBy({ recipient: email })).toBe(0);
    // Delivered once: a further pass sends nothing more.
    await t.deliverMail();
    expect(await t.mailTo(email)).toHaveLength(1);
  });
});
