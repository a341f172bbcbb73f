/**
 * Calculation CLI: `npm run --silent calc -- <command>`.
 * Reads one JSON object or an array of them on stdin, prints the result (same shape) on stdout.
 * A bad input yields {"error": "..."} in its place; exit code 1 if any input failed.
 */
import { readFileSync } from 'node:fs';
import { runCalcCli } from './run-calc-cli.js';

try {
  const { output, exitCode } = runCalcCli(process.argv[2] ?? '', readFileSync(0, 'utf8'));
  process.stdout.write(`${output}\n`);
  process.exitCode = exitCode;
} catch (err) {
  process.stdout.write(`${JSON.stringify({ error: err instanceof Error ? err.message : String(err) })}\n`);
  process.exitCode = 1;
}
