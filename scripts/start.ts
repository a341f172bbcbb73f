/**
 * `npm start`: the whole product on this machine. Installs Debian's MariaDB when missing, starts a private
 * instance under .data/, migrates and seeds the demo scenario, starts the local fakes (Stripe, Google, SMTP),
 * builds the front end and serves API + app from one process. Ctrl-C stops everything it started.
 */
import path from 'node:path';
import { build } from 'vite';
import { bootstrap, type Running } from '../backend/src/bootstrap.js';
import { loadConfig, type Config } from '../backend/src/config.js';
import { demoSignIns } from '../backend/src/seed/demo-seed.js';
import { startMariaDb, type MariaDbInstance } from './lib/mariadb.js';
import { startGoogleFake, startSmtpSink, startStripeFake, type GoogleFake, type SmtpSink, type StripeFake } from './lib/local-services.js';

const root = path.resolve(import.meta.dirname, '..');
const log = (line: string) => console.log(`[cleancase] ${line}`);

const stops: (() => Promise<void>)[] = [];
let stopping = false;
async function stopAll(code: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    log('Stopping…');
    for (const stop of stops.reverse()) {
      try {
        await stop();
      } catch (err) {
        console.error(err);
      }
    }
    log('Stopped. Data is kept in .data/ for the next start.');
  }
  process.exit(code);
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

try {
  const config: Config = loadConfig();
  if (!config.DB_EXTERNAL) {
    const db: MariaDbInstance = await startMariaDb({
      dataDir: path.resolve(root, config.DB_DATA_DIR),
      port: config.DB_PORT,
      database: config.DB_NAME,
      user: config.DB_USER,
      password: config.DB_PASSWORD,
      log,
    });
    stops.push(() => db.stop().then(() => log('MariaDB shut down cleanly')));
  }

  if (!config.STRIPE_API_BASE && config.STRIPE_SECRET_KEY.startsWith('sk_test_cleancase')) {
    const stripe: StripeFake = await startStripeFake(config.STRIPE_FAKE_PORT);
    stops.push(stripe.stop);
    config.STRIPE_API_BASE = stripe.apiBase;
    log(`Stripe fake (stripe-stateful-mock) on ${stripe.apiBase}`);
  }
  if (!config.GOOGLE_AUTH_URL) {
    const google: GoogleFake = await startGoogleFake(config.GOOGLE_FAKE_PORT);
    stops.push(google.stop);
    Object.assign(config, { GOOGLE_AUTH_URL: google.authUrl, GOOGLE_TOKEN_URL: google.tokenUrl, GOOGLE_USERINFO_URL: google.userInfoUrl });
    log(`Google sign-in fake (oauth2-mock-server) on ${google.issuer}`);
  }
  let smtpSink: SmtpSink | undefined;
  if (!config.SMTP_URL) {
    smtpSink = await startSmtpSink(config.SMTP_SINK_PORT);
    stops.push(smtpSink.close);
    log(`SMTP sink on 127.0.0.1:${smtpSink.port} (messages at /mailbox)`);
  }

  log('Building the front end…');
  const distDir = path.resolve(root, config.FRONTEND_DIST_DIR);
  await build({ configFile: path.join(root, 'vite.config.ts'), logLevel: 'warn', mode: 'production', build: { outDir: distDir } });

  const running: Running = await bootstrap(config, { smtpSink, staticDir: distDir, log });
  stops.push(running.close);

  log(`Cleancase is ready: ${running.url}`);
  log('Demo sign-ins (fictional people and organisations):');
  for (const s of demoSignIns()) log(`  ${s.email.padEnd(32)} ${s.password}   ${s.name} — ${s.roles}`);
  log('Press Ctrl-C to stop everything.');
} catch (err) {
  console.error(`[cleancase] Could not start: ${err instanceof Error ? err.message : String(err)}`);
  await stopAll(1);
}
