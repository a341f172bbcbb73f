/**
 * What a cached view of a unit depends on, read in one cheap statement within the caller's scope: the unit's
 * setup and data versions (raised by a setup save and by the recompute), its and its plant's names and time
 * zone, its last sample's time and its imports' states (an import moves them before the recompute runs), a fingerprint of its events
 * (an event shows in the view before the recompute it queues has run) and one of its stored setup and analysis. Every process reads it from the
 * database, so a cache in one process is never stale because another process changed the unit.
 */
import type { EntityManager } from 'typeorm';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Plant } from '../entities/plant.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { restrictPlantsToScope } from './scope-filter.js';

export interface UnitVersion {
  unitId: string;
  setupVersion: number;
  dataVersion: number;
  /** everything else the key holds, as one string */
  mark: string;
}

const EVENTS_MARK =
  "(SELECT CONCAT(COUNT(*), ':', COALESCE(BIT_XOR(CRC32(CONCAT_WS('|', e.id, e.kind, e.startDate, e.endDate, e.methodId, e.cost, e.cleanlinessBefore, e.cleanlinessAfter, e.pluggedTubesAfter, e.notes))), 0)) FROM unit_event e WHERE e.unitId = u.id)";
const LAST_SAMPLE = '(SELECT MAX(s.timestampUtc) FROM performance_sample s WHERE s.unitId = u.id)';
/** The unit's imports and their states: rows stored or removed under an import change it even when the last sample's time stays. */
const IMPORTS_MARK = "(SELECT CONCAT(COUNT(*), ':', COALESCE(BIT_XOR(CRC32(CONCAT_WS('|', i.id, i.status))), 0)) FROM data_import i WHERE i.unitId = u.id)";
/** The stored setup and analysis themselves, so a write that raised no version (a script, an older process) is seen too. */
const STORED_MARK = "MD5(CONCAT_WS('|', u.condenser, u.turbine, u.economics, u.analysis))";

/** The unit's version, or null when the unit lies outside the scope. */
export async function unitVersionInScope(em: EntityManager, scope: TenantScope, unitId: string): Promise<UnitVersion | null> {
  const qb = em
    .getRepository(GeneratingUnit)
    .createQueryBuilder('u')
    .innerJoin(Plant, 'p', 'p.id = u.plantId')
    .select('u.id', 'unitId')
    .addSelect('u.setupVersion', 'setupVersion')
    .addSelect('u.dataVersion', 'dataVersion')
    .addSelect('u.name', 'unitName')
    .addSelect('p.name', 'plantName')
    .addSelect('p.timeZone', 'timeZone')
    .addSelect(LAST_SAMPLE, 'lastSample')
    .addSelect(EVENTS_MARK, 'events')
    .addSelect(STORED_MARK, 'stored')
    .addSelect(IMPORTS_MARK, 'imports')
    .where('u.id = :id', { id: unitId });
  const row: Record<string, unknown> | undefined = await restrictPlantsToScope(qb, 'p', scope).getRawOne();
  if (!row) return null;
  const lastSample = row.lastSample ? new Date(row.lastSample as string).toISOString() : '';
  return {
    unitId: String(row.unitId),
    setupVersion: Number(row.setupVersion),
    dataVersion: Number(row.dataVersion),
    mark: JSON.stringify([row.unitName, row.plantName, row.timeZone, lastSample, row.events, row.stored, row.imports]),
  };
}
