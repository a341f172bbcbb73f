/** What a case reads of the unit's stored daily figures: its last day of data and the daily means for the seasonal profiles. */
import type { EntityManager } from 'typeorm';

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

export async function dailyMeansOf(em: EntityManager, unitId: string, ratingMw: number): Promise<{ date: string; cwInletC: number; loadFraction: number }[]> {
  const rows: { day: string | Date; cwInletC: number; loadMw: number }[] = await em.query(
    'SELECT day, meanCwInletC AS cwInletC, meanLoadMw AS loadMw FROM daily_aggregate WHERE unitId = ? AND pointsUsed > 0 AND meanCwInletC IS NOT NULL AND meanLoadMw IS NOT NULL ORDER BY day',
    [unitId],
  );
  return rows.map((r) => ({ date: dayText(r.day), cwInletC: Number(r.cwInletC), loadFraction: Number(r.loadMw) / ratingMw }));
}
