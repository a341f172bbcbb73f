import { existsSync } from 'node:fs';
import path from 'node:path';
import { bootstrap, type Running } from '../../backend/src/bootstrap.js';
import { loadConfig } from '../../backend/src/config.js';
import { startSmtpSink } from '../../backend/src/mail/smtp-sink.js';
import { createEmptyDatabase } from './test-database.js';

const distDir = path.resolve(import.meta.dirname, '..', '..', 'frontend', 'dist');

/** The whole product on a free port: fresh database with the demo seed, built front end, SMTP sink. */
export async function startTestServer(options: { demoData?: 'full' | 'people' } = {}): Promise<Running & { mailbox: () => ReturnType<Awaited<ReturnType<typeof startSmtpSink>>['messages']> }> {
  if (!existsSync(path.join(distDir, 'index.html'))) {
    throw new Error('frontend/dist is missing: npm test builds it first (or run `npx vite build`)');
  }
  const db = createEmptyDatabase('e2e');
  const smtpSink = await startSmtpSink(0);
  const config = loadConfig({
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    PORT: '0',
    DB_HOST: db.host,
    DB_PORT: String(db.port),
    DB_NAME: db.database,
    DB_USER: db.user,
    DB_PASSWORD: db.password,
    DEMO_DATA: options.demoData ?? 'people',
  });
  const running = await bootstrap(config, { smtpSink, staticDir: distDir });
  return {
    url: running.url,
    mailbox: smtpSink.messages,
    close: async () => {
      await running.close();
      await smtpSink.close();
    },
  };
}
