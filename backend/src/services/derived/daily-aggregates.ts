/**
 * Daily aggregates per unit and plant-local day: median cleanliness and TTD, mean backpressures and
 * deviation parts of the valid points, and the day's fouling and unexplained cost. Costs: the mean cost
 * per hour of the valid points times the hours the day's points cover (points × the unit's median sampling
 * interval, at most 24 h), so a day with few valid points is not costed as if it had none.
 * Step 7 of the recompute; every point counts (the ones left out by reason), only the ones valid for the
 * calculations (repositories/sample-validity.ts) enter the figures. The recompute feeds each point to a
 * `DailyAccumulator` as it analyses it, so the rows are not read again; without a setup the points are read here.
 */
import type { DataSource } from 'typeorm';
import { median } from '@shared/domain/statistics.js';
import type { DailyAggregateRow } from '../../repositories/daily-aggregate-row.js';
import { replaceDailyAggregates } from '../../repositories/daily-aggregate.repository.js';
import { samplesAfter } from '../../repositories/sample-analysis.repository.js';
import { reasonLeftOut, validForCalculations } from '../../repositories/sample-validity.js';

/** Per-day facts the recompute knows beyond the samples themselves. */
export interface DayFacts {
  trendCleanliness: (day: string) => number | null;
  airLeakSuspected: (day: string) => boolean;
  heatBalanceDutyMw: (meanLoadMw: number) => number;
  witnesses: (day: string) => { subcoolingK: number | null; dissolvedOxygenPpb: number | null; airRemovalKgS: number | null };
}

/** Raw sensors watched for readings that never change over a day. */
// Load and CW flow are often held flat on purpose (set point, fixed pump line-up), so only the readings that always wander are watched.
const SENSORS = ['backpressureKpa', 'cwInletC', 'cwOutletC'] as const;
const STUCK_MIN_POINTS = 6;

interface Acc {
  first: Record<string, number | null>;
  changed: Set<string>;
  all: number;
  used: number;
  dropped: number;
  byReason: Record<string, number>;
  cf: number[];
  ttd: number[];
  sums: Record<string, number>;
}

/** Columns averaged over the day's valid points. */
const MEANS = [
  'backpressureKpa',
  'expectedBackpressureKpa',
  'excessBackpressureKpa',
  'cwInletC',
  'loadMw',
  'heatRatePenaltyPct',
  'foulingKpa',
  'cwInletKpa',
  'cwFlowKpa',
  'loadKpa',
  'pluggingKpa',
  'unexplainedKpa',
  'foulingCostPerHour',
  'unexplainedCostPerHour',
  'dutyMw',
] as const;

const READ = ['validity', 'cleanliness', 'ttdK', 'cwOutletC', 'cwFlowM3s', ...MEANS] as const;

/** A point as the day's figures read it: its time, validity, raw readings and (when analysed) its analysis. */
export type DailyPoint = { ts: Date | string } & Partial<Record<(typeof READ)[number], unknown>>;

/** The points of a unit in id order, gathered per plant-local day. */
export class DailyAccumulator {
  private readonly days = new Map<string, Acc>();
  private readonly intervals: number[] = [];
  private lastTs: number | null = null;

  constructor(private readonly dayOf: (ts: number) => string) {}

  add(r: DailyPoint): void {
    const ts = new Date(r.ts as string).getTime();
    if (this.lastTs !== null && this.intervals.length < 5000 && ts > this.lastTs) this.intervals.push(ts - this.lastTs);
    this.lastTs = ts;
    const day = this.dayOf(ts);
    let acc = this.days.get(day);
    if (!acc)
      this.days.set(
        day,
        (acc = {
          first: {},
          changed: new Set(),
          all: 0,
          used: 0,
          dropped: 0,
          byReason: {},
          cf: [],
          ttd: [],
          sums: Object.fromEntries(MEANS.map((m) => [m, 0])),
        }),
      );
    acc.all++;
    for (const sensor of SENSORS) {
      const v = r[sensor] === null || r[sensor] === undefined ? null : Number(r[sensor]);
      if (!(sensor in acc.first)) acc.first[sensor] = v;
      else if (acc.first[sensor] !== v) acc.changed.add(sensor);
    }
    if (!validForCalculations(r)) {
      acc.dropped++;
      const reason = reasonLeftOut(r);
      acc.byReason[reason] = (acc.byReason[reason] ?? 0) + 1;
      return;
    }
    acc.used++;
    acc.cf.push(Number(r.cleanliness));
    acc.ttd.push(Number(r.ttdK));
    for (const m of MEANS) acc.sums[m] = (acc.sums[m] ?? 0) + Number(r[m] ?? 0);
  }

