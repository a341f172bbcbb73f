/** `calc penalty`: heat-rate and capacity penalty between two backpressures, and its cost per hour (§4). */
import Decimal from 'decimal.js';
import type { CalcCommand } from '../run-calc.js';
import { calcPenaltyInput, calcPenaltyOutput, type CalcPenaltyOutput } from '@shared/schemas/calc-penalty.js';
import { curveExtrapolationWarning, GENERIC_CORRECTION_CURVE, penaltyBetween, penaltyCostPerHour } from '@shared/domain/turbine/index.js';

const cents = (x: number): number => new Decimal(x).toDecimalPlaces(2, Decimal.ROUND_HALF_UP).toNumber() || 0;

const command: CalcCommand = {
  input: calcPenaltyInput,
  output: calcPenaltyOutput,
  run(input: unknown): CalcPenaltyOutput {
    const v = calcPenaltyInput.parse(input);
    const curve = v.curve ?? GENERIC_CORRECTION_CURVE;
    const pen = penaltyBetween(curve, v.loadFraction, v.backpressureKpa, v.referenceBackpressureKpa);
    const cost = penaltyCostPerHour({
      ratingMw: v.ratingMw,
      loadFraction: v.loadFraction,
      heatRateBtuKwh: v.heatRateBtuKwh,
      heatRatePenaltyPct: pen.heatRatePenaltyPct,
      outputPenaltyPct: pen.outputPenaltyPct,
      fuelPricePerMmbtu: v.fuelPricePerMmbtu,
      co2PricePerTonne: v.co2PricePerTonne,
      co2KgPerMmbtu: v.co2KgPerMmbtu,
      replacementPricePerMwh: v.replacementPricePerMwh,
    });
    const warnings = curve.isGeneric ? [`correction curve: ${curve.label}`] : [];
    for (const kpa of new Set([v.backpressureKpa, v.referenceBackpressureKpa])) {
      const beyond = curveExtrapolationWarning(curve, v.loadFraction, kpa);
      if (beyond) warnings.push(beyond);
    }
    return {
      heatRatePenaltyPct: pen.heatRatePenaltyPct,
      outputPenaltyPct: pen.outputPenaltyPct,
      fuelCostPerHour: cents(cost.fuelCostPerHour),
      co2CostPerHour: cents(cost.co2CostPerHour),
      capacityCostPerHour: cents(cost.capacityCostPerHour),
      ...(warnings.length ? { warnings } : {}),
    };
  },
};

export default command;
