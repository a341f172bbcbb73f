/** The `daily_aggregate` row the recompute writes, keyed by column name, and its columns named once. */

/** One `daily_aggregate` row as written, keyed by column name. */
export interface DailyAggregateRow {
  unitId: string;
  day: string;
  pointsUsed: number;
  pointsDropped: number;
  /** JSON: points left out per reason */
  droppedByReason: string;
  medianCleanliness: number | null;
  medianTtdK: number | null;
  trendCleanliness: number | null;
  meanSubcoolingK: number | null;
  meanDissolvedOxygenPpb: number | null;
  meanAirRemovalKgS: number | null;
  airLeakSuspected: boolean;
  meanDutyMw: number | null;
  heatBalanceDutyMw: number | null;
  /** JSON: raw sensors that never changed over the day */
  stuckSensors: string | null;
  meanBackpressureKpa: number | null;
  meanExpectedBackpressureKpa: number | null;
  meanExcessBackpressureKpa: number | null;
  meanCwInletC: number | null;
  meanLoadMw: number | null;
  meanHeatRatePenaltyPct: number | null;
  foulingKpa: number | null;
  cwInletKpa: number | null;
  cwFlowKpa: number | null;
  loadKpa: number | null;
  pluggingKpa: number | null;
  unexplainedKpa: number | null;
  foulingCost: number | null;
  unexplainedCost: number | null;
}

// Every column of the row type, named once: the compiler fails if a column is added to one and not the other.
const COLUMN_SET: Record<keyof DailyAggregateRow, true> = {
  unitId: true,
  day: true,
  pointsUsed: true,
  pointsDropped: true,
  droppedByReason: true,
  medianCleanliness: true,
  medianTtdK: true,
  trendCleanliness: true,
  meanSubcoolingK: true,
  meanDissolvedOxygenPpb: true,
  meanAirRemovalKgS: true,
  airLeakSuspected: true,
  meanDutyMw: true,
  heatBalanceDutyMw: true,
  stuckSensors: true,
  meanBackpressureKpa: true,
  meanExpectedBackpressureKpa: true,
  meanExcessBackpressureKpa: true,
  meanCwInletC: true,
  meanLoadMw: true,
  meanHeatRatePenaltyPct: true,
  foulingKpa: true,
  cwInletKpa: true,
  cwFlowKpa: true,
  loadKpa: true,
  pluggingKpa: true,
  unexplainedKpa: true,
  foulingCost: true,
  unexplainedCost: true,
};
export const DAILY_AGGREGATE_COLUMNS = Object.keys(COLUMN_SET) as (keyof DailyAggregateRow)[];
