/**
 * The demo story is written for the calendar DEMO_START_LOCAL…DEMO_END_LOCAL and played moved by whole days,
 * so that its last day is the day before "today": every outage, cleaning and leak keeps its distance from
 * the end, and the demo always looks current. Tests pass a fixed day; the seed passes the plant's today.
 */
import { addDays, daysBetween, parsePlantDate } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { DEMO_END_LOCAL, type DemoUnitSpec } from './demo-scenario.js';

function checkedDay(day: string): string {
  try {
    parsePlantDate(day);
    return day;
  } catch {
    throw new RangeError(`"${day}" is not a calendar day (YYYY-MM-DD)`);
  }
}

/** A calendar day moved by whole days ("2024-02-28" + 2 → "2024-03-01"). */
export function shiftDay(day: string, days: number): string {
  return addDays(checkedDay(day), days);
}

/** Whole days the written story moves so that it ends the day before `today`. */
export function demoShiftDays(today: string): number {
  return daysBetween(DEMO_END_LOCAL, checkedDay(today));
}

/** The calendar day at an instant on a plant's clock. */
export function plantToday(timeZone: string, now: Date): string {
  return plantDayOf(now.getTime(), timeZone);
}

/** The unit's story with every date moved by `days`. */
export function shiftUnitDates(unit: DemoUnitSpec, days: number): DemoUnitSpec {
  if (days === 0) return unit;
  return {
    ...unit,
    plannedOutages: unit.plannedOutages.map((o) => ({ ...o, start: shiftDay(o.start, days), end: shiftDay(o.end, days) })),
    airLeak: { ...unit.airLeak, start: shiftDay(unit.airLeak.start, days), end: shiftDay(unit.airLeak.end, days) },
  };
}
