/**
 * The pure rules of e-mail alerts (no I/O, no clock): which conditions a person hears about on a unit, the
 * unit's conditions with the person's "data stopped" days, and the ISO week a digest belongs to.
 */
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { UNIT_CONDITION_KINDS, unitConditions, type UnitCondition, type UnitConditionKind } from '@shared/domain/portfolio/unit-conditions.js';
import type { PortfolioUnit } from '@shared/schemas/portfolio.js';

export interface StoredChoice {
  unitId: string | null;
  kinds: UnitConditionKind[];
  dataStoppedDays: number;
}

/** A unit's own choice wins; otherwise the person-wide one (null unit); otherwise nothing. */
export function choiceFor(rows: readonly StoredChoice[], unitId: string): StoredChoice | null {
  const own = rows.find((r) => r.unitId === unitId);
  if (own) return own;
  const all = rows.find((r) => r.unitId === null);
  return all && all.kinds.length > 0 ? all : null;
}

/**
 * The unit's conditions as the portfolio lists them (unitConditions on its stored figures), with "data stopped"
 * judged on the person's own number of days, kept to the kinds the person chose, in a fixed order.
 */
export function conditionsFor(unit: Pick<PortfolioUnit, 'alerts' | 'dataThrough' | 'dataAgeDays'>, choice: StoredChoice | null): UnitCondition[] {
  if (!choice) return [];
  const out = unit.alerts.filter((a) => a.kind !== 'data-stopped');
  if (unit.dataThrough !== null && unit.dataAgeDays !== null) {
    // The portfolio's today for the unit (the plant's day): the last day with data plus its age.
    const today = addDays(unit.dataThrough, unit.dataAgeDays);
    const stopped = unitConditions({
      today,
      dataThrough: unit.dataThrough,
      nextCleaning: null,
      currency: null,
      airLeakDaysInLastWeek: 0,
      staleAfterDays: choice.dataStoppedDays,
    });
    out.push(...stopped);
  }
  const order = (k: UnitConditionKind) => UNIT_CONDITION_KINDS.indexOf(k);
  return out.filter((c) => choice.kinds.includes(c.kind)).sort((a, b) => order(a.kind) - order(b.kind));
}

/** The ISO 8601 week of a moment (UTC): "2026-W49". Weeks start on Monday; week 1 holds the year's first Thursday. */
export function isoWeekOf(at: Date): string {
  const day = new Date(Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate()));
  const weekday = day.getUTCDay() || 7;
  day.setUTCDate(day.getUTCDate() + 4 - weekday); // the Thursday of this week decides the year
  const year = day.getUTCFullYear();
  const week = Math.ceil(((day.getTime() - Date.UTC(year, 0, 1)) / 86_400_000 + 1) / 7);
  return `${year}-W${String(week).padStart(2, '0')}`;
}
