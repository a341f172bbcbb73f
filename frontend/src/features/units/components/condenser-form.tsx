import { useMemo, useRef, useState, type FormEvent } from 'react';
import { TUBE_MATERIALS } from '@shared/domain/condenser/hei-tables';
import { condenserSetup, type CondenserSetup } from '@shared/schemas/unit-setup';
import { BWG_WALL_IN, inToMm } from '@shared/units';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { RequiredNote } from '@frontend/components/ui/required-mark';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { useDirty } from '@frontend/lib/use-dirty';
import { SelectField } from '@frontend/components/ui/select-field';
import type { FieldUnits, UnitSystem } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useSaveSetupPart } from '../api/save-setup-part';
import { CondenserValues } from './condenser-values';
import { storedFromText, storedValues, textFromStored, unitLabel, type FieldKind } from './setup-fields';
import { TUBE_MATERIAL_LABELS } from './tube-materials';

const NUMBER_FIELDS = [
  'shells',
  'passes',
  'tubeCount',
  'tubeOdMm',
  'tubeLengthM',
  'surfaceM2',
  'pluggedTubes',
  'designPluggedTubes',
  'designCwFlowM3s',
  'designCwInletC',
  'designDutyMw',
  'designBackpressureKpa',
  'designCleanliness',
  'referenceCleanliness',
] as const;
type NumberField = (typeof NUMBER_FIELDS)[number];

function kindsFor(units: FieldUnits): Record<NumberField, FieldKind> {
  return {
    shells: 'count',
    passes: 'count',
    tubeCount: 'count',
    tubeOdMm: { unit: units.tubeOdMm },
    tubeLengthM: { unit: units.tubeLengthM },
    surfaceM2: { unit: units.areaM2 },
    pluggedTubes: 'count',
    designPluggedTubes: 'count',
    designCwFlowM3s: { unit: units.flowM3s },
    designCwInletC: { unit: units.temperatureC },
    designDutyMw: { unit: units.powerMw },
    designBackpressureKpa: { unit: units.pressureKpa },
    designCleanliness: 'percent',
    referenceCleanliness: 'percent',
  };
}

interface Props {
  organisationId: string;
  unitId: string;
  saved: CondenserSetup | null;
  units: FieldUnits;
  system: UnitSystem;
  cannotWrite: string | null;
}

/** Fields the setup may leave blank (the schema's nullable ones). */
const OPTIONAL_FIELDS: ReadonlySet<NumberField> = new Set<NumberField>(['tubeLengthM', 'referenceCleanliness']);

/** The condenser section: the form for people who may change the unit, its saved values as text for the rest. */
export function CondenserForm(props: Props) {
  return props.cannotWrite ? <CondenserValues saved={props.saved} units={props.units} system={props.system} /> : <CondenserEditor {...props} />;
}

