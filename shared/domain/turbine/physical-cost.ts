/**
 * The physical quantities a fouling (or unexplained) cost stands for, turned back from the money with the unit's
 * own prices: the inverse of the blended cost per hour of the monitoring calculation (penalty-cost.ts and
 * blendedCostPerHour in monitoring/sample-analysis.ts), closed form.
 *
 * Per MWh of penalty (the heat-rate equivalent: load × ΔHR%), the cost is
 *   V = (1 − s) · HR/1000 · (fuel price + CO2 kg/MMBtu / 1000 · CO2 price) + s · replacement price,
 * s being the capacity-limited share of hours. So a cost C is C / V MWh of penalty: in the capacity-limited hours
 * it is output lost (s · C / V MWh), in the others extra fuel ((1 − s) · C / V · HR/1000 MMBtu) and its CO2.
 *
 * The lost output is the heat-rate equivalent: with firing held the curve's output loss is ΔHR%/(1 + ΔHR%/100)
 * of load [derived, correction-curve.ts], smaller by ΔHR % of itself (1 % at a 1 % penalty). The stored money prices
 * the capacity-limited hours on that smaller loss, so with 0 < s < 1 one price per MWh cannot undo the blend exactly:
 * fuel and CO2 come out low and MW high by about ΔHR % of themselves (0.4 % and 0.8 % at a 1.2 % penalty and s = 0.15,
 * tests/reference/physical-cost-recomputed.test.ts); exact at s = 0 or 1. Pure: read from the stored daily figures.
 */

export interface PhysicalCostBasis {
  heatRateBtuKwh: number;
  fuelPricePerMmbtu: number;
  co2KgPerMmbtu: number;
  co2PricePerTonne: number;
  replacementPricePerMwh: number;
  /** share of hours the unit is capacity-limited, 0–1 */
  capacityLimitedShare: number;
}

export interface PhysicalCost {
  /** penalty energy over all the hours the cost covers (heat-rate equivalent), MWh */
  penaltyMwh: number;
  /** output lost in the capacity-limited hours, MWh */
  lostMwh: number;
  /** MW less output while capacity-limited (penalty MWh over the hours given); null without hours */
  lostMw: number | null;
  /** extra fuel burned in the hours load is held, MMBtu (HHV) */
  extraFuelMmbtu: number;
  /** CO2 of that fuel, tonnes */
  co2Tonnes: number;
}

/** Cost of one MWh of penalty under the blend of the two bases; see the file comment. */
export function valuePerPenaltyMwh(b: PhysicalCostBasis): number {
  const s = b.capacityLimitedShare;
  return (1 - s) * (b.heatRateBtuKwh / 1000) * (b.fuelPricePerMmbtu + (b.co2KgPerMmbtu / 1000) * b.co2PricePerTonne) + s * b.replacementPricePerMwh;
}

/**
 * @param cost money over a period (a day's stored fouling cost, a mean per day, a sum since a cleaning)
 * @param hours the hours the cost covers (24 for a day); without it no MW figure is given
 * @returns null when the cost is missing or the prices give a MWh no positive value (the quantities cannot be told)
 */
export function physicalCost(cost: number | null | undefined, basis: PhysicalCostBasis, hours?: number): PhysicalCost | null {
  if (cost === null || cost === undefined || !Number.isFinite(cost)) return null;
  for (const v of Object.values(basis)) if (!Number.isFinite(v)) return null;
  const value = valuePerPenaltyMwh(basis);
  if (!(value > 0)) return null;
  const s = Math.min(1, Math.max(0, basis.capacityLimitedShare));
  const penaltyMwh = cost / value;
  const extraFuelMmbtu = (1 - s) * penaltyMwh * (basis.heatRateBtuKwh / 1000);
  return {
    penaltyMwh,
    lostMwh: s * penaltyMwh,
    lostMw: hours !== undefined && hours > 0 ? penaltyMwh / hours : null,
    extraFuelMmbtu,
    co2Tonnes: (extraFuelMmbtu * basis.co2KgPerMmbtu) / 1000,
  };
}
