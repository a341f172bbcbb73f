/** The closing lines every case report carries: what the figures rest on and which engine made them. */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatDay } from '@shared/text/display-format.js';

export const ESTIMATES_LINE = 'Estimates from the data and assumptions shown.';

/** "Engine 1.0.0; built on data to 14 Mar 2026, unit setup version 4." */
export function dataBasisLine(view: CaseView): string {
  const data = view.builtFrom.lastDataDay ? `built on data to ${formatDay(view.builtFrom.lastDataDay)}` : 'built without measured data';
  return `Engine ${view.engineVersion}; ${data}, unit setup version ${view.builtFrom.setupVersion}.`;
}

/** "40 days of newer data exist (to 23 Apr 2026)" when the unit has data after the case was built. */
export function newerDataLine(view: CaseView): string | null {
  if (!view.newerData) return null;
  const n = view.newerData.days;
  return `The unit has ${n} ${n === 1 ? 'day' : 'days'} of newer data (to ${formatDay(view.newerData.lastDataDay)}) that this case does not use.`;
}
