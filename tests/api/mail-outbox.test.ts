/** The mail outbox: requests queue mail, a loop delivers it afterwards, a hung SMTP server holds nothing up. */
import net from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mailDelivery } from '../../backend/src/mail/delivery.js';
import { createMailer, createOutboxMailer } from '../../backend/src/mail/mailer.js';
import { drainOutbox } from '../../backend/src/mail/outbox.js';
import { uniqueEmail } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('mail outbox', () => {
  let t: TestApp;
  let hung: net.Server;
  const held: net.Socket[] = [];
  beforeAll(async () => {
    t = await createTestApp();
    // An SMTP server that accepts the connection and never says a word.
    hung = net.createServer((socket) => held.push(socket));
    await new Promise<void>((resolve) => hung.listen(0, '127.0.0.1', () => resolve()));
  });
  afterAll(async () => {
    for (const s of held) s.destroy();
    await new Promise<void>((resolve) => hung.close(() => resolve()));
    await t?.close();
  });

  it('a mail server that never answers: the attempt ends at the SMTP time limit and the mail waits for a later attempt', async () => {
    const to = uniqueEmail('patient');
    await createOutboxMailer(t.dataSource).send({ to, subject: 'Queued', text: 'Hello' });
    const port = (hung.address() as net.AddressInfo).port;
    const stuck = mailDelivery(t.config, createMailer({ sinkPort: port, from: t.config.MAIL_FROM, timeoutMs: 300 }));
    await drainOutbox(t.dataSource, stuck);
    const [row] = await t.dataSource.query(
      'SELECT attempts, lastError, claimedBy, failedAt, availableAt > NOW(3) AS later FROM mail_outbox WHERE recipient = ?',
      [to],
    );
    expect(row).toMatchObject({ attempts: 1, claimedBy: null, failedAt: null });
    expect(row.lastError).toMatch(/timeout|greeting/i);
    expect(Number(row.later)).toBe(1);

    // Later, with a server that answers, it goes out once.
    await t.dataSource.query('UPDATE mail_outbox SET availableAt = NOW(3) WHERE recipient = ?', [to]);
    await t.deliverMail();
    expect((await t.mailTo(to)).map((m) => m.subject)).toEqual(['Queued']);
    expect(await t.dataSource.query('SELECT id FROM mail_outbox WHERE recipient = ?', [to])).toEqual([]);
  });

  it('two processes delivering at once send each mail once', async () => {
    const recipients = Array.from({ length: 12 }, (_, i) => uniqueEmail(`once${i}`));
    for (const to of recipients) await t.mailer.send({ to, subject: 'Exactly once', text: 'x' });
    const delivery = mailDelivery(t.config, createMailer({ sinkPort: t.smtpSink.port, from: t.config.MAIL_FROM }));
    const [a, b] = await Promise.all([drainOutbox(t.dataSource, delivery), drainOutbox(t.dataSource, delivery)]);
    expect(a + b).toBe(recipients.length);
    for (const to of recipients) expect(await t.mailTo(to)).toHaveLength(1);
  });
});
