import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { freePort } from '../../scripts/lib/free-port.js';

const root = path.resolve(import.meta.dirname, '..', '..');

function processesUsing(dataDir: string): string[] {
  const r = spawnSync('pgrep', ['-af', dataDir], { encoding: 'utf8' });
  return r.stdout.split('\n').filter((l) => l.trim() && !l.includes('pgrep'));
}

describe('npm start lifecycle', () => {
  it('starts MariaDB, the fakes and the app, then stops all of it on SIGINT and keeps the data', async () => {
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
    const runOnce = async () => {
      const child = spawn(process.execPath, [path.join(root, 'node_modules', 'tsx', 'dist', 'cli.mjs'), 'scripts/start.ts'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
      let output = '';
      child.stdout.on('data', (d) => (output += d));
      child.stderr.on('data', (d) => (output += d));
      const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
      const deadline = Date.now() + 120_000;
      while (!output.includes('Cleancase is ready') && Date.now() < deadline && child.exitCode === null) await new Promise((r) => setTimeout(r, 200));
      expect(output).toContain('Cleancase is ready');
      const health = await fetch(`http://127.0.0.1:${env.PORT}/api/health`).then((r) => r.json());
      expect(health.database.status).toBe('up');
      expect(processesUsing(dataDir).some((l) => l.includes('mariadbd'))).toBe(true);
      child.kill('SIGINT');
      expect(await exited).toBe(0);
      return output;
    };
    try {
      const first = await runOnce();
      expect(first).toContain('admin@northmere.example');
      expect(first).toContain('MariaDB shut down cleanly');
      expect(existsSync(path.join(dataDir, 'dist', 'index.html'))).toBe(true);
      expect(processesUsing(dataDir)).toEqual([]);
      await expect(fetch(`http://127.0.0.1:${env.PORT}/api/health`)).rejects.toThrow();

      const second = await runOnce();
      expect(second).not.toContain('Initialising a private MariaDB data folder');
      expect(second).not.toContain('seeding the demo scenario');
      expect(processesUsing(dataDir)).toEqual([]);
    } finally {
      rmSync(dataDir, { recursive: true, force: true });
    }
  }, 240_000);
});
