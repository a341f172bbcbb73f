/**
 * Daily figures (`daily_aggregate`, one row per unit and plant-local day): read for the views and exports,
 * looked up within the caller's scope, and replaced as a whole by the recompute (daily-aggregate-row.ts names
 * the written row's columns).
 */
import type { EntityManager } from 'typeorm';
import type { z } from 'zod';
import { dailyFigure, type DailyFigure } from '@shared/schemas/health.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { DAILY_AGGREGATE_COLUMNS, type DailyAggregateRow } from './daily-aggregate-row.js';
import { findUnit } from './plant.repository.js';

export interface DayRange {
  from?: string;
  to?: string;
}

const dayText = (d: unknown) => (typeof d === 'string' ? d.slice(0, 10) : (d as Date).toISOString().slice(0, 10));
/** A JSON column read with its schema (MariaDB hands JSON columns back as text). */
const readJson = <T>(schema: z.ZodType<T>, v: unknown): T => schema.parse(typeof v === 'string' ? JSON.parse(v) : (v ?? null));

/** A unit's daily figures in day order, within the range when given (the unit already found in scope). */
export async function dailyFiguresOfUnit(em: EntityManager, unitId: string, range: DayRange = {}): Promise<DailyFigure[]> {
  const where = ['unitId = ?'];
  const params: unknown[] = [unitId];
  if (range.from) {
    where.push('day >= ?');
    params.push(range.from);
  }
  if (range.to) {
    where.push('day <= ?');
    params.push(range.to);
  }
  const rows: Record<string, unknown>[] = await em.query(`SELECT * FROM daily_aggregate WHERE ${where.join(' AND ')} ORDER BY day`, params);
  return rows.map(({ unitId: _unit, ...r }) => ({
    ...(r as Omit<DailyFigure, 'day' | 'airLeakSuspected' | 'droppedByReason' | 'stuckSensors'>),
    day: dayText(r.day),
    airLeakSuspected: !!r.airLeakSuspected,
    droppedByReason: readJson(dailyFigure.shape.droppedByReason, r.droppedByReason),
    stuckSensors: readJson(dailyFigure.shape.stuckSensors, r.stuckSensors),
  }));
}

/** A unit's daily figures, or null when the unit lies outside the scope. */
export async function dailyFiguresInScope(em: EntityManager, scope: TenantScope, unitId: string, range: DayRange = {}): Promise<DailyFigure[] | null> {
  if (!(await findUnit(em, scope, unitId))) return null;
  return dailyFiguresOfUnit(em, unitId, range);
}

/** One day's figures of a unit, or null when there are none or the unit lies outside the scope. */
export async function findDailyFigureInScope(em: EntityManager, scope: TenantScope, unitId: string, day: string): Promise<DailyFigure | null> {
  const days = await dailyFiguresInScope(em, scope, unitId, { from: day, to: day });
  return days?.[0] ?? null;
}

/** The days with valid data: their mean CW inlet temperature and load, in day order (for the cleaning outlook). */
export async function operatingDaysOfUnit(em: EntityManager, unitId: string): Promise<{ day: string; cwInletC: number; loadMw: number }[]> {
  const rows: { day: string | Date; cwInletC: number; loadMw: number }[] = await em.query(
    'SELECT day, meanCwInletC AS cwInletC, meanLoadMw AS loadMw FROM daily_aggregate WHERE unitId = ? AND pointsUsed > 0 ORDER BY day',
    [unitId],
  );
  return rows.map((r) => ({ day: dayText(r.day), cwInletC: r.cwInletC, loadMw: r.loadMw }));
}

/** Replaces all of a unit's daily figures in one transaction, raising the unit's data version in it. */
export async function replaceDailyAggregates(em: EntityManager, unitId: string, rows: readonly DailyAggregateRow[]): Promise<void> {
  await em.transaction(async (tx) => {
    await tx.query('UPDATE generating_unit SET dataVersion = dataVersion + 1 WHERE id = ?', [unitId]);
    await tx.query('DELETE FROM daily_aggregate WHERE unitId = ?', [unitId]);
    for (let i = 0; i < rows.length; i += 1000) {
      const slice = rows.slice(i, i + 1000);
      await tx.query(
        `INSERT INTO daily_aggregate (${DAILY_AGGREGATE_COLUMNS.join(', ')}) VALUES ${slice.map(() => `(${DAILY_AGGREGATE_COLUMNS.map(() => '?').join(',')})`).join(',')}`,
        slice.flatMap((row) => DAILY_AGGREGATE_COLUMNS.map((c) => row[c])),
      );
    }
  });
}
