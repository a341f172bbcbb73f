/**
 * Builds the per-day penalty tables from the full models: for each horizon day and each grid cleanliness, the
 * expected backpressure from the condenser model P(t1, W, Q, Np, CF) (ENGINEERING.md §3) under that day's CW
 * inlet temperature and load, then the turbine penalty between it and the backpressure at the top of the grid
 * through the correction curve, then its cost (§4) at that day's prices, split into heat-rate hours (extra fuel
 * and its CO2) and capacity-limited hours (lost MW at the replacement price).
 *
 * Simplification (labelled): the heat rejected is taken linear in load, Q(L) = designDutyMw·L, and the design
 * heat rate holds at every load.
 */
import { backpressureAtCleanlinessKpa, type CondenserGeometry, type HeiTables } from '../../condenser/index.js';
import { GENERIC_CORRECTION_CURVE, penaltyBetween, penaltyCostPerHour, type CorrectionCurve } from '../../turbine/index.js';
import type { DailyDrivers } from '../drivers/seasonal-drivers.js';
import { DEFAULT_CLEANLINESS_GRID, emptyTable, gridCleanliness, type CleanlinessGrid, type PenaltyCostTable } from './penalty-cost-table.js';
import type { LostGenerationEconomics } from './schedule-problem.js';

export interface UnitPenaltyModel {
  geometry: CondenserGeometry;
  /** CW volume flow, m³/s (held for every day) */
  cwFlowM3s: number;
  /** heat rejected to the cooling water at full load, MW */
  designDutyMw: number;
  pluggedTubes: number;
  ratingMw: number;
  heatRateBtuKwh: number;
  co2KgPerMmbtu: number;
  /** share of hours the unit is capacity-limited (penalty costed as lost MW), 0…1 */
  capacityLimitedShare: number;
  /** the turbine maker's exhaust-pressure correction; the generic curve when absent */
  curve?: CorrectionCurve;
  heiTables?: HeiTables;
  /** multiplier on the HEI clean coefficient (a user's U* relative to HEI) */
  uCleanScale?: number;
}

/** Duty at a load fraction: linear in load (a labelled simplification of the heat balance). */
export function dutyAtLoadMw(model: Pick<UnitPenaltyModel, 'designDutyMw'>, loadFraction: number): number {
  return model.designDutyMw * loadFraction;
}

export function buildPenaltyTable(
  model: UnitPenaltyModel,
  drivers: DailyDrivers,
  grid: CleanlinessGrid = DEFAULT_CLEANLINESS_GRID,
  /** days the unit is down (planned outages): their rows stay zero */
  offline?: Uint8Array,
): PenaltyCostTable {
  const days = drivers.dates.length;
  const table = emptyTable(days, grid);
  const curve = model.curve ?? GENERIC_CORRECTION_CURVE;
  const share = model.capacityLimitedShare;
  if (!(share >= 0 && share <= 1)) throw new Error('capacityLimitedShare must be between 0 and 1');
  const top = gridCleanliness(table, table.size - 1);
  const backpressures = new Float64Array(table.size);
  const state = {
    geometry: model.geometry,
    cwInletC: 0,
    cwFlowM3s: model.cwFlowM3s,
    dutyMw: 0,
    pluggedTubes: model.pluggedTubes,
    cleanliness: 1,
    heiTables: model.heiTables,
    uCleanScale: model.uCleanScale,
  };
  for (let d = 0; d < days; d++) {
    const load = drivers.loadFraction[d]!;
    if ((offline && offline[d]) || !(load > 0)) continue;
    state.cwInletC = drivers.cwInletC[d]!;
    state.dutyMw = dutyAtLoadMw(model, load);
    for (let i = 0; i < table.size; i++) {
      state.cleanliness = gridCleanliness(table, i);
      backpressures[i] = backpressureAtCleanlinessKpa(state);
    }
    state.cleanliness = top;
    const referenceKpa = backpressureAtCleanlinessKpa(state);
    // The hourly cost is linear in the heat-rate and output penalties (§4), so the turbine cost model is
    // evaluated once per day at 1 % each and scaled per grid point.
    const perPct = penaltyCostPerHour({
      ratingMw: model.ratingMw,
      loadFraction: load,
      heatRateBtuKwh: model.heatRateBtuKwh,
      heatRatePenaltyPct: 1,
      outputPenaltyPct: 1,
      fuelPricePerMmbtu: drivers.fuelPricePerMmbtu[d]!,
      co2PricePerTonne: drivers.co2PricePerTonne[d]!,
      co2KgPerMmbtu: model.co2KgPerMmbtu,
      replacementPricePerMwh: drivers.replacementPricePerMwh[d]!,
    });
    const fuelPerPctDay = 24 * (1 - share) * perPct.fuelCostPerHour;
    const co2PerPctDay = 24 * (1 - share) * perPct.co2CostPerHour;
    const capacityPerPctDay = 24 * share * perPct.capacityCostPerHour;
    for (let i = 0; i < table.size; i++) {
      const penalty = penaltyBetween(curve, load, backpressures[i]!, referenceKpa);
      const k = d * table.size + i;
      table.heatRateFuel[k] = fuelPerPctDay * penalty.heatRatePenaltyPct;
      table.co2[k] = co2PerPctDay * penalty.heatRatePenaltyPct;
      table.capacity[k] = capacityPerPctDay * penalty.outputPenaltyPct;
    }
  }
  return table;
}

/** Per-day load and value of lost generation: replacement price and the unit's own fuel and CO2 cost per MWh (§4). */
export function lostGenerationFromDrivers(
  model: Pick<UnitPenaltyModel, 'ratingMw' | 'heatRateBtuKwh' | 'co2KgPerMmbtu'>,
  drivers: DailyDrivers,
): LostGenerationEconomics {
  const mmbtuPerMwh = model.heatRateBtuKwh / 1000;
  return {
    ratingMw: model.ratingMw,
    loadFraction: Float64Array.from(drivers.loadFraction),
    replacementPricePerMwh: Float64Array.from(drivers.replacementPricePerMwh),
    ownFuelCostPerMwh: drivers.fuelPricePerMmbtu.map((p) => mmbtuPerMwh * p),
    ownCo2CostPerMwh: drivers.co2PricePerTonne.map((p) => (mmbtuPerMwh * model.co2KgPerMmbtu * p) / 1000),
  };
}
