/**
 * Recomputes everything derived for one unit from its stored raw samples: measured cleanliness → daily
 * medians → fouling trend per cleaning cycle → each valid sample's analysis with the day's trend CF →
 * daily aggregates. Runs as a background job after an import, an undo, a setup change or a new event.
 * Rows are read in id order in chunks, so memory stays bounded whatever the history length.
 */
import type { DataSource } from 'typeorm';
import { analyseCondenserPoint } from '@shared/domain/condenser/index.js';
import { analyseSample, buildUnitModel, type UnitModel, type UnitSetupSi } from '@shared/domain/monitoring/index.js';
import { PointRejectedError } from '@shared/domain/validity/index.js';
import { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { Plant } from '../../entities/plant.entity.js';
import { UnitEvent } from '../../entities/unit-event.entity.js';
import { fitCycles, trendCleanlinessOn, type CycleTrend } from './fouling-cycles.js';
import { median, plantDayFormatter } from './plant-day.js';
import { rebuildDailyAggregates } from './daily-aggregates.js';

const CHUNK = 5_000;

interface RawRow {
  id: string;
  ts: Date;
  loadMw: number;
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
  validity: string;
}

async function* validRows(ds: DataSource, unitId: string): AsyncGenerator<RawRow[]> {
  let lastId = '0';
  for (;;) {
    const rows: RawRow[] = await ds.query(
      `SELECT id, timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s, validity
         FROM performance_sample WHERE unitId = ? AND id > ? AND (validity = 'ok' OR validity LIKE 'model:%') ORDER BY id LIMIT ${CHUNK}`,
      [unitId, lastId],
    );
    if (rows.length === 0) return;
    lastId = String(rows[rows.length - 1].id);
    yield rows;
  }
}

export function unitModelOf(unit: GeneratingUnit): UnitModel | null {
  if (!unit.condenser || !unit.turbine || !unit.economics) return null;
  return buildUnitModel({ condenser: unit.condenser, turbine: unit.turbine, economics: unit.economics } as UnitSetupSi);
}

/** Plugged tubes on a day: the latest plugging event on or before it, else the setup's count. */
function pluggedTubesOn(events: UnitEvent[], fallback: number): (day: string) => number {
  const plugging = events.filter((e) => e.kind === 'tube-plugging' && e.pluggedTubesAfter !== null).sort((a, b) => a.startDate.localeCompare(b.startDate));
  return (day) => {
    let n = fallback;
    for (const e of plugging) if (e.startDate <= day) n = e.pluggedTubesAfter!;
    return n;
  };
}

export interface RecomputeOutcome {
  samples: number;
  days: number;
  cycles: CycleTrend[];
}

export async function recomputeUnit(ds: DataSource, unitId: string, onProgress: (fraction: number, message: string) => Promise<void> = async () => {}): Promise<RecomputeOutcome> {
  const unit = await ds.getRepository(GeneratingUnit).findOneByOrFail({ id: unitId });
  const plant = await ds.getRepository(Plant).findOneByOrFail({ id: unit.plantId });
  const dayOf = plantDayFormatter(plant.timeZone);
  const model = unitModelOf(unit);
  const events = await ds.getRepository(UnitEvent).findBy({ unitId });
  const total = Number((await ds.query(`SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ?`, [unitId]))[0].n);

  if (!model) {
    await ds.query(`UPDATE performance_sample SET cleanliness = NULL, ttdK = NULL, expectedBackpressureKpa = NULL, excessBackpressureKpa = NULL, foulingCostPerHour = NULL WHERE unitId = ?`, [unitId]);
    const days = await rebuildDailyAggregates(ds, unitId, dayOf);
    return { samples: total, days, cycles: [] };
  }
  const plugged = pluggedTubesOn(events, unit.condenser!.pluggedTubes);

  // Pass 1: measured cleanliness per plant-local day.
  await onProgress(0.05, 'Measuring cleanliness');
  const perDay = new Map<string, number[]>();
  for await (const rows of validRows(ds, unitId)) {
    for (const r of rows) {
      const day = dayOf(new Date(r.ts).getTime());
      try {
        const p = analyseCondenserPoint({
          backpressureKpa: r.backpressureKpa,
          cwInletC: r.cwInletC,
          cwOutletC: r.cwOutletC,
          cwFlowM3s: r.cwFlowM3s,
          pluggedTubes: plugged(day),
          geometry: model.geometry,
          referenceCleanliness: model.referenceCleanliness,
          heiTables: model.heiTables,
        });
        const list = perDay.get(day);
        if (list) list.push(p.cleanliness);
        else perDay.set(day, [p.cleanliness]);
      } catch {
        // rejected by the model: pass 2 records the reason
      }
    }
  }
  const dailyCf = new Map<string, number>();
  for (const [day, values] of perDay) dailyCf.set(day, median(values)!);
  const cleanings = events.filter((e) => e.kind === 'cleaning').map((e) => ({ date: e.endDate ?? e.startDate, cleanlinessAfter: e.cleanlinessAfter }));
  const cycles = fitCycles(dailyCf, cleanings, new Set());

  // Pass 2: full analysis with the day's trend CF, written back through a temporary table on one connection.
  const columns = ['validity', 'cleanliness', 'ttdK', 'dutyMw', 'expectedBackpressureKpa', 'excessBackpressureKpa', 'foulingKpa', 'cwInletKpa', 'cwFlowKpa', 'loadKpa', 'pluggingKpa', 'unexplainedKpa', 'heatRatePenaltyPct', 'foulingCostPerHour', 'unexplainedCostPerHour'];
  const runner = ds.createQueryRunner();
  await runner.connect();
  try {
    await runner.query(`CREATE TEMPORARY TABLE IF NOT EXISTS derived_update (id bigint PRIMARY KEY, validity varchar(32) NOT NULL, ${columns.slice(1).map((c) => `${c} double NULL`).join(', ')}) ENGINE=MEMORY`);
    let done = 0;
    for await (const rows of validRows(ds, unitId)) {
      const values: unknown[] = [];
      const tuples: string[] = [];
      for (const r of rows) {
        const day = dayOf(new Date(r.ts).getTime());
        let validity = 'ok';
        let a: ReturnType<typeof analyseSample> | null = null;
        try {
          a = analyseSample(model, r, plugged(day), trendCleanlinessOn(cycles, day));
        } catch (err) {
          validity = err instanceof PointRejectedError ? `model:${err.reason}`.slice(0, 32) : 'model:error';
        }
        tuples.push(`(?,${columns.map(() => '?').join(',')})`);
        values.push(r.id, validity, ...columns.slice(1).map((c) => (a ? (a as unknown as Record<string, number>)[c] ?? null : null)));
      }
      await runner.query('TRUNCATE TABLE derived_update');
      await runner.query(`INSERT INTO derived_update (id, ${columns.join(', ')}) VALUES ${tuples.join(',')}`, values);
      await runner.query(
        `UPDATE performance_sample s JOIN derived_update d ON d.id = s.id SET ${columns.map((c) => `s.${c} = d.${c}`).join(', ')}, s.setupVersion = ?`,
        [unit.setupVersion],
      );
      done += rows.length;
      await onProgress(0.1 + 0.8 * (done / Math.max(1, total)), `Analysed ${done.toLocaleString('en-US')} points`);
    }
    await runner.query('DROP TEMPORARY TABLE IF EXISTS derived_update');
  } finally {
    await runner.release();
  }
  await onProgress(0.92, 'Building daily figures');
  const days = await rebuildDailyAggregates(ds, unitId, dayOf);
  return { samples: total, days, cycles };
}
