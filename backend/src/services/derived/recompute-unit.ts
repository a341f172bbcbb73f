/**
 * Recomputes everything derived for one unit from its stored raw samples: measured cleanliness → daily
 * medians → fouling trend per cleaning cycle → each valid sample's analysis with the day's trend CF →
 * daily aggregates. Runs as a background job after an import, an undo, a setup change or a new event.
 * Rows are read in id order in chunks, so memory stays bounded whatever the history length.
 */
import type { DataSource } from 'typeorm';
import { airLeakPeriods, analyseSample, buildUnitModel, judgeAirLeakDays, plausibleCondenserPoint, designPointKpa, type UnitModel, type UnitSetupSi } from '@shared/domain/monitoring/index.js';
import { PointRejectedError } from '@shared/domain/validity/index.js';
import { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { Plant } from '../../entities/plant.entity.js';
import { UnitEvent } from '../../entities/unit-event.entity.js';
import { cycleSummary, fitCycles, trendCleanlinessOn, type CycleTrend } from './fouling-cycles.js';
import { median } from '@shared/domain/statistics.js';
import { plantDayFormatter } from '@shared/domain/calendar/plant-day.js';
import { rebuildDailyAggregates } from './daily-aggregates.js';
import { cleaningOutlook } from './cleaning-outlook.js';
import { methodsOf } from '../cleaning-method.service.js';

const CHUNK = 5_000;

interface RawRow {
  id: string;
  ts: Date;
  loadMw: number;
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
  hotwellC: number | null;
  dissolvedOxygenPpb: number | null;
  airRemovalKgS: number | null;
  validity: string;
}

interface DayWitness {
  cf: number[];
  subcooling: number[];
  oxygen: number[];
  air: number[];
}

async function* validRows(ds: DataSource, unitId: string): AsyncGenerator<RawRow[]> {
  let lastId = '0';
  for (;;) {
    const rows: RawRow[] = await ds.query(
      `SELECT id, timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s, hotwellC, dissolvedOxygenPpb, airRemovalKgS, validity
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
    await ds.query('UPDATE generating_unit SET analysis = NULL WHERE id = ?', [unitId]);
    return { samples: total, days, cycles: [] };
  }
  const plugged = pluggedTubesOn(events, unit.condenser!.pluggedTubes);

  // Pass 1: measured cleanliness and the air in-leakage witnesses per plant-local day. A design point the model
  // puts outside the range a condenser may read leaves every point out (pass 2 records why), so no trend either.
  await onProgress(0.05, 'Measuring cleanliness');
  const perDay = new Map<string, DayWitness>();
  let designInRange = true;
  try {
    designPointKpa(model);
  } catch {
    designInRange = false;
  }
  for await (const rows of designInRange ? validRows(ds, unitId) : []) {
    for (const r of rows) {
      const day = dayOf(new Date(r.ts).getTime());
      try {
        // An implausible result (cleanliness, tube velocity, expected backpressure) keeps the point out of the daily medians.
        const p = plausibleCondenserPoint(model, r, plugged(day));
        let w = perDay.get(day);
        if (!w) perDay.set(day, (w = { cf: [], subcooling: [], oxygen: [], air: [] }));
        w.cf.push(p.cleanliness);
        if (r.hotwellC !== null) w.subcooling.push(p.saturationC - r.hotwellC);
        if (r.dissolvedOxygenPpb !== null) w.oxygen.push(r.dissolvedOxygenPpb);
        if (r.airRemovalKgS !== null) w.air.push(r.airRemovalKgS);
      } catch {
        // rejected by the model: pass 2 records the reason
      }
    }
  }
  const days = [...perDay.keys()].sort();
  const dailyCf = new Map<string, number>();
  for (const day of days) dailyCf.set(day, median(perDay.get(day)!.cf)!);
  const cleanings = events.filter((e) => e.kind === 'cleaning').map((e) => ({ date: e.endDate ?? e.startDate, cleanlinessAfter: e.cleanlinessAfter }));
  const verdicts = judgeAirLeakDays(
    days.map((day) => {
      const w = perDay.get(day)!;
      return { day, cleanliness: dailyCf.get(day)!, subcoolingK: median(w.subcooling), dissolvedOxygenPpb: median(w.oxygen), airRemovalKgS: median(w.air) };
    }),
    undefined,
    cleanings.map((c) => c.date),
  );
  const suspectedDays = new Set(verdicts.filter((v) => v.suspected).map((v) => v.day));
  // Flagged air in-leakage days are left out of the fit, so a weeks-long leak is not booked as fouling.
  const cycles = fitCycles(dailyCf, cleanings, suspectedDays);

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
  const dayCount = await rebuildDailyAggregates(ds, unitId, dayOf, {
    trendCleanliness: (day) => trendCleanlinessOn(cycles, day) ?? null,
    airLeakSuspected: (day) => suspectedDays.has(day),
    heatBalanceDutyMw: (meanLoadMw) => model.heatBalanceDutyMw(meanLoadMw / model.ratingMw),
    witnesses: (day) => {
      const w = perDay.get(day);
      return { subcoolingK: w ? median(w.subcooling) : null, dissolvedOxygenPpb: w ? median(w.oxygen) : null, airRemovalKgS: w ? median(w.air) : null };
    },
  });
  const periods = airLeakPeriods(verdicts);
  await onProgress(0.97, 'Planning the next cleaning');
  const lastCycle = cycles.at(-1);
  const lastFit = lastCycle?.result.status === 'fitted' ? lastCycle.result.chosen : null;
  const history: { day: string | Date; cwInletC: number; loadMw: number }[] = await ds.query(
    'SELECT day, meanCwInletC AS cwInletC, meanLoadMw AS loadMw FROM daily_aggregate WHERE unitId = ? AND pointsUsed > 0 ORDER BY day',
    [unitId],
  );
  const libraryMethods = await methodsOf(ds.manager, unit.organisationId);
  const outlook = days.length
    ? cleaningOutlook({
        model,
        setup: { condenser: unit.condenser!, turbine: unit.turbine!, economics: unit.economics! } as UnitSetupSi,
        lastDay: days.at(-1)!,
        cycle: lastCycle && lastFit ? { startDay: lastCycle.startDay, model: lastFit.model, cleanlinessAfterCleaning: lastFit.cleanlinessAfterCleaning } : null,
        history: history.map((h) => ({ date: typeof h.day === 'string' ? h.day : h.day.toISOString().slice(0, 10), cwInletC: h.cwInletC, loadFraction: h.loadMw / model.ratingMw })),
        plannedOutages: events.filter((e) => e.kind === 'outage' && e.endDate).map((e) => ({ from: e.startDate, to: e.endDate! })),
        methods: libraryMethods.length ? libraryMethods : undefined,
      })
    : null;
  const analysis = { computedAt: new Date().toISOString(), setupVersion: unit.setupVersion, lastDay: days.at(-1) ?? null, cycles: cycles.map(cycleSummary), airLeakPeriods: periods, outlook };
  await ds.query('UPDATE generating_unit SET analysis = ? WHERE id = ?', [JSON.stringify(analysis), unitId]);
  return { samples: total, days: dayCount, cycles };
}
