import type { Fuel } from '@shared/domain/turbine/emission-factors';
import type { EconomicsSetup } from '@shared/schemas/unit-setup';
import { ValueList } from '@frontend/components/ui/read-only';
import { formatStored, type FieldUnits } from '@frontend/lib/field-units';
import { formatNumber, formatPercent } from '@frontend/lib/format';
import { CO2_FACTOR_NOTE, FUEL_LABELS } from './fuel-words';

/** The saved economics as text, money in the unit's own currency. */
export function EconomicsValues({ saved, units }: { saved: EconomicsSetup | null; units: FieldUnits }) {
  if (!saved) return <p className="text-sm text-ink-soft">The economics have not been set up yet.</p>;
  const money = (label: string) => label.replace('$', saved.currency);
  const fuelPrice = { ...units.fuelPricePerMmbtu, label: money(units.fuelPricePerMmbtu.label) };
  return (
    <div data-testid="economics-values">
      <ValueList
        label="Economics"
        items={[
          { label: 'Fuel', value: FUEL_LABELS[saved.fuel as Fuel] ?? saved.fuel },
          { label: 'CO2 factor', value: formatStored(saved.co2KgPerMmbtu, units.co2KgPerMmbtu), note: CO2_FACTOR_NOTE },
          { label: 'Currency', value: saved.currency },
          { label: 'Fuel price', value: formatStored(saved.fuelPricePerMmbtu, fuelPrice) },
          {
            label: 'Replacement power price',
            value: `${formatNumber(saved.replacementPricePerMwh, 2)} ${money('$/MWh')}`,
            note: 'What lost output costs when it must be bought or made elsewhere',
          },
          {
            label: 'Capacity-limited share of hours',
            value: formatPercent(saved.capacityLimitedShare, 0),
            note: 'Hours when backpressure limits the output the unit could sell',
          },
          { label: 'CO2 price', value: `${formatNumber(saved.co2PricePerTonne, 2)} ${money('$/t')}` },
          { label: 'Discount rate', value: `${formatPercent(saved.discountRate, 1)} a year` },
        ]}
      />
    </div>
  );
}
