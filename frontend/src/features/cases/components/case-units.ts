import { KJ_PER_BTU, type DisplayUnit } from '@shared/units';
import { fieldUnits, type UnitSystem } from '@frontend/lib/field-units';

const identity = (v: number) => v;
const fixed = (label: string, decimals: number): DisplayUnit => ({ label, toSi: identity, fromSi: identity, decimals });
const percent = (decimals: number): DisplayUnit => ({ label: '%', toSi: (v) => v / 100, fromSi: (v) => v * 100, decimals });

/**
 * How each case input is shown in the person's units. The stored unit is the input's own (its name says it:
 * `cwInletC`, `fuelPricePerMmbtu`); money is the plant's currency. 1 MMBtu = 1.055056 GJ (NIST SP 811).
 */
export function caseUnits(system: UnitSystem, currency: string) {
  const f = fieldUnits(system);
  const us = system === 'us';
  return {
    cwInletC: f.temperatureC,
    loadFraction: percent(1),
    fuelPricePerMmbtu: us
      ? fixed(`${currency}/MMBtu`, 2)
      : { label: `${currency}/GJ`, toSi: (v: number) => v * KJ_PER_BTU, fromSi: (v: number) => v / KJ_PER_BTU, decimals: 2 },
    replacementPricePerMwh: fixed(`${currency}/MWh`, 2),
    co2PricePerTonne: fixed(`${currency}/t CO₂`, 2),
    ratingMw: f.powerMw,
    heatRateBtuKwh: f.heatRateBtuKwh,
    co2KgPerMmbtu: f.co2KgPerMmbtu,
    share: percent(1),
    rate: percent(2),
    cleanliness: percent(1),
    money: fixed(currency, 0),
    moneyPerTube: fixed(`${currency}/tube`, 2),
    days: fixed('days', 0),
    perDay: fixed('per day', 5),
    factor: fixed('×', 2),
    count: fixed('', 0),
    /** the fouling index and the models' coefficients: small numbers without a unit */
    index: fixed('', 4),
  } satisfies Record<string, DisplayUnit>;
}

export type CaseUnits = ReturnType<typeof caseUnits>;
export type DriverName = 'cwInletC' | 'loadFraction' | 'fuelPricePerMmbtu' | 'replacementPricePerMwh' | 'co2PricePerTonne';
