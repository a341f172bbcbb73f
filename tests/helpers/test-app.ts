import type { DataSource } from 'typeorm';
import { inject } from 'vitest';
import { createApp, type CleancaseApp } from '../../backend/src/app.js';
import { loadConfig, type Config } from '../../backend/src/config.js';
import { createLogger } from '../../backend/src/logger.js';
import { mailDelivery } from '../../backend/src/mail/delivery.js';
import { createMailer, createOutboxMailer, type Mailer } from '../../backend/src/mail/mailer.js';
import { drainOutbox } from '../../backend/src/mail/outbox.js';
import { sinkMessagesFor, startSmtpSink, type SinkMessageView, type SmtpSink } from '../../backend/src/mail/smtp-sink.js';
import { migratedDataSource } from './test-database.js';

export interface TestApp {
  app: CleancaseApp;
  dataSource: DataSource;
  config: Config;
  smtpSink: SmtpSink;
  /** What the routes use to send mail: it only adds to the outbox. */
  mailer: Mailer;
  /** Delivers the outbox now, synchronously, to the private SMTP sink; returns how many rows it handled. */
  deliverMail: () => Promise<number>;
  /** Delivers the outbox, then returns the sink's mail to `to`, newest first. */
  mailTo: (to: string) => Promise<SinkMessageView[]>;
  close: () => Promise<void>;
}

/** createApp() in process against a fresh migrated database, a mail outbox and a private SMTP sink (no loop: tests deliver). */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const { dataSource, connection } = await migratedDataSource();
  const smtpSink = await startSmtpSink({ port: 0, dataSource });
  const config = loadConfig({
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    DB_HOST: connection.host,
    DB_PORT: String(connection.port),
    DB_NAME: connection.database,
    DB_USER: connection.user,
    DB_PASSWORD: connection.password,
    PORT: '0',
    STRIPE_API_BASE: inject('stripeApiBase'),
    ...env,
  });
  const mailer = createOutboxMailer(dataSource);
  const delivery = mailDelivery(config, createMailer({ sinkPort: smtpSink.port, from: config.MAIL_FROM }));
  const deliverMail = () => drainOutbox(dataSource, delivery);
  const app = createApp({ config, dataSource, logger: createLogger('silent'), mailer, devMailbox: true });
  return {
    app,
    dataSource,
    config,
    smtpSink,
    mailer,
    deliverMail,
    mailTo: async (to) => {
      await deliverMail();
      return sinkMessagesFor(dataSource, to);
    },
    close: async () => {
      await app.locals.close();
      await smtpSink.close();
      await dataSource.destroy();
    },
  };
}
