/**
 * Daily aggregates per unit and plant-local day: median cleanliness and TTD, mean backpressures and
 * deviation parts of the valid points, and the day's fouling and unexplained cost. Costs: the mean cost
 * per hour of the valid points times the hours the day's points cover (points × the unit's median sampling
 * interval, at most 24 h), so a day with few valid points is not costed as if it had none.
 */
import type { DataSource } from 'typeorm';
import { median } from '@shared/domain/statistics.js';

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

const MEANS = ['backpressureKpa', 'expectedBackpressureKpa', 'excessBackpressureKpa', 'cwInletC', 'loadMw', 'heatRatePenaltyPct', 'foulingKpa', 'cwInletKpa', 'cwFlowKpa', 'loadKpa', 'pluggingKpa', 'unexplainedKpa', 'foulingCostPerHour', 'unexplainedCostPerHour', 'dutyMw'] as const;

export async function rebuildDailyAggregates(ds: DataSource, unitId: string, dayOf: (ts: number) => string, facts?: DayFacts): Promise<number> {
  const days = new Map<string, Acc>();
  const intervals: number[] = [];
  let lastTs: number | null = null;
  let lastId = '0';
  for (;;) {
    const rows: Record<string, unknown>[] = await ds.query(
      `SELECT id, timestampUtc AS ts, validity, cleanliness, ttdK, cwOutletC, cwFlowM3s, ${MEANS.join(', ')} FROM performance_sample WHERE unitId = ? AND id > ? ORDER BY id LIMIT 20000`,
      [unitId, lastId],
    );
    if (rows.length === 0) break;
    lastId = String(rows[rows.length - 1].id);
    for (const r of rows) {
      const ts = new Date(r.ts as string).getTime();
      if (lastTs !== null && intervals.length < 5000 && ts > lastTs) intervals.push(ts - lastTs);
      lastTs = ts;
      const day = dayOf(ts);
      let acc = days.get(day);
      if (!acc) days.set(day, (acc = { first: {}, changed: new Set(), all: 0, used: 0, dropped: 0, byReason: {}, cf: [], ttd: [], sums: Object.fromEntries(MEANS.map((m) => [m, 0])) }));
      acc.all++;
      for (const sensor of SENSORS) {
        const v = r[sensor] === null ? null : Number(r[sensor]);
        if (!(sensor in acc.first)) acc.first[sensor] = v;
        else if (acc.first[sensor] !== v) acc.changed.add(sensor);
      }
      const valid = r.validity === 'ok' && r.cleanliness !== null;
      if (!valid) {
        acc.dropped++;
        const reason = String(r.validity === 'ok' ? 'not-analysed' : r.validity);
        acc.byReason[reason] = (acc.byReason[reason] ?? 0) + 1;
        continue;
      }
      acc.used++;
      acc.cf.push(Number(r.cleanliness));
      acc.ttd.push(Number(r.ttdK));
      for (const m of MEANS) acc.sums[m] += Number(r[m] ?? 0);
    }
  }
  const intervalH = Math.min(24, (median(intervals) ?? 3_600_000) / 3_600_000);

  await ds.transaction(async (em) => {
    await em.query('DELETE FROM daily_aggregate WHERE unitId = ?', [unitId]);
    const entries = [...days.entries()];
    for (let i = 0; i < entries.length; i += 1000) {
      const slice = entries.slice(i, i + 1000);
      const values: unknown[] = [];
      for (const [day, a] of slice) {
        const mean = (m: (typeof MEANS)[number]) => (a.used ? a.sums[m] / a.used : null);
        const hours = Math.min(24, (a.used + a.dropped) * intervalH);
        const stuck = a.used >= STUCK_MIN_POINTS ? SENSORS.filter((sensor) => !a.changed.has(sensor)) : [];
        const w = facts?.witnesses(day);
        const meanLoad = mean('loadMw');
        values.push(
          facts?.trendCleanliness(day) ?? null, w?.subcoolingK ?? null, w?.dissolvedOxygenPpb ?? null, w?.airRemovalKgS ?? null,
          facts?.airLeakSuspected(day) ?? false, mean('dutyMw'), facts && meanLoad !== null ? facts.heatBalanceDutyMw(meanLoad) : null,
          stuck.length ? JSON.stringify(stuck) : null,
          unitId, day, a.used, a.dropped, JSON.stringify(a.byReason), median(a.cf), median(a.ttd),
          mean('backpressureKpa'), mean('expectedBackpressureKpa'), mean('excessBackpressureKpa'), mean('cwInletC'), mean('loadMw'), mean('heatRatePenaltyPct'),
          mean('foulingKpa'), mean('cwInletKpa'), mean('cwFlowKpa'), mean('loadKpa'), mean('pluggingKpa'), mean('unexplainedKpa'),
          a.used ? mean('foulingCostPerHour')! * hours : null, a.used ? mean('unexplainedCostPerHour')! * hours : null,
        );
      }
      await em.query(
        `INSERT INTO daily_aggregate (trendCleanliness, meanSubcoolingK, meanDissolvedOxygenPpb, meanAirRemovalKgS, airLeakSuspected, meanDutyMw, heatBalanceDutyMw, stuckSensors,
           unitId, day, pointsUsed, pointsDropped, droppedByReason, medianCleanliness, medianTtdK, meanBackpressureKpa, meanExpectedBackpressureKpa,
           meanExcessBackpressureKpa, meanCwInletC, meanLoadMw, meanHeatRatePenaltyPct, foulingKpa, cwInletKpa, cwFlowKpa, loadKpa, pluggingKpa, unexplainedKpa, foulingCost, unexplainedCost)
         VALUES ${slice.map(() => `(${new Array(29).fill('?').join(',')})`).join(',')}`,
        values,
      );
    }
  });
  return days.size;
}
