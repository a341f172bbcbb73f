/** Pure part of the calculation CLI and API: run a command on each input, collect errors in place. */
import type { ZodType } from 'zod';

export interface CalcCommand {
  /** One input as the caller writes it (for the API description; `run` checks it). */
  input: ZodType;
  /** One result. */
  output: ZodType;
  /** Validates one input (throws with a user-facing message) and returns the plain-JSON result. */
  run(input: unknown): unknown;
}

function errorMessage(err: unknown): string {
  if (err && typeof err === 'object' && 'issues' in err && Array.isArray((err as { issues: unknown[] }).issues)) {
    const issues = (err as { issues: { path: (string | number)[]; message: string }[] }).issues;
    return issues.map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message)).join('; ');
  }
  return err instanceof Error ? err.message : String(err);
}

/** One input or an array of inputs → results in the same shape; `failed` when any input failed. */
export function runCalcInputs(command: CalcCommand, parsed: unknown): { result: unknown; failed: boolean } {
  let failed = false;
  const one = (input: unknown): unknown => {
    try {
      if (input === null || typeof input !== 'object' || Array.isArray(input)) throw new Error('each input must be a JSON object');
      return command.run(input);
    } catch (err) {
      failed = true;
      return { error: errorMessage(err) };
    }
  };
  const result = Array.isArray(parsed) ? parsed.map(one) : one(parsed);
  return { result, failed };
}

export function runCalc(command: CalcCommand, stdinText: string): { output: string; failed: boolean } {
  let parsed: unknown;
  try {
    parsed = JSON.parse(stdinText);
  } catch {
    return { output: JSON.stringify({ error: 'stdin is not valid JSON' }), failed: true };
  }
  const { result, failed } = runCalcInputs(command, parsed);
  return { output: JSON.stringify(result), failed };
}
