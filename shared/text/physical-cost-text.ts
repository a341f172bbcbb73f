/**
 * The MW and t CO2 behind a cost, in words for beside the money (screens and reports alike). Zero and negative
 * figures say what they mean; a figure that rounds to nothing reads "under 0.1", never "0 MW" or "−0 MW".
 */
import type { PhysicalCost } from '../domain/turbine/physical-cost.js';
import { formatNumber, formatPercent } from './display-format.js';

/** One decimal below 10, whole units with grouped thousands from 10 on; "under 0.1" for less. */
export function formatQuantity(value: number): string {
  const v = Math.abs(value);
  if (v < 0.05) return 'under 0.1';
  return formatNumber(v, v < 9.95 ? 1 : 0);
}

/** A share that would round to 0 % or 100 % without being either keeps one decimal. */
function shareText(share: number): string {
  return formatPercent(share, (share > 0 && share < 0.01) || (share < 1 && share > 0.99) ? 1 : 0);
}

const NO_CO2_FACTOR = 'no CO2 counted: the CO2 factor of the unit’s fuel is set to 0';
/** Extra fuel burned but no CO2 from it: the fuel's CO2 factor is 0, which "under 0.1 t" would hide. */
const noCo2Factor = (p: PhysicalCost) => p.co2Tonnes === 0 && p.extraFuelMmbtu !== 0;

export interface PhysicalCostWords {
  /** the output lost (or gained) in the capacity-limited hours */
  output: string;
  /** the CO2 of the extra (or saved) fuel in the other hours; null when the output line already says why nothing is shown */
  co2: string | null;
}

/**
 * @param per how the CO2 figure is counted, e.g. "a day" or "since the last cleaning"; with `p.lostMw` the output is
 * a rate in MW, without it the MWh over the same period
 */
export function physicalCostWords(p: PhysicalCost | null, capacityLimitedShare: number, per: string): PhysicalCostWords {
  if (!p) return { output: 'MW and t CO2 not shown: the unit’s prices give no value to a MWh', co2: null };
  if (p.penaltyMwh === 0) return { output: 'no output lost', co2: 'no extra CO2' };
  const better = p.penaltyMwh < 0;
  const share = shareText(capacityLimitedShare);
  const amount = p.lostMw !== null ? `${formatQuantity(p.lostMw)} MW` : `${formatQuantity(p.lostMwh)} MWh`;
  const output =
    capacityLimitedShare <= 0
      ? 'no output lost: load is held with extra fuel in every hour'
      : better
        ? `${amount} more output than at the reference cleanliness, in capacity-limited hours`
        : p.lostMw !== null
          ? `${amount} less output in the ${share} of hours the unit is capacity-limited`
          : `${amount} of output lost in the ${share} of hours the unit is capacity-limited`;
  const co2 =
    capacityLimitedShare >= 1
      ? 'no extra fuel: the unit is capacity-limited in every hour'
      : noCo2Factor(p)
        ? NO_CO2_FACTOR
        : better
          ? `${formatQuantity(p.co2Tonnes)} t CO2 ${per} less than at the reference cleanliness`
          : `${formatQuantity(p.co2Tonnes)} t CO2 ${per} from extra fuel${capacityLimitedShare > 0 ? ' in the other hours' : ''}`;
  return { output, co2 };
}

/**
 * The same quantities short enough for a table cell, one part per quantity: ["10 MW lost when capacity-limited",
 * "90 t CO2 a day"]. Empty when the quantities cannot be told (the long words say why).
 */
export function physicalCostParts(p: PhysicalCost | null, capacityLimitedShare: number, per: string): string[] {
  if (!p) return [];
  if (p.penaltyMwh === 0) return ['no MW or CO2 lost'];
  const better = p.penaltyMwh < 0;
  const parts: string[] = [];
  if (capacityLimitedShare > 0) {
    const amount = p.lostMw !== null ? `${formatQuantity(p.lostMw)} MW` : `${formatQuantity(p.lostMwh)} MWh`;
    parts.push(`${amount} ${better ? 'gained' : 'lost'} when capacity-limited`);
  }
  if (capacityLimitedShare < 1)
    parts.push(noCo2Factor(p) ? 'no CO2 counted (CO2 factor 0)' : `${formatQuantity(p.co2Tonnes)} t CO2 ${per}${better ? ' less' : ''}`);
  return parts;
}

/** The parts in one line: "10 MW lost when capacity-limited · 90 t CO2 a day"; null when the quantities cannot be told. */
export function physicalCostShort(p: PhysicalCost | null, capacityLimitedShare: number, per: string): string | null {
  const parts = physicalCostParts(p, capacityLimitedShare, per);
  return parts.length ? parts.join(' · ') : null;
}
