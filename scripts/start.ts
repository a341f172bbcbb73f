/**
 * `npm start`: the whole product on this machine. Installs Debian's MariaDB when missing, starts a private
 * instance under .data/, migrates and seeds the demo scenario, starts the local fakes (Stripe, Google, SMTP),
 * builds the front end and serves API + app from one process. Ctrl-C stops everything it started: each step
 * has a time limit, and MariaDB's clean shutdown runs last whatever else hangs.
 *
 * Runs as `node --import tsx` (see package.json), not through the tsx command: tsx's own parent process
 * SIGKILLs its child when the child's event loop does not acknowledge Ctrl-C within a few milliseconds (for
 * example during a recompute), which left MariaDB running.
 */
import path from 'node:path';
import { build } from 'vite';
import { bootstrap, STOP_LIMITS_MS, type Running } from '../backend/src/bootstrap.js';
import { loadConfig, type Config } from '../backend/src/config.js';
import { demoSignIns } from '../backend/src/seed/demo-seed.js';
import { withinTime } from '../backend/src/time-limit.js';
import { startMariaDb, type MariaDbInstance } from './lib/mariadb.js';
import { startGoogleFake, startStripeFake, type GoogleFake, type StripeFake } from './lib/local-services.js';

const root = path.resolve(import.meta.dirname, '..');
const log = (line: string) => console.log(`[cleancase] ${line}`);

interface StopStep {
  label: string;
  limitMs: number;
  run: () => Promise<void>;
}

const steps: StopStep[] = [];
let database: MariaDbInstance | null = null;
let stopping = false;

async function stopDatabase(): Promise<void> {
  const db = database;
  database = null;
  if (!db) return;
  await db.stop();
  log('MariaDB shut down cleanly');
}

async function stopAll(code: number): Promise<never> {
  if (stopping) {
    // A second Ctrl-C: skip what is left and go straight to the database shutdown.
    log('Stopping now: shutting MariaDB down…');
    await stopDatabase();
    process.exit(code);
  }
  stopping = true;
  log('Stopping…');
  for (const step of steps.reverse()) await withinTime(step.label, step.limitMs, step.run, log);
  await stopDatabase();
  log('Stopped. Data is kept in .data/ for the next start.');
  process.exit(code);
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));
process.on('SIGHUP', () => void stopAll(0));

try {
  const config: Config = loadConfig();
  if (!config.DB_EXTERNAL) {
    database = await startMariaDb({
      dataDir: path.resolve(root, config.DB_DATA_DIR),
      port: config.DB_PORT,
      database: config.DB_NAME,
      user: config.DB_USER,
      password: config.DB_PASSWORD,
      log,
    });
  }

  if (!config.STRIPE_API_BASE && config.STRIPE_SECRET_KEY.startsWith('sk_test_cleancase')) {
    const stripe: StripeFake = await startStripeFake(config.STRIPE_FAKE_PORT, config.STRIPE_WEBHOOK_SECRET);
    steps.push({ label: 'stopping the Stripe fake', limitMs: 8_000, run: stripe.stop });
    config.STRIPE_API_BASE = stripe.apiBase;
    log(`Stripe fake (stripe-stateful-mock) on ${stripe.apiBase}`);
  }
  if (!config.GOOGLE_AUTH_URL) {
    const google: GoogleFake = await startGoogleFake(config.GOOGLE_FAKE_PORT);
    steps.push({ label: 'stopping the Google sign-in fake', limitMs: 3_000, run: google.stop });
    Object.assign(config, { GOOGLE_AUTH_URL: google.authUrl, GOOGLE_TOKEN_URL: google.tokenUrl, GOOGLE_USERINFO_URL: google.userInfoUrl });
    log(`Google sign-in fake (oauth2-mock-server) on ${google.issuer}`);
  }

  log('Building the front end…');
  const distDir = path.resolve(root, config.FRONTEND_DIST_DIR);
  await build({ configFile: path.join(root, 'vite.config.ts'), logLevel: 'warn', mode: 'production', build: { outDir: distDir } });

  const running: Running = await bootstrap(config, {
    staticDir: distDir,
    log,
    printMail: (text) => console.log(`[cleancase] ${text.replaceAll('\n', '\n[cleancase] ')}`),
  });
  // Its own steps are time-limited; this limit covers them all.
  const appLimit = Object.values(STOP_LIMITS_MS).reduce((a, b) => a + b, 0) + 1_000;
  steps.push({ label: 'stopping the app', limitMs: appLimit, run: running.close });

  log(`Cleancase is ready: ${running.url}`);
  log('Demo sign-ins (fictional people and organisations):');
  for (const s of demoSignIns()) log(`  ${s.email.padEnd(32)} ${s.password}   ${s.name} — ${s.roles}`);
  log('Press Ctrl-C to stop everything.');
} catch (err) {
  console.error(`[cleancase] Could not start: ${err instanceof Error ? err.message : String(err)}`);
  await stopAll(1);
}
