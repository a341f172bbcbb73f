/**
 * `npm test`: everything CI checks, needing nothing running beforehand and leaving nothing running.
 * System packages (MariaDB, Chromium, python3-iapws) are installed when missing; then lint, typecheck,
 * front-end build, and every vitest suite (unit, reference, API, security, faults, fuzz, browser), then each test file's time.
 */
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { CHROMIUM, ensureSystemPackages, MARIADB, PYTHON_IAPWS } from './lib/system-packages.js';

const root = path.resolve(import.meta.dirname, '..');
const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);
const extraArgs = process.argv.slice(2);

function step(title: string, command: string, args: string[]): boolean {
  console.log(`\n=== ${title}`);
  const started = Date.now();
  const r = spawnSync(command, args, {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, CLEANCASE_TEST_RUN: runId, FORCE_COLOR: process.env.CI ? '0' : process.env.FORCE_COLOR },
  });
  console.log(`=== ${title}: ${r.status === 0 ? 'ok' : 'FAILED'} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  return r.status === 0;
}

/** This run's id: the test databases it starts carry it in their folder names. */
const runId = randomBytes(4).toString('hex');

/** A test MariaDB of this run left by a crash (the global setup stops its own on every normal exit); other runs' are left alone. */
function stopStrayTestDatabases(): void {
  spawnSync('pkill', ['-TERM', '-f', `mariadbd.*cleancase-(test-db|start)-${runId}-`], { stdio: 'ignore' });
}

try {
  ensureSystemPackages([MARIADB, CHROMIUM, PYTHON_IAPWS]);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
}

const resultsFile = path.join(root, '.data', 'test-results.json');
mkdirSync(path.dirname(resultsFile), { recursive: true });

/** Each test file's own time (the vitest JSON report's start and end), slowest first, and the sum. */
function printSuiteTimes(files: { name: string; startTime: number; endTime: number; status: string }[]): void {
  if (files.length === 0) return;
  const rows = files.map((f) => ({ file: path.relative(root, f.name), seconds: Math.max(0, f.endTime - f.startTime) / 1000, status: f.status }));
  rows.sort((a, b) => b.seconds - a.seconds);
  console.log(`\nsuite times (${rows.length} files, slowest first):`);
  for (const r of rows) console.log(`${r.seconds.toFixed(1).padStart(8)} s  ${r.status === 'passed' ? '  ' : '✗ '}${r.file}`);
  const total = rows.reduce((sum, r) => sum + r.seconds, 0);
  console.log(`${total.toFixed(1).padStart(8)} s  in all (files run in parallel, so the wall time is shorter)`);
}

let ok = true;
if (extraArgs.length === 0) {
  ok = step('lint (eslint)', bin('eslint'), ['.', '--max-warnings=0']) && ok;
  ok = step('format (prettier --check)', bin('prettier'), ['--check', '.', '--log-level', 'warn']) && ok;
  // Node code without the browser's types, browser code without Node's, shared code with neither; then the tests.
  for (const project of ['node', 'browser', 'shared']) {
    ok = step(`typecheck ${project} (tsc --noEmit -p tsconfig.${project}.json)`, bin('tsc'), ['--noEmit', '-p', `tsconfig.${project}.json`]) && ok;
  }
  ok = step('typecheck everything with the tests (tsc --noEmit)', bin('tsc'), ['--noEmit', '-p', '.']) && ok;
  ok = step('front-end build (vite)', bin('vite'), ['build', '--logLevel', 'warn']) && ok;
} else if (!existsSync(path.join(root, 'frontend', 'dist', 'index.html'))) {
  ok = step('front-end build (vite)', bin('vite'), ['build', '--logLevel', 'warn']) && ok;
}
const vitestOk = step('tests (vitest: unit, reference, api, security, faults, fuzz, browser)', bin('vitest'), [
  'run',
  '--reporter=default',
  '--reporter=json',
  `--outputFile.json=${resultsFile}`,
  ...extraArgs,
]);
ok = vitestOk && ok;
stopStrayTestDatabases();

if (existsSync(resultsFile)) {
  const results = JSON.parse(readFileSync(resultsFile, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    testResults?: { name: string; startTime: number; endTime: number; status: string }[];
  };
  printSuiteTimes(results.testResults ?? []);
  console.log(`\ntests: ${results.numPassedTests} passed, ${results.numFailedTests} failed, ${results.numPendingTests} skipped`);
  if (results.numPassedTests === 0) ok = false;
}
console.log(ok ? 'npm test: all checks passed' : 'npm test: FAILED');
process.exit(ok ? 0 : 1);
