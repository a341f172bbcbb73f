import type { DataSource } from 'typeorm';
import { createApp, type CleancaseApp } from '../../backend/src/app.js';
import { loadConfig, type Config } from '../../backend/src/config.js';
import { createLogger } from '../../backend/src/logger.js';
import { createMailer } from '../../backend/src/mail/mailer.js';
import { startSmtpSink, type SmtpSink } from '../../backend/src/mail/smtp-sink.js';
import { migratedDataSource } from './test-database.js';

export interface TestApp {
  app: CleancaseApp;
  dataSource: DataSource;
  config: Config;
  smtpSink: SmtpSink;
  close: () => Promise<void>;
}

/** createApp() in process against a fresh migrated database and a private SMTP sink. */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const { dataSource, connection } = await migratedDataSource();
  const smtpSink = await startSmtpSink(0);
  const config = loadConfig({
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    DB_HOST: connection.host,
    DB_PORT: String(connection.port),
    DB_NAME: connection.database,
    DB_USER: connection.user,
    DB_PASSWORD: connection.password,
    PORT: '0',
    ...env,
  });
  const app = createApp({
    config,
    dataSource,
    logger: createLogger('silent'),
    mailer: createMailer({ sinkPort: smtpSink.port, from: config.MAIL_FROM }),
    smtpSink,
  });
  return {
    app,
    dataSource,
    config,
    smtpSink,
    close: async () => {
      await app.locals.close();
      await smtpSink.close();
      await dataSource.destroy();
    },
  };
}
