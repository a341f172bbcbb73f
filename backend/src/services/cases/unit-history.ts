/** What a case reads of the unit's stored daily figures: its last day of data and the daily means for the seasonal profiles. */
import type { EntityManager } from 'typeorm';
import type { UnitHistoryDay } from '@shared/domain/decision/drivers/seasonal-drivers.js';

const dayText = (d: string | Date) => (typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10));

/** The last plant-local day with points used in the calculations, or null when there is none. */
export async function lastDataDayOf(em: EntityManager, unitId: string): Promise<string | null> {
  const rows: { last: string | Date | null }[] = await em.query('SELECT MAX(day) AS last FROM daily_aggregate WHERE unitId = ? AND pointsUsed > 0', [unitId]);
  return rows[0]?.last ? dayText(rows[0].last) : null;
}

/** Last data day of several units at once (for lists). */
export async function lastDataDaysOf(em: EntityManager, unitIds: string[]): Promise<Map<string, string>> {
  if (unitIds.length === 0) return new Map();
  const rows: { unitId: string; last: string | Date }[] = await em.query(
    `SELECT unitId, MAX(day) AS last FROM daily_aggregate WHERE unitId IN (${unitIds.map(() => '?').join(', ')}) AND pointsUsed > 0 GROUP BY unitId`,
    unitIds,
  );
  return new Map(rows.map((r) => [r.unitId, dayText(r.last)]));
}

export interface AggregateDay {
  day: string | Date;
  pointsUsed: number;
  cwInletC: number | string | null;
  loadMw: number | string | null;
}

/**
 * The days of history the seasonal profiles read. A day with no valid point or a mean load below the turbine's
 * minimum is a day off line: it counts as load 0 (so the load profile carries the history's availability) and
 * adds no CW inlet temperature. Days with no stored figures at all are left out (no data is not a day off line).
 */
export function historyDays(rows: readonly AggregateDay[], ratingMw: number, minimumLoadFraction: number): UnitHistoryDay[] {
  return rows.map((r) => {
    const load = r.loadMw === null ? null : Number(r.loadMw) / ratingMw;
    const online = r.pointsUsed > 0 && load !== null && load >= minimumLoadFraction;
    return {
      date: dayText(r.day),
      cwInletC: r.pointsUsed > 0 && r.cwInletC !== null ? Number(r.cwInletC) : null,
      loadFraction: online ? load : 0,
    };
  });
}

export async function dailyMeansOf(em: EntityManager, unitId: string, ratingMw: number, minimumLoadFraction: number): Promise<UnitHistoryDay[]> {
  const rows: AggregateDay[] = await em.query(
    'SELECT day, pointsUsed, meanCwInletC AS cwInletC, meanLoadMw AS loadMw FROM daily_aggregate WHERE unitId = ? ORDER BY day',
    [unitId],
  );
  return historyDays(rows, ratingMw, minimumLoadFraction);
}
