/**
 * The API in a process of its own for the latency bench (so the load generator does not share its event loop):
 * createApp on loopback against the database named in the environment, no job worker, no demo seed. Prints
 * `{"port": n}` once listening; stops on SIGTERM.
 */
import { createApp } from '../../backend/src/app.js';
import { loadConfig } from '../../backend/src/config.js';
import { buildDataSource } from '../../backend/src/data-source.js';
import { createLogger } from '../../backend/src/logger.js';
import { createOutboxMailer } from '../../backend/src/mail/mailer.js';

const env = process.env;
const config = loadConfig({ ...env, NODE_ENV: 'development', LOG_LEVEL: 'silent', PORT: '0', JOB_WORKER: 'off', DEMO_DATA: 'none' });
const dataSource = buildDataSource({
  host: config.DB_HOST,
  port: config.DB_PORT,
  database: config.DB_NAME,
  user: config.DB_USER,
  password: config.DB_PASSWORD,
});
await dataSource.initialize();
const app = createApp({ config, dataSource, logger: createLogger('silent'), mailer: createOutboxMailer(dataSource) });
const server = app.listen(0, '127.0.0.1', () => {
  const address = server.address();
  process.stdout.write(`${JSON.stringify({ port: typeof address === 'object' && address ? address.port : 0 })}\n`);
});
process.on('SIGTERM', () => {
  server.close(() => {
    void app.locals
      .close()
      .then(() => dataSource.destroy())
      .finally(() => process.exit(0));
  });
  server.closeAllConnections();
});
