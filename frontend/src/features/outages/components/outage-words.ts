import { formatDay, formatNumber } from '@frontend/lib/format';
import type { OutageView } from '@shared/schemas/outages';

/** A window of plant-local days as it reads everywhere: "4 May 2026 – 24 May 2026 (21 days)". */
export function windowText(startDate: string, endDate: string, days?: number): string {
  const span = `${formatDay(startDate)} – ${formatDay(endDate)}`;
  return days === undefined ? span : `${span} (${formatNumber(days)} ${days === 1 ? 'day' : 'days'})`;
}

export const daysText = (days: number, decimals = 0) => `${formatNumber(days, decimals)} ${days === 1 ? 'day' : 'days'}`;

/** The units an outage takes off line, plant first: "Harrow Creek Station — Unit 1, Unit 2". */
export function unitsText(units: { name: string; plantName: string }[]): string {
  const byPlant = new Map<string, string[]>();
  for (const u of units) byPlant.set(u.plantName, [...(byPlant.get(u.plantName) ?? []), u.name]);
  return [...byPlant].map(([plant, names]) => `${plant} — ${names.join(', ')}`).join('; ');
}

/** The longest lane's summed days: the length of the work when lanes run side by side. */
export const criticalDays = (laneDays: Record<string, number>): number => Math.max(0, ...Object.values(laneDays));

/**
 * Cautions with the general one (whom to defer to) first, as SafetyCautions shows them: the server lists the
 * specific ones first and ends with it.
 */
export function cautionsGeneralFirst(view: Pick<OutageView, 'cautions'>): string[] {
  const last = view.cautions.at(-1);
  return last === undefined ? [] : [last, ...view.cautions.slice(0, -1)];
}
