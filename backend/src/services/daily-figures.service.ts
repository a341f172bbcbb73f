import type { DataSource } from 'typeorm';
import type { DailyFiguresResponse } from '@shared/schemas/health.js';
import { notFound } from '../http/app-error.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { findUnit } from '../repositories/plant.repository.js';
import { loadDailyRows } from './health.service.js';

export async function dailyFigures(ds: DataSource, scope: TenantScope, unitId: string, range: { from?: string; to?: string }): Promise<DailyFiguresResponse> {
  if (!(await findUnit(ds.manager, scope, unitId))) throw notFound('No such unit');
  return { days: await loadDailyRows(ds, unitId, range.from, range.to) };
}
