/**
 * A private MariaDB instance: own data folder, own socket and port, bound to 127.0.0.1.
 * Never touches the system service. Used by `npm start` (persistent data under .data/) and by the
 * tests (throwaway folder, free port).
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ensureSystemPackages, MARIADB } from './system-packages.js';

export interface MariaDbOptions {
  dataDir: string;
  port: number;
  database: string;
  user: string;
  password: string;
  log?: (line: string) => void;
}

export interface MariaDbInstance {
  host: '127.0.0.1';
  port: number;
  database: string;
  user: string;
  password: string;
  socket: string;
  pid: number;
  stop: () => Promise<void>;
}

function binary(name: string): string {
  for (const dir of ['/usr/sbin', '/usr/bin']) if (existsSync(path.join(dir, name))) return path.join(dir, name);
  return name;
}

function client(socket: string, sql: string): { ok: boolean; output: string } {
  const r = spawnSync(binary('mariadb'), ['--protocol=socket', `--socket=${socket}`, '-uroot', '-e', sql], { encoding: 'utf8' });
  return { ok: r.status === 0, output: `${r.stdout}${r.stderr}` };
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

const quote = (s: string) => `'${s.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;

export async function startMariaDb(options: MariaDbOptions): Promise<MariaDbInstance> {
  const log = options.log ?? (() => {});
  ensureSystemPackages([MARIADB], log);
  const dataDir = path.resolve(options.dataDir);
  const dbDir = path.join(dataDir, 'db');
  const socket = path.join(dataDir, 'mysqld.sock');
  const pidFile = path.join(dataDir, 'mysqld.pid');
  const errLog = path.join(dataDir, 'mysqld.err');
  // A temporary folder of its own: at start, every mariadbd deletes the #sql* files it finds in its tmpdir, so
  // instances sharing /tmp break each other's mariadb-install-db when they start at the same moment.
  const tmpDir = path.join(dataDir, 'tmp');
  mkdirSync(tmpDir, { recursive: true });

  // A previous run that was killed hard may have left a server behind on this folder: stop it first.
  if (existsSync(pidFile)) {
    const stale = Number(readFileSync(pidFile, 'utf8').trim());
    if (stale && isAlive(stale)) {
      log(`Stopping a MariaDB left running on ${dataDir} (pid ${stale})`);
      process.kill(stale, 'SIGTERM');
      for (let i = 0; i < 100 && isAlive(stale); i++) await sleep(100);
    }
  }

  if (!existsSync(path.join(dbDir, 'mysql'))) {
    log(`Initialising a private MariaDB data folder in ${dbDir}`);
    mkdirSync(dbDir, { recursive: true });
    const init = spawnSync(
      binary('mariadb-install-db'),
      ['--user=root', `--datadir=${dbDir}`, `--tmpdir=${tmpDir}`, '--auth-root-authentication-method=normal', '--skip-test-db'],
      { encoding: 'utf8' },
    );
    if (init.status !== 0) throw new Error(`mariadb-install-db failed:\n${init.stdout}${init.stderr}`);
  }
  writeFileSync(
    path.join(dataDir, 'my.cnf'),
    [
      '[mariadbd]',
      'innodb_flush_log_at_trx_commit=1',
      'sync_binlog=1',
      'character-set-server=utf8mb4',
      'collation-server=utf8mb4_unicode_ci',
      'max_allowed_packet=64M',
      'skip-name-resolve',
      'local-infile=1',
      '',
    ].join('\n'),
  );

  const child: ChildProcess = spawn(
    binary('mariadbd'),
    [
      `--defaults-file=${path.join(dataDir, 'my.cnf')}`,
      '--user=root',
      `--datadir=${dbDir}`,
      `--tmpdir=${tmpDir}`,
      `--socket=${socket}`,
      `--port=${options.port}`,
      '--bind-address=127.0.0.1',
      `--pid-file=${pidFile}`,
      `--log-error=${errLog}`,
    ],
    // A process group of its own: a terminal's Ctrl-C reaches only `npm start`, which then shuts MariaDB down cleanly.
    { stdio: 'ignore', detached: true },
  );
  let exited = false;
  child.on('exit', () => {
    exited = true;
  });

  const deadline = Date.now() + 30_000;
  for (;;) {
    if (exited) throw new Error(`MariaDB exited at start; see ${errLog}:\n${existsSync(errLog) ? readFileSync(errLog, 'utf8').slice(-2000) : ''}`);
    if (client(socket, 'SELECT 1').ok) break;
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`MariaDB did not answer within 30 s; see ${errLog}`);
    }
    await sleep(150);
  }

  const db = options.database.replace(/[^A-Za-z0-9_]/g, '');
  const setup = [
    `CREATE DATABASE IF NOT EXISTS \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    ...['localhost', '127.0.0.1'].flatMap((host) => [
      `CREATE USER IF NOT EXISTS ${quote(options.user)}@'${host}' IDENTIFIED BY ${quote(options.password)}`,
      `ALTER USER ${quote(options.user)}@'${host}' IDENTIFIED BY ${quote(options.password)}`,
      `GRANT ALL PRIVILEGES ON \`${db}\`.* TO ${quote(options.user)}@'${host}'`,
    ]),
    'FLUSH PRIVILEGES',
  ].join(';\n');
  const r = client(socket, setup);
  if (!r.ok) throw new Error(`Could not create the database and user: ${r.output}`);

  const pid = child.pid!;
  const waitForExit = async (ms: number) => {
    for (const end = Date.now() + ms; !exited && Date.now() < end;) await sleep(100);
    return exited;
  };
  /**
   * Clean shutdown, each step with a time limit and without blocking this process's event loop: ask over the
   * socket (mariadb-admin shutdown), then SIGTERM (also a clean shutdown for mariadbd), SIGKILL only as the last
   * resort. Resolves once the server has exited.
   */
  const stop = async () => {
    if (exited) return;
    await new Promise<void>((resolve) => {
      const admin = spawn(binary('mariadb-admin'), ['--protocol=socket', `--socket=${socket}`, '-uroot', '--connect-timeout=5', 'shutdown'], {
        stdio: 'ignore',
        timeout: 10_000,
      });
      admin.once('exit', () => resolve());
      admin.once('error', () => resolve());
    });
    if (await waitForExit(30_000)) return;
    log('MariaDB did not stop when asked; sending SIGTERM');
    child.kill('SIGTERM');
    if (await waitForExit(30_000)) return;
    log('MariaDB still running; killing it');
    child.kill('SIGKILL');
    await waitForExit(5_000);
  };
  log(`MariaDB ready on 127.0.0.1:${options.port} (data in ${dbDir})`);
  return { host: '127.0.0.1', port: options.port, database: db, user: options.user, password: options.password, socket, pid, stop };
}

/** Drops and recreates a database on a running instance (root over the socket). */
export function recreateDatabase(instance: MariaDbInstance, database: string): void {
  const db = database.replace(/[^A-Za-z0-9_]/g, '');
  const sql = [
    `DROP DATABASE IF EXISTS \`${db}\``,
    `CREATE DATABASE \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    ...['localhost', '127.0.0.1'].map((host) => `GRANT ALL PRIVILEGES ON \`${db}\`.* TO ${quote(instance.user)}@'${host}'`),
  ].join(';\n');
  const r = client(instance.socket, sql);
  if (!r.ok) throw new Error(`Could not recreate database ${db}: ${r.output}`);
}
