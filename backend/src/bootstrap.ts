/** Connects to the database, migrates, seeds an empty database, and serves the app. Used by server.ts and npm start. */
import type { Server } from 'node:http';
import { createApp } from './app.js';
import { publicUrl, type Config } from './config.js';
import { buildDataSource } from './data-source.js';
import { createLogger } from './logger.js';
import { mailDelivery } from './mail/delivery.js';
import { createMailer, createOutboxMailer } from './mail/mailer.js';
import { startOutboxWorker } from './mail/outbox.js';
import { startSmtpSink, type SmtpSink } from './mail/smtp-sink.js';
import { JOB_HANDLERS } from './jobs/job-handlers.js';
import { startJobWorker } from './jobs/job-worker.js';
import { startAlertChecks } from './services/alerts/alert-checks.js';
import { startUploadHousekeeping } from './services/upload-housekeeping.js';
import { seedDemoIfEmpty } from './seed/demo-seed.js';
import type { DemoDay } from './seed/demo-units-seed.js';
import { withinTime } from './time-limit.js';
import { createBillingContext } from './services/billing/billing-context.js';
import { prepareBilling, startTrialEndingMails } from './services/billing/prepare-billing.js';
import { seedDemoBilling } from './seed/demo-billing-seed.js';

export interface Running {
  url: string;
  /** Stops everything this process started; every step has a time limit, so it always returns. */
  close: () => Promise<void>;
}

export interface BootstrapOptions {
  staticDir?: string;
  seed?: boolean;
  log?: (line: string) => void;
  /** Where the local sink prints each message it receives (default: the terminal, except in tests). */
  printMail?: (text: string) => void;
  /** The day the demo history is made on (tests fix it); each plant's own today by default. */
  demoDay?: DemoDay;
}

/** Time limits of the stop steps: a running job or a hung fake must not keep the process (or MariaDB) alive. */
export const STOP_LIMITS_MS = { http: 3_000, jobs: 5_000, mail: 3_000, sessions: 2_000, sink: 2_000, database: 3_000 };

export async function bootstrap(config: Config, options: BootstrapOptions = {}): Promise<Running> {
  const logger = createLogger(config.LOG_LEVEL, { pretty: config.NODE_ENV !== 'production' });
  const log = options.log ?? ((line: string) => logger.info(line));
  const dataSource = buildDataSource({
    host: config.DB_HOST,
    port: config.DB_PORT,
    database: config.DB_NAME,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
  });
  await dataSource.initialize();
  const applied = await dataSource.runMigrations({ transaction: 'each' });
  if (applied.length) logger.info({ migrations: applied.map((m) => m.name) }, 'migrations applied');
  let seededDemo = false;
  if (options.seed !== false && config.DEMO_DATA !== 'none') {
    seededDemo = await seedDemoIfEmpty(dataSource, log, config.DEMO_DATA === 'full', options.demoDay);
  }

  // The local sink runs only without SMTP_URL, which config allows only on a loopback HOST.
  let sink: SmtpSink | null = null;
  let sinkPort = config.SMTP_SINK_PORT;
  if (!config.SMTP_URL) {
    const print = options.printMail ?? (config.NODE_ENV === 'test' ? undefined : (text: string) => console.log(text));
    try {
      sink = await startSmtpSink({ port: config.SMTP_SINK_PORT, dataSource, print });
      sinkPort = sink.port;
      log(`SMTP sink on 127.0.0.1:${sink.port}: each message is printed here and shown to its addressee at /mailbox`);
    } catch (err) {
      if ((err as { code?: string }).code !== 'EADDRINUSE') throw err;
      log(`SMTP sink port ${config.SMTP_SINK_PORT} is taken (another Cleancase process?): mail goes to the sink listening there`);
    }
  }
  const transport = createMailer({ smtpUrl: config.SMTP_URL, sinkPort, from: config.MAIL_FROM });

  const app = createApp({ config, dataSource, logger, mailer: createOutboxMailer(dataSource), devMailbox: !config.SMTP_URL, staticDir: options.staticDir });
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
    s.once('error', reject);
  });
  const address = server.address();
  // PORT 0 asks for any free port: from here on the configuration names the one we got (links in e-mail use it).
  if (typeof address === 'object' && address) config.PORT = address.port;
  const background = config.JOB_WORKER === 'on';
  const worker = background ? startJobWorker(dataSource, JOB_HANDLERS, logger) : null;
  const outbox = background ? startOutboxWorker(dataSource, mailDelivery(config, transport), logger) : null;

  // Our prices in Stripe, read back; the local stand-in learns where to deliver events (the port is known now).
  const billing = createBillingContext(dataSource, config);
  await prepareBilling(billing, log);
  if (seededDemo) await seedDemoBilling(billing, log);
  const trialMail = background ? startTrialEndingMails(dataSource, config, log) : null;
  const alertChecks = background ? startAlertChecks(dataSource, log) : null;
  const uploadHousekeeping = background ? startUploadHousekeeping(dataSource, log) : null;

  const report = (line: string) => logger.warn(line);
  return {
    url: publicUrl(config),
    close: async () => {
      // Stop taking requests; open keep-alive and in-flight connections are closed, not waited for.
      await withinTime(
        'closing the HTTP server',
        STOP_LIMITS_MS.http,
        () => {
          const closed = new Promise<void>((resolve) => server.close(() => resolve()));
          server.closeAllConnections();
          return closed;
        },
        report,
      );
      // A job still running keeps its lock and is taken over after a restart; it is not waited for beyond the limit.
      trialMail?.stop();
      alertChecks?.stop();
      uploadHousekeeping?.stop();
      if (worker) await withinTime('stopping the job worker', STOP_LIMITS_MS.jobs, () => worker.stop(), report);
      if (outbox) await withinTime('stopping mail delivery', STOP_LIMITS_MS.mail, () => outbox.stop(STOP_LIMITS_MS.mail - 500), report);
      await withinTime('closing the session store', STOP_LIMITS_MS.sessions, () => app.locals.close(), report);
      if (sink) await withinTime('stopping the SMTP sink', STOP_LIMITS_MS.sink, () => sink.close(), report);
      await withinTime('closing the database connections', STOP_LIMITS_MS.database, () => dataSource.destroy(), report);
    },
  };
}
