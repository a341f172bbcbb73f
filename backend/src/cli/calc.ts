/**
 * Calculation CLI: `npm run --silent calc -- <command>`.
 * Reads one JSON object or an array of them on stdin, prints the result (same shape) on stdout.
 * Each command lives in ./commands/<command>.ts and default-exports a CalcCommand.
 * A bad input yields {"error": "..."} in its place; exit code 1 if any input failed.
 */
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { runCalc, type CalcCommand } from './run-calc.js';

const commandsDir = path.join(import.meta.dirname, 'commands');

function listCommands(): string[] {
  return ['saturation', 'condenser-point', 'penalty', 'interval', 'cashflow', 'fouling-fit', 'schedule'].filter((name) =>
    existsSync(path.join(commandsDir, `${name}.ts`)),
  );
}

async function main(): Promise<number> {
  const name = process.argv[2] ?? '';
  if (!/^[a-z-]+$/.test(name) || !existsSync(path.join(commandsDir, `${name}.ts`))) {
    process.stdout.write(`${JSON.stringify({ error: `unknown command "${name}"; one of: ${listCommands().join(', ')}` })}\n`);
    return 1;
  }
  const command = (await import(path.join(commandsDir, `${name}.ts`))).default as CalcCommand;
  const { output, failed } = runCalc(command, readFileSync(0, 'utf8'));
  process.stdout.write(`${output}\n`);
  return failed ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    process.stdout.write(`${JSON.stringify({ error: err instanceof Error ? err.message : String(err) })}\n`);
    process.exit(1);
  },
);
