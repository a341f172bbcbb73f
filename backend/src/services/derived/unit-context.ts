/** What every recompute step knows of the unit: its setup as a model, its plant's day, its events. */
import type { DataSource } from 'typeorm';
import { buildUnitModel, type UnitModel, type UnitSetupSi } from '@shared/domain/monitoring/index.js';
import { plantDayFormatter } from '@shared/domain/calendar/plant-day.js';
import { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { Plant } from '../../entities/plant.entity.js';
import type { UnitEvent } from '../../entities/unit-event.entity.js';
import { eventsOfUnit } from '../../repositories/event.repository.js';
import type { CleaningMark } from './fouling-cycles.js';

export interface UnitContext {
  unit: GeneratingUnit;
  /** null while the unit's setup is incomplete */
  model: UnitModel | null;
  setup: UnitSetupSi | null;
  dayOf: (ts: number) => string;
  events: UnitEvent[];
  pluggedTubesOn: (day: string) => number;
  cleanings: CleaningMark[];
  plannedOutages: { from: string; to: string }[];
}

export function unitSetupOf(unit: GeneratingUnit): UnitSetupSi | null {
  if (!unit.condenser || !unit.turbine || !unit.economics) return null;
  return { condenser: unit.condenser, turbine: unit.turbine, economics: unit.economics } as UnitSetupSi;
}

export function unitModelOf(unit: GeneratingUnit): UnitModel | null {
  const setup = unitSetupOf(unit);
  return setup ? buildUnitModel(setup) : null;
}

type EventFacts = Pick<UnitEvent, 'kind' | 'startDate' | 'endDate' | 'pluggedTubesAfter' | 'cleanlinessAfter'>;

/** Plugged tubes on a day: the latest plugging event on or before it, else the setup's count. */
export function pluggedTubesOn(events: readonly EventFacts[], fallback: number): (day: string) => number {
  const plugging = events.filter((e) => e.kind === 'tube-plugging' && e.pluggedTubesAfter !== null).sort((a, b) => a.startDate.localeCompare(b.startDate));
  return (day) => {
    let n = fallback;
    for (const e of plugging) if (e.startDate <= day) n = e.pluggedTubesAfter!;
    return n;
  };
}

/** Cleanings as marks on the timeline: the trend restarts from the day a cleaning ended. */
export function cleaningMarks(events: readonly EventFacts[]): CleaningMark[] {
  return events.filter((e) => e.kind === 'cleaning').map((e) => ({ date: e.endDate ?? e.startDate, cleanlinessAfter: e.cleanlinessAfter }));
}

export function plannedOutages(events: readonly EventFacts[]): { from: string; to: string }[] {
  return events.filter((e) => e.kind === 'outage' && e.endDate).map((e) => ({ from: e.startDate, to: e.endDate! }));
}

export async function loadUnitContext(ds: DataSource, unitId: string): Promise<UnitContext> {
  const unit = await ds.getRepository(GeneratingUnit).findOneByOrFail({ id: unitId });
  const plant = await ds.getRepository(Plant).findOneByOrFail({ id: unit.plantId });
  const events = await eventsOfUnit(ds.manager, unitId);
  const setup = unitSetupOf(unit);
  return {
    unit,
    model: setup ? buildUnitModel(setup) : null,
    setup,
    dayOf: plantDayFormatter(plant.timeZone),
    events,
    pluggedTubesOn: pluggedTubesOn(events, unit.condenser?.pluggedTubes ?? 0),
    cleanings: cleaningMarks(events),
    plannedOutages: plannedOutages(events),
  };
}
