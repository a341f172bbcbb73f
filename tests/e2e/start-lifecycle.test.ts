import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildDataSource } from '../../backend/src/data-source.js';
import { enqueueRecompute } from '../../backend/src/jobs/job-queue.js';
import { freePort } from '../../scripts/lib/free-port.js';
import { createTenant } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';

const root = path.resolve(import.meta.dirname, '..', '..');

function processesUsing(dataDir: string): string[] {
  const r = spawnSync('pgrep', ['-af', dataDir], { encoding: 'utf8' });
  return r.stdout.split('\n').filter((l) => l.trim() && !l.includes('pgrep'));
}

/** Every process still in the process group `pgid` (what a terminal's Ctrl-C reaches). */
function processesInGroup(pgid: number): string[] {
  const r = spawnSync('pgrep', ['-a', '-g', String(pgid)], { encoding: 'utf8' });
  return r.stdout.split('\n').filter((l) => l.trim());
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('npm start lifecycle', () => {
  it('Ctrl-C to the whole process group, with a keep-alive connection open and a recompute running, stops everything and shuts MariaDB down cleanly', async () => {
    const dataDir = mkdtempSync(path.join(os.tmpdir(), `cleancase-start-${process.env.CLEANCASE_TEST_RUN ?? 'adhoc'}-`));
    const env = {
      ...process.env,
      NODE_ENV: 'development',
      PORT: String(await freePort()),
      DB_PORT: String(await freePort()),
      DB_DATA_DIR: path.join(dataDir, 'mariadb'),
      FRONTEND_DIST_DIR: path.join(dataDir, 'dist'),
      STRIPE_FAKE_PORT: String(await freePort()),
      GOOGLE_FAKE_PORT: String(await freePort()),
      SMTP_SINK_PORT: String(await freePort()),
      LOG_LEVEL: 'warn',
      // People only: the full demo history is exercised by the import and health tests.
      DEMO_DATA: 'people',
    };
    const errLog = path.join(dataDir, 'mariadb', 'mysqld.err');

    /** `npm start` in a process group of its own, as a terminal runs it. */
    const start = async () => {
      const child: ChildProcess = spawn('npm', ['start', '--silent'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
      let output = '';
      child.stdout!.on('data', (d) => (output += d));
      child.stderr!.on('data', (d) => (output += d));
      // npm passes Ctrl-C on and, once its child has stopped, ends itself with the same signal (as a shell expects).
      const exited = new Promise<string>((resolve) => child.on('exit', (code, signal) => resolve(code === null ? String(signal) : `exit ${code}`)));
      const deadline = Date.now() + 150_000;
      while (!output.includes('Cleancase is ready') && Date.now() < deadline && child.exitCode === null) await sleep(200);
      expect(output).toContain('Cleancase is ready');
      const health = await fetch(`http://127.0.0.1:${env.PORT}/api/health`).then((r) => r.json());
      expect(health.database.status).toBe('up');
      expect(processesUsing(dataDir).some((l) => l.includes('mariadbd'))).toBe(true);
      return {
        pgid: child.pid!,
        output: () => output,
        /** What a terminal's Ctrl-C does: SIGINT to every process of the group. */
        interrupt: async () => {
          process.kill(-child.pid!, 'SIGINT');
          const code = await Promise.race([exited, sleep(90_000).then(() => 'still running after 90 s')]);
          return code;
        },
      };
    };

    try {
      const first = await start();
      expect(first.output()).toContain('admin@northmere.example');
      expect(existsSync(path.join(dataDir, 'dist', 'index.html'))).toBe(true);

      // A keep-alive connection left open by a browser.
      const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
      await new Promise<void>((resolve, reject) =>
        http
          .get({ host: '127.0.0.1', port: Number(env.PORT), path: '/api/health', agent }, (res) => {
            res.resume();
            res.on('end', () => resolve());
          })
          .on('error', reject),
      );

      // A recompute of a unit with years of hourly data, running when Ctrl-C comes.
      const ds = buildDataSource({ host: '127.0.0.1', port: Number(env.DB_PORT), database: 'cleancase', user: 'cleancase', password: 'cleancase-local' });
      await ds.initialize();
      try {
        const tenant = await createTenant(ds, 'lifecycle');
        const unit = await createUnit(ds, await createPlant(ds, tenant.organisation.id));
        await ds.query(
          `INSERT INTO performance_sample (unitId, importId, timestampUtc, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s, validity)
           SELECT ?, UUID(), TIMESTAMP'2020-01-01 00:00:00' + INTERVAL seq HOUR, 300, 7 + 0.5 * SIN(seq / 24), 20 + 5 * SIN(seq / 2000), 29 + 5 * SIN(seq / 2000), 15, 'ok'
             FROM seq_1_to_60000`,
          [unit.id],
        );
        await enqueueRecompute(ds.manager, tenant.organisation.id, unit.id, 'lifecycle test');
        const deadline = Date.now() + 30_000;
        let status = 'queued';
        while (status !== 'running' && Date.now() < deadline) {
          await sleep(100);
          [{ status }] = await ds.query('SELECT status FROM background_job WHERE unitId = ?', [unit.id]);
        }
        expect(status).toBe('running');
      } finally {
        await ds.destroy();
      }

      expect(await first.interrupt()).toMatch(/^(SIGINT|exit 0)$/);
      expect(first.output(), first.output()).toContain('Stopped.');
      expect(first.output()).toContain('MariaDB shut down cleanly');
      expect(processesInGroup(first.pgid)).toEqual([]);
      expect(processesUsing(dataDir)).toEqual([]);
      await expect(fetch(`http://127.0.0.1:${env.PORT}/api/health`)).rejects.toThrow();
      agent.destroy();
      const logAfterFirst = readFileSync(errLog, 'utf8').length;

      const second = await start();
      expect(second.output()).not.toContain('Initialising a private MariaDB data folder');
      expect(second.output()).not.toContain('seeding the demo scenario');
      // The first run ended with a clean shutdown, so InnoDB has nothing to recover.
      const secondStartLog = readFileSync(errLog, 'utf8').slice(logAfterFirst);
      expect(secondStartLog).not.toMatch(/crash recovery|was not shut down normally/i);
      expect(await second.interrupt()).toMatch(/^(SIGINT|exit 0)$/);
      expect(second.output(), second.output()).toContain('MariaDB shut down cleanly');
      expect(processesInGroup(second.pgid)).toEqual([]);
      expect(processesUsing(dataDir)).toEqual([]);
    } finally {
      for (const line of processesUsing(dataDir)) {
        const pid = Number(line.trim().split(/\s+/)[0]);
        if (pid) process.kill(pid, 'SIGKILL');
      }
      rmSync(dataDir, { recursive: true, force: true });
    }
  }, 360_000);
});
