/**
 * A cleanliness recovered by a piece of work, priced with the unit's own model at its recent typical conditions:
 * the median CW inlet temperature and load of its last 90 days with valid data and the median measured cleanliness
 * of the last 30 of them. The condenser model gives the backpressure before and after the recovery at those
 * conditions (design CW flow, the setup's plugged tubes, the heat-balance duty at that load), the turbine correction
 * curve the heat-rate and output penalty between them, and the unit's economics its cost per day (fuel and CO2 for
 * the hours at held load, replacement power for the capacity-limited share), as the monitoring prices fouling
 * (shared/domain/monitoring/sample-analysis.ts blendedCostPerHour). That cost per day is held over the horizon:
 * no fouling back, no seasons, undiscounted (labelled simplifications, said in the sentence).
 */
import Decimal from 'decimal.js';
import { backpressureAtCleanlinessKpa } from '@shared/domain/condenser/index.js';
import { blendedCostPerHour, type UnitModel } from '@shared/domain/monitoring/index.js';
import { median } from '@shared/domain/statistics.js';
import { penaltyBetween } from '@shared/domain/turbine/index.js';
import { formatCurrency, formatDay, formatNumber } from '@shared/text/display-format.js';
import { cToF, kpaToInHg } from '@shared/units.js';

/** Days of data the conditions are taken from, and the most recent of them the cleanliness is taken from. */
export const CONDITION_DAYS = 90;
export const CLEANLINESS_DAYS = 30;

export interface OperatingDay {
  day: string;
  cleanliness: number;
  cwInletC: number;
  loadMw: number;
}

export interface CleanlinessPricingInput {
  unitName: string;
  model: UnitModel;
  /** CW volume flow held for the pricing, m³/s (the setup's design flow) */
  cwFlowM3s: number;
  pluggedTubes: number;
  /** the unit's recent days with valid data, oldest first (at most CONDITION_DAYS are used) */
  days: readonly OperatingDay[];
  cleanlinessRecovered: number;
  horizonDays: number;
  currency: string;
}

export interface CleanlinessPricing {
  benefit: Decimal;
  costPerDay: Decimal;
  cleanlinessBefore: number;
  cleanlinessAfter: number;
  cwInletC: number;
  loadFraction: number;
  backpressureBeforeKpa: number;
  backpressureAfterKpa: number;
  text: string;
}

export function priceCleanlinessRecovered(input: CleanlinessPricingInput): CleanlinessPricing {
  const days = input.days.slice(-CONDITION_DAYS);
  if (days.length === 0) throw new RangeError('no days with valid data');
  const cwInletC = median(days.map((d) => d.cwInletC))!;
  const loadFraction = median(days.map((d) => d.loadMw))! / input.model.ratingMw;
  const before = median(days.slice(-CLEANLINESS_DAYS).map((d) => d.cleanliness))!;
  const model = input.model;
  // Clean tubes are CF 1 by the HEI definition (CF = U/U_clean) and the unit's reference is what its preferred
  // cleaning reaches (ENGINEERING.md §4): a recovery is priced up to the reference, never beyond it, and never
  // below where the unit is now.
  const after = Math.max(before, Math.min(before + input.cleanlinessRecovered, model.referenceCleanliness));
  const at = (cleanliness: number) =>
    backpressureAtCleanlinessKpa({
      geometry: model.geometry,
      heiTables: model.heiTables,
      cwInletC,
      cwFlowM3s: input.cwFlowM3s,
      dutyMw: model.heatBalanceDutyMw(loadFraction),
      pluggedTubes: input.pluggedTubes,
      cleanliness,
    });
  const pBefore = at(before);
  const pAfter = after > before ? at(after) : pBefore;
  const penalty = penaltyBetween(model.curve, loadFraction, pBefore, pAfter);
  const perDay = Math.max(0, 24 * blendedCostPerHour(model, loadFraction, penalty));
  const costPerDay = new Decimal(perDay).toDecimalPlaces(2);
  const benefit = costPerDay.times(input.horizonDays).toDecimalPlaces(2);
  const capped =
    after < before + input.cleanlinessRecovered
      ? ` (capped at the unit’s reference of ${formatNumber(model.referenceCleanliness * 100, Number.isInteger(Math.round(model.referenceCleanliness * 1000) / 10) ? 0 : 1)} %)`
      : '';
  const days1 = input.horizonDays === 1 ? 'day' : 'days';
  const first = days[0]!.day;
  const last = days.at(-1)!.day;
  const text =
    `${formatNumber(input.cleanlinessRecovered * 100, 1)} points of cleanliness recovered on ${input.unitName}, from ${formatNumber(before * 100, 1)} % ` +
    `to ${formatNumber(after * 100, 1)} %${capped}, at its typical conditions of ${days.length} days with data from ${formatDay(first)} to ${formatDay(last)} ` +
    `(CW inlet ${formatNumber(cwInletC, 1)} °C (${formatNumber(cToF(cwInletC), 1)} °F), load ${formatNumber(loadFraction * 100, 0)} %): ` +
    `backpressure ${formatNumber(pBefore, 2)} → ${formatNumber(pAfter, 2)} kPa(a) (${formatNumber(kpaToInHg(pBefore), 2)} → ` +
    `${formatNumber(kpaToInHg(pAfter), 2)} inHgA), worth ${formatCurrency(costPerDay.toNumber(), input.currency, 2)} a day × ${input.horizonDays} ${days1} = ` +
    `${formatCurrency(benefit.toNumber(), input.currency, 0)} (conditions held over the horizon, no fouling back, undiscounted).`;
  return {
    benefit,
    costPerDay,
    cleanlinessBefore: before,
    cleanlinessAfter: after,
    cwInletC,
    loadFraction,
    backpressureBeforeKpa: pBefore,
    backpressureAfterKpa: pAfter,
    text,
  };
}
