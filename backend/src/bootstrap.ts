/** Connects to the database, migrates, seeds an empty database, and serves the app. Used by server.ts and npm start. */
import type { Server } from 'node:http';
import { createApp } from './app.js';
import { publicUrl, type Config } from './config.js';
import { buildDataSource } from './data-source.js';
import { createLogger } from './logger.js';
import { createMailer } from './mail/mailer.js';
import type { SmtpSink } from './mail/smtp-sink.js';
import { JOB_HANDLERS } from './jobs/job-handlers.js';
import { startJobWorker } from './jobs/job-worker.js';
import { seedDemoIfEmpty } from './seed/demo-seed.js';

export interface Running {
  url: string;
  close: () => Promise<void>;
}

export async function bootstrap(config: Config, options: { smtpSink?: SmtpSink; staticDir?: string; seed?: boolean; log?: (line: string) => void } = {}): Promise<Running> {
  const logger = createLogger(config.LOG_LEVEL);
  const dataSource = buildDataSource({ host: config.DB_HOST, port: config.DB_PORT, database: config.DB_NAME, user: config.DB_USER, password: config.DB_PASSWORD });
  await dataSource.initialize();
  const applied = await dataSource.runMigrations({ transaction: 'each' });
  if (applied.length) logger.info({ migrations: applied.map((m) => m.name) }, 'migrations applied');
  if (options.seed !== false && config.DEMO_DATA !== 'none') {
    await seedDemoIfEmpty(dataSource, options.log ?? ((line) => logger.info(line)), config.DEMO_DATA === 'full');
  }

  const mailer = createMailer({ smtpUrl: config.SMTP_URL, sinkPort: options.smtpSink?.port, from: config.MAIL_FROM });
  const app = createApp({ config, dataSource, logger, mailer, smtpSink: options.smtpSink, staticDir: options.staticDir });
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
    s.once('error', reject);
  });
  const worker = config.JOB_WORKER === 'on' ? startJobWorker(dataSource, JOB_HANDLERS, logger) : null;
  const address = server.address();
  // PORT 0 asks for any free port: from here on the configuration names the one we got (links in e-mail use it).
  if (typeof address === 'object' && address) config.PORT = address.port;
  return {
    url: publicUrl(config),
    close: async () => {
      await worker?.stop();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await app.locals.close();
      await dataSource.destroy();
    },
  };
}
