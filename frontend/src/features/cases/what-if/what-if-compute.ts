/**
 * What the case page's worker computes: the same `runScheduleCommand` the server runs for a case, on the same
 * checked input, so a what-if shows the figures the server will store when the draft is saved. The quick pass
 * leaves out the uncertainty (sensitivity and Monte Carlo), which is what takes time; the full pass is the
 * server's computation exactly.
 */
import { calcScheduleInput, type CalcScheduleInput, type CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import { runScheduleCommand } from '@shared/domain/decision/schedule/schedule-command';

export type WhatIfPass = 'figures' | 'uncertainty';

export interface WhatIfRequest {
  id: number;
  pass: WhatIfPass;
  inputs: CalcScheduleInput;
}

export type WhatIfAnswer =
  | { id: number; pass: WhatIfPass; ok: true; results: CalcScheduleOutput; ms: number }
  | { id: number; pass: WhatIfPass; ok: false; message: string; ms: number };

/** The schedule, business case and daily path without the uncertainty passes. */
export function computeFigures(inputs: CalcScheduleInput): CalcScheduleOutput {
  const checked = calcScheduleInput.parse(inputs);
  return runScheduleCommand({ ...checked, uncertainty: undefined });
}

/** Everything, uncertainty included: what the server answers for these inputs. */
export function computeAll(inputs: CalcScheduleInput): CalcScheduleOutput {
  return runScheduleCommand(calcScheduleInput.parse(inputs));
}

/** One request answered, with how long the computation took; a case that cannot be built answers why. */
export function answer(request: WhatIfRequest): WhatIfAnswer {
  const started = performance.now();
  try {
    const results = request.pass === 'figures' ? computeFigures(request.inputs) : computeAll(request.inputs);
    return { id: request.id, pass: request.pass, ok: true, results, ms: performance.now() - started };
  } catch (error) {
    return { id: request.id, pass: request.pass, ok: false, message: readableError(error), ms: performance.now() - started };
  }
}

function readableError(error: unknown): string {
  if (error && typeof error === 'object' && 'issues' in error && Array.isArray((error as { issues: unknown[] }).issues)) {
    const issues = (error as { issues: { path: PropertyKey[]; message: string }[] }).issues;
    return issues.map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message)).join('; ');
  }
  return error instanceof Error ? error.message : 'the case could not be computed';
}
