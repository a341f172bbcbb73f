/**
 * The local mailbox (local runs without SMTP_URL): signed-in people only, each sees only mail addressed to them,
 * every message is kept in MariaDB (so every app process shows the same mail) and printed to the terminal.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../backend/src/app.js';
import { createLogger } from '../../backend/src/logger.js';
import { createMailer } from '../../backend/src/mail/mailer.js';
import { startSmtpSink } from '../../backend/src/mail/smtp-sink.js';
import { createUser, CSRF, signedInAgent } from '../factories/accounts.js';
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
      await createMailer({ sinkPort: sink.port, from: t.config.MAIL_FROM }).send({ to: 'locked.out@example.test', subject: 'Reset your Cleancase password', text: 'Choose a new password: http://127.0.0.1:3000/reset-password?token=abc' });
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
});
