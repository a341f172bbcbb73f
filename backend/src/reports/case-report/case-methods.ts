/**
 * The cleaning methods of a case in full (an input may name a method of the typical library by its id), and what
 * the report says about the methods the schedule chose: their notes and their cautions.
 */
import { GENERAL_CAUTION, TYPICAL_CLEANING_METHODS, cautionsFor, type CleaningMethod } from '@shared/schemas/cleaning-method.js';
import type { CaseView } from '@shared/schemas/cases.js';

export function caseMethods(view: CaseView): CleaningMethod[] {
  return view.inputs.methods.flatMap((m) => {
    if (typeof m !== 'string') return [m];
    const found = TYPICAL_CLEANING_METHODS.find((t) => t.id === m);
    return found ? [found] : [];
  });
}

export function methodName(view: CaseView, methodId: string): string {
  return caseMethods(view).find((m) => m.id === methodId)?.name ?? methodId;
}

/** Methods the schedule uses, in the order they first appear. */
export function chosenMethods(view: CaseView): CleaningMethod[] {
  const ids = [...new Set(view.results.cleanings.map((c) => c.methodId))];
  const all = caseMethods(view);
  return ids.flatMap((id) => all.filter((m) => m.id === id));
}

/** The general caution first, then each chosen method's own cautions once, as the schedule carries them. */
export function reportCautions(view: CaseView): string[] {
  const fromSchedule = view.results.cleanings.flatMap((c) => c.cautions);
  const fromMethods = chosenMethods(view).flatMap((m) => cautionsFor(m));
  return [...new Set([GENERAL_CAUTION, ...fromSchedule, ...fromMethods])];
}

/** The wider caution every report carries, whether or not a cleaning is planned. */
export const CLEANING_WORK_CAUTION =
  'Cleaning work — entry into confined waterboxes, chemicals, high-pressure water — follows local codes, the equipment maker’s instructions and licensed engineering practice; this report does not replace them.';
