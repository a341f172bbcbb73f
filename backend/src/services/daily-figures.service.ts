import type { DataSource } from 'typeorm';
import { notFound } from '../http/app-error.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { findUnit } from '../repositories/plant.repository.js';

export async function dailyFigures(ds: DataSource, scope: TenantScope, unitId: string, range: { from?: string; to?: string }) {
  if (!(await findUnit(ds.manager, scope, unitId))) throw notFound('No such unit');
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
  const rows: Record<string, unknown>[] = await ds.query(`SELECT * FROM daily_aggregate WHERE ${where.join(' AND ')} ORDER BY day`, params);
  return {
    days: rows.map((r) => {
      const { unitId: _u, droppedByReason, day, ...rest } = r;
      return {
        ...rest,
        day: typeof day === 'string' ? day : new Date(day as Date).toISOString().slice(0, 10),
        droppedByReason: typeof droppedByReason === 'string' ? JSON.parse(droppedByReason) : droppedByReason,
      };
    }),
  };
}
