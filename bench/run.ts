/**
 * `npm run bench`: runs every bench/cases/*.ts (each default-exports an async function returning rows)
 * and prints one table. Targets are printed beside the figures; the script exits 1 if a target is missed.
 * The rows go to bench/results.json as `[{name, value, unit, target}]`. `npm run bench -- import` runs only
 * the cases whose file name starts with one of the given words; rows of the cases not run stay in the file.
 */
import { existsSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  /** target and whether a larger value is better */
  target?: { value: number; higherIsBetter: boolean };
}

const dir = path.join(import.meta.dirname, 'cases');
const only = process.argv.slice(2);
const rows: BenchRow[] = [];
for (const file of readdirSync(dir)
  .filter((f) => f.endsWith('.ts') && (only.length === 0 || only.some((w) => f.startsWith(w))))
  .sort()) {
  const mod = await import(path.join(dir, file));
  rows.push(...((await mod.default()) as BenchRow[]));
}
const resultsFile = path.join(import.meta.dirname, 'results.json');
const earlier: BenchRow[] = only.length && existsSync(resultsFile) ? JSON.parse(readFileSync(resultsFile, 'utf8')) : [];
const ran = new Set(rows.map((r) => r.name));
const results = [...earlier.filter((r) => !ran.has(r.name)), ...rows].map((r) => ({ name: r.name, value: r.value, unit: r.unit, target: r.target ?? null }));
writeFileSync(resultsFile, `${JSON.stringify(results, null, 2)}\n`);
let missed = 0;
const fmt = (v: number) => (Math.abs(v) >= 1000 ? Math.round(v).toLocaleString('en-US') : v.toPrecision(4));
console.log(['benchmark'.padEnd(72), 'result'.padStart(16), 'unit'.padEnd(14), 'target'.padStart(16), 'ok'].join('  '));
for (const r of rows) {
  const ok = !r.target || (r.target.higherIsBetter ? r.value >= r.target.value : r.value <= r.target.value);
  if (!ok) missed++;
  const target = r.target ? `${r.target.higherIsBetter ? '≥' : '≤'} ${fmt(r.target.value)}` : '';
  console.log([r.name.padEnd(72), fmt(r.value).padStart(16), r.unit.padEnd(14), target.padStart(16), ok ? 'yes' : 'NO'].join('  '));
}
process.exit(missed ? 1 : 0);
