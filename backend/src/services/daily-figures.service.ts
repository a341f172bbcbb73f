import type { DataSource } from 'typeorm';
import type { DailyFiguresResponse } from '@shared/schemas/health.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { dailyFiguresInScope } from '../repositories/daily-aggregate.repository.js';
import { foundInScope } from '../repositories/found-in-scope.js';

export async function dailyFigures(ds: DataSource, scope: TenantScope, unitId: string, range: { from?: string; to?: string }): Promise<DailyFiguresResponse> {
  return { days: await foundInScope(dailyFiguresInScope(ds.manager, scope, unitId, range), 'No such unit') };
}
