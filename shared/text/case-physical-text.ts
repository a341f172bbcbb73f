/**
 * The CO2 and lost output behind a case's fouling cost over the horizon, for the plan and for its baseline, in one
 * sentence. The schedule prices each day with the same blended cost as the monitoring (penalty-table-builder.ts),
 * so with constant prices the cost turns back into quantities (shared/domain/turbine/physical-cost.ts: exact when no
 * hours or all hours are capacity-limited, else within about the heat-rate penalty's own share);
 * with prices that change over the horizon one price cannot do it, and the sentence says so; nor can the prices turn
 * back a cost-per-day curve entered instead of the condenser model (directPenalty).
 */
import type { CalcScheduleInput } from '../schemas/calc-schedule.js';
import { physicalCost, type PhysicalCostBasis } from '../domain/turbine/physical-cost.js';
import { formatQuantity } from './physical-cost-text.js';

const constant = (driver: unknown): number | null => (typeof driver === 'number' && Number.isFinite(driver) ? driver : null);

export function casePhysicalSentence(inputs: CalcScheduleInput, planFoulingCost: number, baselineFoulingCost: number): string {
  // A cost-per-day curve entered by hand is money only: it was not made from the heat rate and prices, so they cannot turn it back.
  if (inputs.directPenalty)
    return 'MWh and t CO2 are not shown: the fouling cost comes from the cost-per-day curve entered, not from the unit’s heat rate and prices.';
  const fuel = constant(inputs.drivers.fuelPricePerMmbtu);
  const replacement = constant(inputs.drivers.replacementPricePerMwh);
  const co2Price = constant(inputs.drivers.co2PricePerTonne ?? 0);
  if (fuel === null || replacement === null || co2Price === null)
    return 'MWh and t CO2 are not shown: the prices change over the horizon, so the cost cannot be turned back into quantities with one price.';
  const basis: PhysicalCostBasis = {
    heatRateBtuKwh: inputs.unit.heatRateBtuKwh,
    fuelPricePerMmbtu: fuel,
    co2KgPerMmbtu: inputs.unit.co2KgPerMmbtu ?? 0,
    co2PricePerTonne: co2Price,
    replacementPricePerMwh: replacement,
    capacityLimitedShare: inputs.unit.capacityLimitedShare ?? 0,
  };
  const plan = physicalCost(planFoulingCost, basis);
  const baseline = physicalCost(baselineFoulingCost, basis);
  if (!plan || !baseline) return 'MWh and t CO2 are not shown: the case’s prices give no value to a MWh.';
  const share = basis.capacityLimitedShare;
  const parts = (p: NonNullable<typeof plan>) =>
    [share < 1 ? `${formatQuantity(p.co2Tonnes)} t CO2 from extra fuel` : null, share > 0 ? `${formatQuantity(p.lostMwh)} MWh of output lost` : null]
      .filter(Boolean)
      .join(' and ');
  const co2Avoided = baseline.co2Tonnes - plan.co2Tonnes;
  const avoided =
    share < 1 && Math.abs(co2Avoided) >= 0.05
      ? co2Avoided > 0
        ? ` The plan avoids ${formatQuantity(co2Avoided)} t CO2.`
        : ` The plan emits ${formatQuantity(-co2Avoided)} t CO2 more than the baseline.`
      : '';
  if (plan.penaltyMwh === 0 && baseline.penaltyMwh === 0)
    return 'Fouling costs nothing over the horizon in the plan or the baseline: no extra fuel and no output lost.';
  return `Fouling over the horizon stands for ${parts(plan)} in this plan, against ${parts(baseline)} in the baseline.${avoided}`;
}
