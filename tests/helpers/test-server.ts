import { existsSync } from 'node:fs';
import path from 'node:path';
import { inject } from 'vitest';
import { bootstrap, type Running } from '../../backend/src/bootstrap.js';
import { loadConfig } from '../../backend/src/config.js';
import { buildDataSource } from '../../backend/src/data-source.js';
import { sinkMessagesFor, type SinkMessageView } from '../../backend/src/mail/smtp-sink.js';
import { createEmptyDatabase } from './test-database.js';

const distDir = path.resolve(import.meta.dirname, '..', '..', 'frontend', 'dist');

/**
 * The whole product on a free port: fresh database with the demo seed, built front end, the local SMTP sink
 * and the mail delivery loop. `mailTo` reads the sink's mail from MariaDB, as the terminal would show it.
 */
export interface TestServer extends Running {
  mailTo: (to: string) => Promise<SinkMessageView[]>;
  /** Mail still waiting in the outbox, with the last delivery error: what a test names when a message never came. */
  mailWaiting: () => Promise<{ kind: string; recipient: string; attempts: number; lastError: string | null }[]>;
}

export async function startTestServer(options: { demoData?: 'full' | 'people' } = {}): Promise<TestServer> {
  if (!existsSync(path.join(distDir, 'index.html'))) {
    throw new Error('frontend/dist is missing: npm test builds it first (or run `npx vite build`)');
  }
  const db = createEmptyDatabase('e2e');
  const config = loadConfig({
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    PORT: '0',
    SMTP_SINK_PORT: '0',
    DB_HOST: db.host,
    DB_PORT: String(db.port),
    DB_NAME: db.database,
    DB_USER: db.user,
    DB_PASSWORD: db.password,
    DEMO_DATA: options.demoData ?? 'people',
    STRIPE_API_BASE: inject('stripeApiBase'),
  });
  // The demo is made on a fixed day, so its dates (and the browser tests that read them) are the same every run.
  const running = await bootstrap(config, { staticDir: distDir, demoDay: { today: '2026-01-01' } });
  const reader = buildDataSource(db);
  await reader.initialize();
  return {
    url: running.url,
    mailTo: (to) => sinkMessagesFor(reader, to),
    mailWaiting: () => reader.query('SELECT kind, recipient, attempts, lastError FROM mail_outbox ORDER BY createdAt'),
    close: async () => {
      await running.close();
      await reader.destroy();
    },
  };
}