  get dayCount(): number {
    return this.days.size;
  }

  /** The daily figures of the points added. */
  rows(unitId: string, facts?: DayFacts): DailyAggregateRow[] {
    const intervalH = Math.min(24, (median(this.intervals) ?? 3_600_000) / 3_600_000);
    return [...this.days.entries()].map(([day, a]) => {
      const mean = (m: (typeof MEANS)[number]) => (a.used ? (a.sums[m] ?? 0) / a.used : null);
      const hours = Math.min(24, (a.used + a.dropped) * intervalH);
      const stuck = a.used >= STUCK_MIN_POINTS ? SENSORS.filter((sensor) => !a.changed.has(sensor)) : [];
      const w = facts?.witnesses(day);
      const meanLoad = mean('loadMw');
      return {
        unitId,
        day,
        pointsUsed: a.used,
        pointsDropped: a.dropped,
        droppedByReason: JSON.stringify(a.byReason),
        medianCleanliness: median(a.cf),
        medianTtdK: median(a.ttd),
        trendCleanliness: facts?.trendCleanliness(day) ?? null,
        meanSubcoolingK: w?.subcoolingK ?? null,
        meanDissolvedOxygenPpb: w?.dissolvedOxygenPpb ?? null,
        meanAirRemovalKgS: w?.airRemovalKgS ?? null,
        airLeakSuspected: facts?.airLeakSuspected(day) ?? false,
        meanDutyMw: mean('dutyMw'),
        heatBalanceDutyMw: facts && meanLoad !== null ? facts.heatBalanceDutyMw(meanLoad) : null,
        stuckSensors: stuck.length ? JSON.stringify(stuck) : null,
        meanBackpressureKpa: mean('backpressureKpa'),
        meanExpectedBackpressureKpa: mean('expectedBackpressureKpa'),
        meanExcessBackpressureKpa: mean('excessBackpressureKpa'),
        meanCwInletC: mean('cwInletC'),
        meanLoadMw: meanLoad,
        meanHeatRatePenaltyPct: mean('heatRatePenaltyPct'),
        foulingKpa: mean('foulingKpa'),
        cwInletKpa: mean('cwInletKpa'),
        cwFlowKpa: mean('cwFlowKpa'),
        loadKpa: mean('loadKpa'),
        pluggingKpa: mean('pluggingKpa'),
        unexplainedKpa: mean('unexplainedKpa'),
        foulingCost: a.used ? mean('foulingCostPerHour')! * hours : null,
        unexplainedCost: a.used ? mean('unexplainedCostPerHour')! * hours : null,
      };
    });
  }
}

/** Replaces the unit's daily figures with the ones of the points gathered; gives the number of days. */
export async function storeDailyAggregates(ds: DataSource, unitId: string, acc: DailyAccumulator, facts?: DayFacts): Promise<number> {
  await replaceDailyAggregates(ds.manager, unitId, acc.rows(unitId, facts));
  return acc.dayCount;
}

/** Reads every point of the unit and rebuilds its daily figures from the stored values. */
export async function rebuildDailyAggregates(ds: DataSource, unitId: string, dayOf: (ts: number) => string, facts?: DayFacts): Promise<number> {
  const acc = new DailyAccumulator(dayOf);
  let lastId = '0';
  for (;;) {
    const rows = await samplesAfter(ds.manager, unitId, lastId, 20_000, READ);
    if (rows.length === 0) break;
    lastId = String(rows[rows.length - 1]!.id); // rows is not empty here
    for (const r of rows) acc.add(r);
  }
  return storeDailyAggregates(ds, unitId, acc, facts);
}
