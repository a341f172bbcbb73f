/**
 * Where each input of a case came from. Keys are the top-level inputs and each driver (`drivers.cwInletC`); an
 * input a person changed becomes `entered`, and a copy keeps entered values while refreshing the rest.
 */
import { daysBetween } from '@shared/domain/calendar/plant-date.js';
import { MAX_DAYS_SINCE_CLEANING, type CalcScheduleInput } from '@shared/schemas/calc-schedule.js';
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
    const kept = key in was && canonical(was[key]) === canonical(value) ? sources[key] : undefined;
    out[key] = kept ?? { source: 'entered', detail };
  }
  return out;
}

/**
 * After the start of a case moved: the days since the cleaning move with it when they were not entered by a person
 * (and were not changed in the same edit), so the condenser's state still matches the new start.
 */
export function alignInitialToStart(inputs: CalcScheduleInput, previous: CalcScheduleInput, sources: InputSources): CalcScheduleInput {
  const moved = daysBetween(previous.startDate, inputs.startDate);
  if (moved === 0 || sources.initial?.source === 'entered' || canonical(inputs.initial) !== canonical(previous.initial)) return inputs;
  const days = Math.min(MAX_DAYS_SINCE_CLEANING, Math.max(0, previous.initial.daysSinceCleaning + moved));
  return { ...inputs, initial: { ...inputs.initial, daysSinceCleaning: days } };
}

/**
 * Inputs that only make sense together. The first of a pair follows the second when only the second was entered
 * (entered outages keep the horizon they were entered for); an entered start instead moves the fresh days since the
 * cleaning with it (alignInitialToStart), and an entered initial condition keeps the start it was entered for.
 */
const CARRIED_WITH: Record<string, string> = { initial: 'startDate', plannedOutages: 'horizonDays' };

/**
 * A copy's inputs: the fresh prefill, with every input the original marked `entered` carried over as entered, and
 * the inputs that depend on them moved with them.
 */
export function carryEntered(
  original: { inputs: CalcScheduleInput; inputSources: InputSources },
  fresh: { inputs: CalcScheduleInput; inputSources: InputSources },
): { inputs: unknown; inputSources: InputSources } {
  const old = inputsByKey(original.inputs);
  const values = inputsByKey(fresh.inputs);
  const sources: InputSources = { ...fresh.inputSources };
  const entered = (key: string) => original.inputSources[key]?.source === 'entered';
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
  for (const [key, partner] of Object.entries(CARRIED_WITH)) {
    if (!entered(key) || entered(partner) || !(partner in old)) continue;
    values[partner] = old[partner];
    const was = original.inputSources[partner];
    sources[partner] = {
      source: was?.source ?? 'prefilled',
      detail: `kept from the original case with the entered ${key === 'initial' ? 'initial condition' : 'planned outages'}`,
    };
  }
  if (entered('startDate') && !entered('initial')) {
    const moved = alignInitialToStart({ ...fresh.inputs, startDate: original.inputs.startDate }, fresh.inputs, fresh.inputSources);
    values.initial = moved.initial;
    const was = fresh.inputSources.initial;
    if (was) sources.initial = { ...was, detail: `${was.detail}; moved to the entered start`.slice(0, 400) };
  }
  return { inputs: inputsFromKeys(values), inputSources: sources };
}
