/**
 * Per-day tables of the backpressure penalty cost against cleanliness: one row per horizon day, one column per
 * point of a uniform cleanliness grid, money per day relative to the cost at the top of the grid. Built once from
 * the full condenser and turbine models (penalty-table-builder.ts) or from a direct cost curve, then interpolated
 * linearly in cleanliness by the scheduler and the Monte Carlo. Three components so prices can be re-scaled
 * without rebuilding: heat-rate fuel, its CO2, and lost capacity at the replacement price.
 */

export interface PenaltyCostTable {
  days: number;
  cfMin: number;
  cfStep: number;
  /** grid points per day */
  size: number;
  /** [day·size + i], money per day */
  heatRateFuel: Float64Array;
  co2: Float64Array;
  capacity: Float64Array;
}

export interface PriceScales {
  fuel: number;
  co2: number;
  replacement: number;
}

export const UNIT_PRICE_SCALES: PriceScales = { fuel: 1, co2: 1, replacement: 1 };

export interface CleanlinessGrid {
  cfMin: number;
  cfMax: number;
  cfStep: number;
}

/** 0.30 … 1.00 by 0.01 (71 points). */
export const DEFAULT_CLEANLINESS_GRID: CleanlinessGrid = { cfMin: 0.3, cfMax: 1.0, cfStep: 0.01 };

export function gridSize(grid: CleanlinessGrid): number {
  const n = Math.round((grid.cfMax - grid.cfMin) / grid.cfStep) + 1;
  if (!(grid.cfMin > 0 && grid.cfMax > grid.cfMin && grid.cfStep > 0 && n >= 2 && n <= 10_000)) throw new Error('the cleanliness grid is not valid');
  return n;
}

export function gridCleanliness(table: Pick<PenaltyCostTable, 'cfMin' | 'cfStep'>, i: number): number {
  return table.cfMin + i * table.cfStep;
}

export function emptyTable(days: number, grid: CleanlinessGrid = DEFAULT_CLEANLINESS_GRID): PenaltyCostTable {
  const size = gridSize(grid);
  return {
    days,
    cfMin: grid.cfMin,
    cfStep: grid.cfStep,
    size,
    heatRateFuel: new Float64Array(days * size),
    co2: new Float64Array(days * size),
    capacity: new Float64Array(days * size),
  };
}

/** Grid position of a cleanliness, clamped to the grid: integer index and weight of the next point. */
export function gridPosition(table: Pick<PenaltyCostTable, 'cfMin' | 'cfStep' | 'size'>, cf: number): { index: number; weight: number } {
  const x = (cf - table.cfMin) / table.cfStep;
  if (!(x > 0)) return { index: 0, weight: 0 };
  if (x >= table.size - 1) return { index: table.size - 2, weight: 1 };
  const index = Math.floor(x);
  return { index, weight: x - index };
}

/** Combined daily penalty cost at a cleanliness, with price scales. */
export function penaltyCostPerDay(table: PenaltyCostTable, day: number, cf: number, scales: PriceScales = UNIT_PRICE_SCALES): number {
  const { index, weight } = gridPosition(table, cf);
  const k = day * table.size + index;
  const at = (a: Float64Array) => a[k]! + weight * (a[k + 1]! - a[k]!);
  return scales.fuel * at(table.heatRateFuel) + scales.co2 * at(table.co2) + scales.replacement * at(table.capacity);
}

/** Combined cost array [day·size + i] at given scales. */
export function combinedCosts(table: PenaltyCostTable, scales: PriceScales = UNIT_PRICE_SCALES): Float64Array {
  const out = new Float64Array(table.heatRateFuel.length);
  for (let k = 0; k < out.length; k++) out[k] = scales.fuel * table.heatRateFuel[k]! + scales.co2 * table.co2[k]! + scales.replacement * table.capacity[k]!;
  return out;
}

export interface CostAtCleanliness {
  cleanliness: number;
  costPerDay: number;
}

/**
 * Simplified direct model: one cost-vs-cleanliness curve (entered by the user, linear between points and held
 * beyond them), optionally scaled by 12 monthly factors (January first) through `monthOfDay`. The whole cost is
 * booked as heat-rate fuel cost. Costs are taken relative to the curve at the top of the grid.
 */
export function tableFromCostCurve(
  days: number,
  curve: readonly CostAtCleanliness[],
  dayFactor: (day: number) => number = () => 1,
  grid: CleanlinessGrid = DEFAULT_CLEANLINESS_GRID,
): PenaltyCostTable {
  if (curve.length < 2) throw new Error('a cost curve needs at least two points');
  const pts = [...curve].sort((a, b) => a.cleanliness - b.cleanliness);
  const at = (cf: number) => {
    if (cf <= pts[0]!.cleanliness) return pts[0]!.costPerDay;
    if (cf >= pts[pts.length - 1]!.cleanliness) return pts[pts.length - 1]!.costPerDay;
    let i = 0;
    while (pts[i + 1]!.cleanliness < cf) i++;
    const a = pts[i]!;
    const b = pts[i + 1]!;
    return a.costPerDay + ((b.costPerDay - a.costPerDay) * (cf - a.cleanliness)) / (b.cleanliness - a.cleanliness);
  };
  const table = emptyTable(days, grid);
  const top = at(grid.cfMax);
  const row = Array.from({ length: table.size }, (_, i) => at(gridCleanliness(table, i)) - top);
  for (let d = 0; d < days; d++) {
    const f = dayFactor(d);
    for (let i = 0; i < table.size; i++) table.heatRateFuel[d * table.size + i] = f * row[i]!;
  }
  return table;
}
