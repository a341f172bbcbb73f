/**
 * Cost per hour of a backpressure penalty (ENGINEERING.md §4).
 * Heat-rate basis (load held, extra fuel): P·1000·HR·ΔHR%/100/10⁶ MMBtu/h × fuel price, plus CO2 =
 * that fuel × emission factor × CO2 price. Capacity basis (firing held): P·ΔkW%/100 × replacement price.
 */
export interface PenaltyCostInput {
  ratingMw: number;
  loadFraction: number;
  heatRateBtuKwh: number;
  heatRatePenaltyPct: number;
  outputPenaltyPct: number;
  fuelPricePerMmbtu: number;
  co2PricePerTonne: number;
  co2KgPerMmbtu: number;
  replacementPricePerMwh: number;
}

export interface PenaltyCostPerHour {
  fuelCostPerHour: number;
  co2CostPerHour: number;
  capacityCostPerHour: number;
}

/** Extra fuel, MMBtu/h, for a heat-rate penalty at load. */
export function extraFuelMmbtuPerHour(loadMw: number, heatRateBtuKwh: number, heatRatePenaltyPct: number): number {
  return (loadMw * 1000 * heatRateBtuKwh * (heatRatePenaltyPct / 100)) / 1e6;
}

export function penaltyCostPerHour(input: PenaltyCostInput): PenaltyCostPerHour {
  for (const [k, v] of Object.entries(input)) {
    if (!Number.isFinite(v)) throw new RangeError(`${k} must be a finite number, got ${String(v)}`);
  }
  const loadMw = input.ratingMw * input.loadFraction;
  const fuelMmbtu = extraFuelMmbtuPerHour(loadMw, input.heatRateBtuKwh, input.heatRatePenaltyPct);
  return {
    fuelCostPerHour: fuelMmbtu * input.fuelPricePerMmbtu,
    co2CostPerHour: ((fuelMmbtu * input.co2KgPerMmbtu) / 1000) * input.co2PricePerTonne,
    capacityCostPerHour: ((loadMw * input.outputPenaltyPct) / 100) * input.replacementPricePerMwh,
  };
}

/**
 * Value of one MWh lost to an outage or derate: replacement price less the unit's own fuel and CO2
 * cost per MWh, since that fuel is not burned.
 */
export function lostGenerationValuePerMwh(input: {
  replacementPricePerMwh: number;
  heatRateBtuKwh: number;
  fuelPricePerMmbtu: number;
  co2KgPerMmbtu: number;
  co2PricePerTonne: number;
}): number {
  const mmbtuPerMwh = (input.heatRateBtuKwh * 1000) / 1e6;
  const ownCost = mmbtuPerMwh * (input.fuelPricePerMmbtu + (input.co2KgPerMmbtu / 1000) * input.co2PricePerTonne);
  return input.replacementPricePerMwh - ownCost;
}
