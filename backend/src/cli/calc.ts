/**
 * Calculation CLI: `npm run --silent calc -- <command>`.
 * Reads one JSON object or an array of them on stdin, prints the result (same shape) on stdout.
 * A bad input yields {"error": "..."} in its place; exit code 1 if any input failed.
 */
import { readFileSync } from 'node:fs';
import { CALC_COMMANDS } from './command-registry.js';
import { runCalc } from './run-calc.js';

function main(): number {
  const name = process.argv[2] ?? '';
  const command = Object.hasOwn(CALC_COMMANDS, name) ? CALC_COMMANDS[name] : undefined;
  if (!command) {
    process.stdout.write(`${JSON.stringify({ error: `unknown command "${name}"; one of: ${Object.keys(CALC_COMMANDS).join(', ')}` })}\n`);
    return 1;
  }
  const { output, failed } = runCalc(command, readFileSync(0, 'utf8'));
  process.stdout.write(`${output}\n`);
  return failed ? 1 : 0;
}

try {
  process.exitCode = main();
} catch (err) {
  process.stdout.write(`${JSON.stringify({ error: err instanceof Error ? err.message : String(err) })}\n`);
  process.exitCode = 1;
}