function CondenserEditor({ organisationId, unitId, saved, units, system }: Omit<Props, 'cannotWrite'>) {
  const kinds = useMemo(() => kindsFor(units), [units]);
  const save = useSaveSetupPart(organisationId, unitId, 'condenser');
  const [texts, setTexts] = useState<Record<NumberField, string>>(() => {
    const initial = Object.fromEntries(NUMBER_FIELDS.map((f) => [f, textFromStored(saved?.[f] ?? null, kinds[f])])) as Record<NumberField, string>;
    if (!saved) Object.assign(initial, { shells: '1', pluggedTubes: '0', designPluggedTubes: '0' });
    return initial;
  });
  const [tubeBwg, setTubeBwg] = useState(String(saved?.tubeBwg ?? ''));
  const [tubeMaterial, setTubeMaterial] = useState<string>(saved?.tubeMaterial ?? '');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [savedAt, setSavedAt] = useState<number | null>(null);
  const set = (field: NumberField) => (text: string) => setTexts((t) => ({ ...t, [field]: text }));
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const { dirty, rebase } = useDirty({ texts, tubeBwg, tubeMaterial });

  const surfaceFromTubes = (): number | null => {
    const n = storedFromText(texts.tubeCount, 'count');
    const odMm = storedFromText(texts.tubeOdMm, kinds.tubeOdMm);
    const lengthM = storedFromText(texts.tubeLengthM, kinds.tubeLengthM);
    if (!n || !odMm || !lengthM || [n, odMm, lengthM].some(Number.isNaN)) return null;
    return n * Math.PI * (odMm / 1000) * lengthM;
  };
  const computed = surfaceFromTubes();

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const values = storedValues(texts, kinds, { tubeLengthM: null, referenceCleanliness: null });
    const parsed = condenserSetup.safeParse({
      ...values,
      tubeBwg: tubeBwg === '' ? undefined : Number(tubeBwg),
      tubeMaterial: tubeMaterial || undefined,
    });
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

  const field = (name: NumberField, label: string, hint?: string) => (
    <QuantityField
      label={label}
      unit={unitLabel(kinds[name])}
      value={texts[name]}
      onChange={set(name)}
      error={fieldErrors[name]}
      hint={hint}
      required={!OPTIONAL_FIELDS.has(name)}
    />
  );
  const message = formMessage(save.error);
  const wallIn = tubeBwg ? BWG_WALL_IN[Number(tubeBwg)] : undefined;
  const wallHint = wallIn === undefined ? undefined : `Wall ${system === 'us' ? `${wallIn.toFixed(3)} in` : `${inToMm(wallIn).toFixed(2)} mm`}`;

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-label="Condenser" className="flex flex-col gap-5">
      <UnsavedChangesGuard dirty={dirty && !save.isPending} />
      <RequiredNote />
      <FormProblems errors={fieldErrors} />
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Geometry</legend>
        <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-6">
          {field('shells', 'Shells')}
          {field('passes', 'Passes')}
          {field('tubeCount', 'Tube count')}
          {field('tubeOdMm', 'Tube outside diameter')}
          <SelectField
            required
            label="Wall gauge (BWG)"
            value={tubeBwg}
            onChange={(e) => setTubeBwg(e.target.value)}
            error={fieldErrors.tubeBwg}
            hint={wallHint}
          >
            <option value="">Choose…</option>
            {Object.keys(BWG_WALL_IN).map((g) => (
              <option key={g} value={g}>
                {g} BWG
              </option>
            ))}
          </SelectField>
          <SelectField required label="Tube material" value={tubeMaterial} onChange={(e) => setTubeMaterial(e.target.value)} error={fieldErrors.tubeMaterial}>
            <option value="">Choose…</option>
            {TUBE_MATERIALS.map((m) => (
              <option key={m} value={m}>
                {TUBE_MATERIAL_LABELS[m]}
              </option>
            ))}
          </SelectField>
        </div>
        <div className="grid items-start gap-3 sm:grid-cols-3 lg:grid-cols-6">
          {field('tubeLengthM', 'Effective tube length', 'Between the tubesheets')}
          <div className="sm:col-span-2">{field('surfaceM2', 'Outside surface (HEI basis)')}</div>
          <div className="flex flex-col gap-2 text-xs text-ink-soft sm:col-span-3">
            <p>
              Enter the <strong className="font-semibold text-ink">outside</strong> surface of the tubes between the tubesheets, N·π·OD·L — the basis of the HEI
              standard. An inside area would overstate U and the cleanliness factor by OD/dᵢ.
            </p>
            <div>
              <Button
                variant="quiet"
                disabled={computed === null}
                title={computed === null ? 'Enter tube count, outside diameter and effective length first' : undefined}
                onClick={() => computed !== null && set('surfaceM2')(textFromStored(computed, kinds.surfaceM2))}
              >
                Compute from tube count × π × OD × length
              </Button>
            </div>
          </div>
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Design point</legend>
        <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-5">
          {field('designCwFlowM3s', 'CW flow')}
          {field('designCwInletC', 'CW inlet temperature')}
          {field('designDutyMw', 'Condenser duty')}
          {field('designBackpressureKpa', 'Backpressure')}
          {field('designCleanliness', 'Cleanliness')}
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Plugging and reference</legend>
        <div className="grid gap-3 sm:grid-cols-3">
          {field('pluggedTubes', 'Plugged tubes now', 'Tube-plugging events change this from their date')}
          {field('designPluggedTubes', 'Plugged tubes at design')}
          {field('referenceCleanliness', 'Reference cleanliness for fouling cost', 'What a cleaning achieves; blank: the design cleanliness')}
        </div>
      </fieldset>

      {message && <Notice tone="fault">{message}</Notice>}
      {savedAt && !save.isPending && !save.isError && <Notice tone="ok">Condenser saved. The unit’s derived data is being recomputed.</Notice>}
      <div>
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save condenser'}
        </Button>
      </div>
    </form>
  );
}
