import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { DEFAULT_POINT_RANGES } from '@shared/domain/validity/point-validity';
import { Button } from '@frontend/components/ui/button';
import { formatStored } from '@frontend/lib/field-units';
import { CaseNumberField } from './case-number-field';
import type { DriverName } from './case-units';
import { InputGroup, SourceBadge, type InputGroupProps } from './input-group';

type DriverValue = CalcScheduleInput['drivers']['cwInletC'];

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

// The same bounds the input schema enforces (shared/schemas/calc-schedule.ts); CW inlet: DEFAULT_POINT_RANGES, common practice.
const DRIVERS: { name: DriverName; label: string; min?: number; max?: number }[] = [
  { name: 'cwInletC', label: 'CW inlet temperature', min: DEFAULT_POINT_RANGES.cwInletC.min, max: DEFAULT_POINT_RANGES.cwInletC.max },
  { name: 'loadFraction', label: 'Load (share of rating; 0 = off line)', min: 0, max: 1.2 },
  { name: 'fuelPricePerMmbtu', label: 'Fuel price', min: 0 },
  { name: 'replacementPricePerMwh', label: 'Replacement power price' },
  { name: 'co2PricePerTonne', label: 'CO₂ price', min: 0 },
];

const mean = (values: number[]) => values.reduce((a, b) => a + b, 0) / values.length;

function DriverField({ driver, value, props }: { driver: (typeof DRIVERS)[number]; value: DriverValue; props: InputGroupProps }) {
  const { editable, units, change } = props;
  const unit = units[driver.name];
  const set = (next: DriverValue) => change((d) => ({ ...d, drivers: { ...d.drivers, [driver.name]: next } }));
  const bounds = { min: driver.min, max: driver.max, editable, unit };
  if (typeof value === 'number') {
    return (
      <div className="flex flex-col gap-1">
        <CaseNumberField label={driver.label} value={value} onValue={set} {...bounds} />
        <SourceBadge sourceKey={`drivers.${driver.name}`} props={props} />
        {editable && (
          <Button variant="quiet" className="self-start text-xs" onClick={() => set({ monthly: Array.from({ length: 12 }, () => value) })}>
            Vary by month
          </Button>
        )}
      </div>
    );
  }
  if ('monthly' in value) {
    return (
      <div className="flex flex-col gap-1">
        <p className="text-sm font-medium">
          {driver.label} <span className="font-normal text-ink-soft">by month ({unit.label})</span>
        </p>
        <SourceBadge sourceKey={`drivers.${driver.name}`} props={props} />
        <div className="grid grid-cols-4 gap-2 sm:grid-cols-6">
          {value.monthly.map((v, i) => (
            <CaseNumberField
              key={MONTHS[i]}
              label={MONTHS[i] ?? `Month ${i + 1}`}
              value={v}
              onValue={(next) => set({ monthly: value.monthly.map((old, j) => (j === i ? next : old)) })}
              {...bounds}
              unit={{ ...unit, label: '' }}
            />
          ))}
        </div>
        {editable && (
          <Button variant="quiet" className="self-start text-xs" onClick={() => set(Number(mean(value.monthly).toFixed(4)))}>
            One value all year
          </Button>
        )}
      </div>
    );
  }
  const lo = Math.min(...value.daily);
  const hi = Math.max(...value.daily);
  return (
    <div className="flex flex-col gap-1">
      <p className="text-sm font-medium">{driver.label}</p>
      <p className="text-sm text-ink-soft">
        One value per day ({value.daily.length} days), from {formatStored(lo, unit)} to {formatStored(hi, unit)}
      </p>
      <SourceBadge sourceKey={`drivers.${driver.name}`} props={props} />
      {editable && (
        <Button variant="quiet" className="self-start text-xs" onClick={() => set(Number(mean(value.daily).toFixed(4)))}>
          Replace by one value (the mean)
        </Button>
      )}
    </div>
  );
}

/** What the condenser works against and what its losses cost: cooling water, load and prices over the horizon. */
export function DriverInputs(props: InputGroupProps) {
  const d = props.inputs.drivers;
  return (
    <InputGroup title="Drivers" what="Cooling water, load and prices over the horizon: one value, one per month, or one per day." testId="inputs-drivers">
      {DRIVERS.map((driver) => (
        <DriverField key={driver.name} driver={driver} value={d[driver.name] ?? 0} props={props} />
      ))}
    </InputGroup>
  );
}
