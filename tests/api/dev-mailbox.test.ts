/**
 * The local mailbox (local runs without SMTP_URL): signed-in people only, each sees only mail addressed to them,
 * every message is kept in MariaDB (so every app process shows the same mail) and printed to the terminal.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../backend/src/app.js';
import { publicUrl } from '../../backend/src/config.js';
import { createLogger } from '../../backend/src/logger.js';
import { createMailer } from '../../backend/src/mail/mailer.js';
import { startSmtpSink } from '../../backend/src/mail/smtp-sink.js';
import { User } from '../../backend/src/entities/user.entity.js';
import { createTenant, createUser, CSRF, signedInAgent, TEST_PASSWORD, uniqueEmail } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

interface MailboxMessage {
  to: string[];
  subject: string;
  text: string;
}

describe('local mailbox', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('answers nobody who is not signed in', async () => {
    const someone = await createUser(t.dataSource, 'mailbox-anon');
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: someone.email }).expect(202);
    await t.deliverMail();
    const res = await request(t.app).get('/api/dev/mailbox');
    expect(res.status).toBe(401);
    expect(JSON.stringify(res.body)).not.toContain('reset-password');
  });

  it('shows a signed-in person only the messages addressed to them', async () => {
    const alice = await createUser(t.dataSource, 'mailbox-alice');
    const bob = await createUser(t.dataSource, 'mailbox-bob');
    for (const email of [alice.email, bob.email]) await request(t.app).post('/api/password-reset').set(CSRF).send({ email }).expect(202);
    await t.deliverMail();

    const agent = await signedInAgent(t.app, alice.email);
    const messages: MailboxMessage[] = (await agent.get('/api/dev/mailbox').expect(200)).body.messages;
    expect(messages.length).toBeGreaterThanOrEqual(1);
    expect(messages.every((m) => m.to.length === 1 && m.to[0] === alice.email)).toBe(true);
    expect(messages.map((m) => m.subject)).toContain('Reset your Cleancase password');
    expect(JSON.stringify(messages)).not.toContain(bob.email);
  });

  it('keeps the mail in MariaDB, so another app process on the same database shows it', async () => {
    const carol = await createUser(t.dataSource, 'mailbox-carol');
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: carol.email }).expect(202);
    await t.deliverMail();
    const [row] = await t.dataSource.query('SELECT subject FROM sink_message WHERE recipient = ?', [carol.email]);
    expect(row.subject).toBe('Reset your Cleancase password');

    // A second process: its own app on the same database, with no sink of its own.
    const second = createApp({ config: t.config, dataSource: t.dataSource, logger: createLogger('silent'), mailer: t.mailer, devMailbox: true });
    try {
      const agent = await signedInAgent(second, carol.email);
      const messages: MailboxMessage[] = (await agent.get('/api/dev/mailbox').expect(200)).body.messages;
      expect(messages.map((m) => m.subject)).toEqual(['Reset your Cleancase password']);
    } finally {
      await second.locals.close();
    }
  });

  it('prints every message it receives to the terminal, so someone who cannot sign in can follow the link', async () => {
    const printed: string[] = [];
    const sink = await startSmtpSink({ port: 0, dataSource: t.dataSource, print: (text) => printed.push(text) });
    try {
      await createMailer({ sinkPort: sink.port, from: t.config.MAIL_FROM }).send({
        to: 'locked.out@example.test',
        subject: 'Reset your Cleancase password',
        text: 'Choose a new password: http://127.0.0.1:3000/reset-password?token=abc',
      });
      expect(printed.join('\n')).toContain('locked.out@example.test');
      expect(printed.join('\n')).toContain('http://127.0.0.1:3000/reset-password?token=abc');
    } finally {
      await sink.close();
    }
  });

  it('is not there when the app sends real mail', async () => {
    const real = createApp({ config: t.config, dataSource: t.dataSource, logger: createLogger('silent'), mailer: t.mailer, devMailbox: false });
    try {
      const someone = await createUser(t.dataSource, 'mailbox-real');
      const agent = await signedInAgent(real, someone.email);
      await agent.get('/api/dev/mailbox').expect(404);
      expect((await agent.get('/api/session').expect(200)).body.devMailbox).toBe(false);
    } finally {
      await real.locals.close();
    }
  });

  /** The token of the newest `pathPart` link the sink holds for `to` (read from the sink, as the terminal shows it). */
  async function tokenMailedTo(to: string, pathPart: string): Promise<string> {
    const mail = (await t.mailTo(to)).find((m) => m.text.includes(`/${pathPart}?token=`));
    const token = mail?.text.match(new RegExp(`/${pathPart}\\?token=([A-Za-z0-9_%-]+)`))?.[1];
    if (!token) throw new Error(`no ${pathPart} link mailed to ${to}`);
    return decodeURIComponent(token);
  }

  const mailbox = async (agent: Awaited<ReturnType<typeof signedInAgent>>) =>
    (await agent.get('/api/dev/mailbox').expect(200)).body as { messages: MailboxMessage[]; addressConfirmed: boolean };
  const signUp = (email: string, password = TEST_PASSWORD) =>
    request(t.app).post('/api/sign-up').set(CSRF).send({ name: 'Self Signed', email, password, organisationName: 'Own Utility' }).expect(201);

  it('someone who signs up with an invited address never sees the invitation, sent before or after the sign-up', async () => {
    const tenant = await createTenant(t.dataSource, 'mailbox-inviter');
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    const newhire = uniqueEmail('newhire');
    await admin.post('/api/invitations').set(CSRF).send({ email: newhire, role: 'admin' }).expect(201);
    await t.deliverMail();

    await signUp(newhire);
    const attacker = await signedInAgent(t.app, newhire);
    await admin.post('/api/invitations').set(CSRF).send({ email: newhire, role: 'admin' }).expect(201);
    await t.deliverMail();

    const seen = await mailbox(attacker);
    expect(seen.addressConfirmed).toBe(false);
    expect(seen.messages).toEqual([]);
    expect(JSON.stringify(seen)).not.toContain('invitation?token=');
  });

  it('a person who signed up sees mail only once they confirmed the address, and only mail received after that', async () => {
    const email = uniqueEmail('self-signed');
    await signUp(email);
    const agent = await signedInAgent(t.app, email);
    const token = await tokenMailedTo(email, 'confirm-address');
    expect((await t.mailTo(email))[0]?.text).toContain(`${publicUrl(t.config)}/confirm-address?token=`);
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email }).expect(202);
    await t.deliverMail();
    expect((await mailbox(agent)).messages).toEqual([]);

    await request(t.app).post('/api/address-confirmations').set(CSRF).send({ token }).expect(204);
    const confirmed = await mailbox(agent);
    expect(confirmed.addressConfirmed).toBe(true);
    expect(confirmed.messages).toEqual([]);

    await request(t.app).post('/api/password-reset').set(CSRF).send({ email }).expect(202);
    await t.deliverMail();
    expect((await mailbox(agent)).messages.map((m) => m.subject)).toEqual(['Reset your Cleancase password']);
    // The link works once.
    const again = await request(t.app).post('/api/address-confirmations').set(CSRF).send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatch(/no longer valid/);
  });

  it('an expired confirmation link proves nothing', async () => {
    const email = uniqueEmail('late');
    await signUp(email);
    const token = await tokenMailedTo(email, 'confirm-address');
    await t.dataSource.query('UPDATE address_confirmation_token SET expiresAt = NOW(3) - INTERVAL 1 MINUTE');
    await request(t.app).post('/api/address-confirmations').set(CSRF).send({ token }).expect(400);
    expect((await t.dataSource.getRepository(User).findOneByOrFail({ email })).emailProvenAt).toBeNull();
  });

  it('a person who accepted an invitation sees their later mail', async () => {
    const tenant = await createTenant(t.dataSource, 'mailbox-invited');
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    const invitee = uniqueEmail('invitee');
    await admin.post('/api/invitations').set(CSRF).send({ email: invitee, role: 'viewer' }).expect(201);
    const token = await tokenMailedTo(invitee, 'invitation');
    await request(t.app)
      .post(`/api/invitation-links/${encodeURIComponent(token)}/accept`)
      .set(CSRF)
      .send({ name: 'Ivy Invitee', password: TEST_PASSWORD })
      .expect(200);
    const agent = await signedInAgent(t.app, invitee);
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: invitee }).expect(202);
    await t.deliverMail();
    const seen = await mailbox(agent);
    expect(seen.addressConfirmed).toBe(true);
    expect(seen.messages.map((m) => m.subject)).toEqual(['Reset your Cleancase password']);
  });

  it('a person who signed up and then reset the password through the mailed link sees their later mail', async () => {
    const email = uniqueEmail('resetter');
    await signUp(email);
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email }).expect(202);
    const token = await tokenMailedTo(email, 'reset-password');
    const password = 'a new passphrase from the link';
    await request(t.app).post('/api/password-reset/confirm').set(CSRF).send({ token, password }).expect(204);
    const agent = await signedInAgent(t.app, email, password);
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email }).expect(202);
    await t.deliverMail();
    expect((await mailbox(agent)).messages.map((m) => m.subject)).toEqual(['Reset your Cleancase password']);
  });
});
