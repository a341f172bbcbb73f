/**
 * Where each input of a case came from. Keys are the top-level inputs and each driver (`drivers.cwInletC`); an
 * input a person changed becomes `entered`, and a copy keeps entered values while refreshing the rest.
 */
import type { CalcScheduleInput } from '@shared/schemas/calc-schedule.js';
import type { InputSources } from '@shared/schemas/cases.js';

type Values = Record<string, unknown>;

/** The inputs flattened to their source keys: every top-level input but `drivers`, and each driver. */
export function inputsByKey(inputs: CalcScheduleInput): Values {
  const { drivers, ...rest } = inputs;
  const out: Values = { ...rest };
  for (const [k, v] of Object.entries(drivers)) out[`drivers.${k}`] = v;
  for (const k of Object.keys(out)) if (out[k] === undefined) delete out[k];
  return out;
}

/** The inverse of inputsByKey (not yet checked: parse it with calcScheduleInput). */
export function inputsFromKeys(values: Values): unknown {
  const out: Values = {};
  const drivers: Values = {};
  for (const [k, v] of Object.entries(values)) {
    if (k.startsWith('drivers.')) drivers[k.slice('drivers.'.length)] = v;
    else out[k] = v;
  }
  return { ...out, drivers };
}

/** JSON with sorted keys, so two values compare equal whatever order their keys were stored in. */
export function canonical(value: unknown): string {
  return JSON.stringify(value, (_k, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v as Values).sort(([a], [b]) => a.localeCompare(b))) : v,
  );
}

/** The sources after an edit: changed or new inputs are `entered` with the given detail; removed ones drop out. */
export function markEntered(before: CalcScheduleInput, after: CalcScheduleInput, sources: InputSources, detail: string): InputSources {
  const was = inputsByKey(before);
  const now = inputsByKey(after);
  const out: InputSources = {};
  for (const [key, value] of Object.entries(now)) {
    const unchanged = key in was && canonical(was[key]) === canonical(value) && sources[key];
    out[key] = unchanged ? sources[key] : { source: 'entered', detail };
  }
  return out;
}

/** A copy's inputs: the fresh prefill, with every input the original marked `entered` carried over as entered. */
export function carryEntered(
  original: { inputs: CalcScheduleInput; inputSources: InputSources },
  fresh: { inputs: CalcScheduleInput; inputSources: InputSources },
): { inputs: unknown; inputSources: InputSources } {
  const old = inputsByKey(original.inputs);
  const values = inputsByKey(fresh.inputs);
  const sources: InputSources = { ...fresh.inputSources };
  for (const [key, entry] of Object.entries(original.inputSources)) {
    if (entry.source !== 'entered') continue;
    if (key in old) {
      values[key] = old[key];
      sources[key] = entry;
    } else {
      delete values[key];
      delete sources[key];
    }
  }
  return { inputs: inputsFromKeys(values), inputSources: sources };
}
