import { useRef, useState, type FormEvent } from 'react';
import { CO2_KG_PER_MMBTU, type Fuel } from '@shared/domain/turbine/emission-factors';
import { economicsSetup, FUELS, type EconomicsSetup } from '@shared/schemas/unit-setup';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { RequiredNote } from '@frontend/components/ui/required-mark';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { useDirty } from '@frontend/lib/use-dirty';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import type { FieldUnits } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useSaveSetupPart } from '../api/save-setup-part';
import { EconomicsValues } from './economics-values';
import { CO2_FACTOR_NOTE, FUEL_LABELS } from './fuel-words';
import { storedValues, textFromStored, type FieldKind } from './setup-fields';

const FIELDS = ['co2KgPerMmbtu', 'fuelPricePerMmbtu', 'replacementPricePerMwh', 'capacityLimitedShare', 'co2PricePerTonne', 'discountRate'] as const;
type Field = (typeof FIELDS)[number];

interface Props {
  organisationId: string;
  unitId: string;
  saved: EconomicsSetup | null;
  units: FieldUnits;
  cannotWrite: string | null;
}

/** The economics section: the form for people who may change the unit, its saved values as text for the rest. */
export function EconomicsForm(props: Props) {
  return props.cannotWrite ? <EconomicsValues saved={props.saved} units={props.units} /> : <EconomicsEditor {...props} />;
}

function EconomicsEditor({ organisationId, unitId, saved, units }: Omit<Props, 'cannotWrite'>) {
  const save = useSaveSetupPart(organisationId, unitId, 'economics');
  const kinds: Record<Field, FieldKind> = {
    co2KgPerMmbtu: { unit: units.co2KgPerMmbtu },
    fuelPricePerMmbtu: { unit: units.fuelPricePerMmbtu },
    replacementPricePerMwh: 'plain',
    capacityLimitedShare: 'percent',
    co2PricePerTonne: 'plain',
    discountRate: 'percent',
  };
  const [fuel, setFuel] = useState<string>(saved?.fuel ?? '');
  const [currency, setCurrency] = useState(saved?.currency ?? 'USD');
  const [texts, setTexts] = useState<Record<Field, string>>(() => {
    const t = Object.fromEntries(FIELDS.map((f) => [f, textFromStored(saved?.[f] ?? null, kinds[f])])) as Record<Field, string>;
    if (!saved) Object.assign(t, { co2PricePerTonne: '0', discountRate: '8' });
    return t;
  });
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const { dirty, rebase } = useDirty({ fuel, currency, texts });
  const [savedAt, setSavedAt] = useState<number | null>(null);
  const set = (f: Field) => (text: string) => setTexts((t) => ({ ...t, [f]: text }));

  const chooseFuel = (value: string) => {
    setFuel(value);
    if (value in CO2_KG_PER_MMBTU) set('co2KgPerMmbtu')(textFromStored(CO2_KG_PER_MMBTU[value as Fuel], kinds.co2KgPerMmbtu));
  };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = economicsSetup.safeParse({ ...storedValues(texts, kinds), fuel: fuel || undefined, currency: currency.trim().toUpperCase() });
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    save.mutate(parsed.data, {
      onSuccess: () => {
        setSavedAt(Date.now());
        rebase();
      },
      onError: (e) => setFieldErrors(serverFieldErrors(e)),
    });
  };

  const money = (label: string) => label.replace('$', currency.trim().toUpperCase() || '$');
  const message = formMessage(save.error);
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-label="Economics" className="flex flex-col gap-4">
      <UnsavedChangesGuard dirty={dirty && !save.isPending} />
      <RequiredNote />
      <FormProblems errors={fieldErrors} />
      <div className="grid gap-3 sm:grid-cols-3">
        <SelectField required label="Fuel" value={fuel} onChange={(e) => chooseFuel(e.target.value)} error={fieldErrors.fuel}>
          <option value="">Choose…</option>
          {FUELS.map((f) => (
            <option key={f} value={f}>
              {FUEL_LABELS[f as Fuel] ?? f}
            </option>
          ))}
        </SelectField>
        <QuantityField
          required
          label="CO2 factor"
          unit={units.co2KgPerMmbtu.label}
          value={texts.co2KgPerMmbtu}
          onChange={set('co2KgPerMmbtu')}
          error={fieldErrors.co2KgPerMmbtu}
          hint={`Filled in from the fuel. ${CO2_FACTOR_NOTE}`}
        />
        <TextField
          required
          label="Currency"
          value={currency}
          maxLength={3}
          onChange={(e) => setCurrency(e.target.value)}
          error={fieldErrors.currency}
          hint="Three-letter code, e.g. USD"
        />
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        <QuantityField
          required
          label="Fuel price"
          unit={money(units.fuelPricePerMmbtu.label)}
          value={texts.fuelPricePerMmbtu}
          onChange={set('fuelPricePerMmbtu')}
          error={fieldErrors.fuelPricePerMmbtu}
        />
        <QuantityField
          required
          label="Replacement power price"
          unit={money('$/MWh')}
          value={texts.replacementPricePerMwh}
          onChange={set('replacementPricePerMwh')}
          error={fieldErrors.replacementPricePerMwh}
          hint="What lost output costs when it must be bought or made elsewhere"
        />
        <QuantityField
          required
          label="Capacity-limited share of hours"
          unit="%"
          value={texts.capacityLimitedShare}
          onChange={set('capacityLimitedShare')}
          error={fieldErrors.capacityLimitedShare}
          hint="Hours when backpressure limits the output the unit could sell"
        />
        <QuantityField
          required
          label="CO2 price"
          unit={money('$/t')}
          value={texts.co2PricePerTonne}
          onChange={set('co2PricePerTonne')}
          error={fieldErrors.co2PricePerTonne}
        />
        <QuantityField
          required
          label="Discount rate"
          unit="% a year"
          value={texts.discountRate}
          onChange={set('discountRate')}
          error={fieldErrors.discountRate}
        />
      </div>
      {message && <Notice tone="fault">{message}</Notice>}
      {savedAt && !save.isPending && !save.isError && <Notice tone="ok">Economics saved. The unit’s derived data is being recomputed.</Notice>}
      <div>
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save economics'}
        </Button>
      </div>
    </form>
  );
}
