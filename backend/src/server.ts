/**
 * Production entry: every service is external (DB_*, SMTP_URL, Stripe, Google from the environment).
 * `npm start` uses scripts/start.ts instead, which also starts the local database and fakes.
 */
import path from 'node:path';
import { bootstrap } from './bootstrap.js';
import { loadConfig } from './config.js';

const config = loadConfig();
const running = await bootstrap(config, { staticDir: path.resolve(import.meta.dirname, '..', '..', config.FRONTEND_DIST_DIR) });
console.log(`Cleancase is serving on ${running.url}`);
const stop = async () => {
  await running.close();
  process.exit(0);
};
process.once('SIGINT', stop);
process.once('SIGTERM', stop);
