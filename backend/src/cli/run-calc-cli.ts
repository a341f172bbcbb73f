/** The calculation CLI without the process around it: a command name and the stdin text give the stdout text and the exit code. */
import { CALC_COMMANDS } from './command-registry.js';
import { runCalc } from './run-calc.js';

export function runCalcCli(name: string, stdinText: string): { output: string; exitCode: 0 | 1 } {
  const command = Object.hasOwn(CALC_COMMANDS, name) ? CALC_COMMANDS[name] : undefined;
  if (!command) return { output: JSON.stringify({ error: `unknown command "${name}"; one of: ${Object.keys(CALC_COMMANDS).join(', ')}` }), exitCode: 1 };
  const { output, failed } = runCalc(command, stdinText);
  return { output, exitCode: failed ? 1 : 0 };
}
