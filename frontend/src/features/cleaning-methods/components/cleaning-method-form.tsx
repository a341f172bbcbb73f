import { useId, useRef, useState, type FormEvent } from 'react';
import { CAUTION_KEYS, CAUTION_TEXT, cleaningMethodSchema, UNIT_DURING_CLEANING, type CautionKey, type CleaningMethod } from '@shared/schemas/cleaning-method';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { RequiredNote } from '@frontend/components/ui/required-mark';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { useDirty } from '@frontend/lib/use-dirty';
import { FormActions } from '@frontend/components/ui/form-actions';
import { Notice } from '@frontend/components/ui/notice';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import { parseNumberText } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreateCleaningMethod } from '../api/create-cleaning-method';
import type { CleaningMethodView } from '../api/get-cleaning-methods';
import { useUpdateCleaningMethod } from '../api/update-cleaning-method';
import { methodKeyFrom } from './method-key';
import { TYPICAL_VALUES_TITLE, UNIT_DURING_CLEANING_LABELS } from './method-labels';

type UnitDuringCleaning = CleaningMethod['unitDuringCleaning'];

const CAUTION_LABELS: Record<CautionKey, string> = {
  'confined-space': 'Confined-space entry',
  'lockout-tagout': 'Lock-out/tag-out of the circulating water',
  'online-isolation': 'Cleaning one half on line',
  'water-jetting': 'High-pressure water jetting',
  chemical: 'Chemicals',
};

const text = (v: number | undefined) => (v === undefined ? '' : String(v));
/** Recovered cleanliness is a fraction in the API and a percentage in the form. */
const pct = (fraction: number | undefined) => (fraction === undefined ? '' : String(Number((fraction * 100).toFixed(2))));

interface Props {
  organisationId: string;
  method?: CleaningMethodView;
  /** keys the library holds already: a new method's key, made from its name, avoids them */
  takenKeys?: string[];
  onDone?: () => void;
}

/** Add a method to the library, or change one; the key (`id`) is made from the name once, when the method is added. */
export function CleaningMethodForm({ organisationId, method, takenKeys = [], onDone }: Props) {
  const create = useCreateCleaningMethod(organisationId);
  const update = useUpdateCleaningMethod(organisationId);
  const mutation = method ? update : create;
  const [name, setName] = useState(method?.name ?? '');
  const [fixedCost, setFixedCost] = useState(text(method?.fixedCost));
  const [costPerTube, setCostPerTube] = useState(text(method?.costPerTube));
  const [durationDays, setDurationDays] = useState(text(method?.durationDays));
  const [during, setDuring] = useState<UnitDuringCleaning>(method?.unitDuringCleaning ?? 'outage');
  const [deratePct, setDeratePct] = useState(method && method.unitDuringCleaning === 'derate' ? text(method.deratePct) : '');
  const [recovered, setRecovered] = useState(pct(method?.recoveredCleanliness));
  const [multiplier, setMultiplier] = useState(text(method?.foulingRateMultiplier ?? 1));
  const [cautions, setCautions] = useState<CautionKey[]>(method?.cautions ?? []);
  // Unticked on edit too: whoever saves their own figures should not keep the "typical" mark by accident.
  const [typical, setTypical] = useState(false);
  const [note, setNote] = useState(method?.note ?? '');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const { dirty } = useDirty({ name, fixedCost, costPerTube, durationDays, during, deratePct, recovered, multiplier, cautions, typical, note });
  const [added, setAdded] = useState(false);
  const fieldId = useId();
  const newKey = methodKeyFrom(name.trim(), takenKeys);

  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const num = (t: string) => parseNumberText(t) ?? Number.NaN;
    const parsed = cleaningMethodSchema.safeParse({
      id: method ? method.id : newKey,
      name: name.trim(),
      fixedCost: num(fixedCost),
      costPerTube: num(costPerTube),
      durationDays: num(durationDays),
      unitDuringCleaning: during,
      deratePct: during === 'derate' ? num(deratePct) : 0,
      recoveredCleanliness: num(recovered) / 100,
      foulingRateMultiplier: num(multiplier),
      cautions: CAUTION_KEYS.filter((k) => cautions.includes(k)),
      typical,
      ...(note.trim() ? { note: note.trim() } : {}),
    });
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    setAdded(false);
    const onError = (err: Error) => setFieldErrors(serverFieldErrors(err));
    if (method) update.mutate({ recordId: method.recordId, method: parsed.data }, { onSuccess: () => onDone?.(), onError });
    else
      create.mutate(parsed.data, {
        onSuccess: () => {
          setAdded(true);
          setName('');
          setFixedCost('');
          setCostPerTube('');
          setDurationDays('');
          setDuring('outage');
          setDeratePct('');
          setRecovered('');
          setMultiplier('1');
          setCautions([]);
          setTypical(false);
          setNote('');
          onDone?.();
        },
        onError,
      });
  };

  const message = formMessage(mutation.error);
  return (
    <form
      ref={formRef}
      onSubmit={onSubmit}
      noValidate
      aria-label={method ? `Change ${method.name}` : 'Add a cleaning method'}
      className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4"
      onKeyDown={(e) => method && e.key === 'Escape' && onDone?.()}
    >
      <UnsavedChangesGuard dirty={dirty && !mutation.isPending && !mutation.isSuccess} />
      {!method && <h2>Add a cleaning method</h2>}
      <RequiredNote />
      <FormProblems errors={fieldErrors} />
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <div className="sm:col-span-1 lg:col-span-3">
          <TextField required label="Name" value={name} onChange={(e) => setName(e.target.value)} maxLength={120} error={fieldErrors.name} />
        </div>
        <div className="flex flex-col gap-1" data-testid="method-key">
          <span className="text-sm font-medium text-ink">Key</span>
          <span className="py-1.5 font-mono text-sm text-ink-soft">{method ? method.id : name.trim() ? newKey : '—'}</span>
          <span className={`text-xs ${fieldErrors.id ? 'text-fault' : 'text-ink-faint'}`}>
            {fieldErrors.id ?? (method ? 'Set when the method was added; events and cases refer to it' : 'Made from the name; events and cases refer to it')}
          </span>
        </div>
        <QuantityField
          required
          label="Fixed cost"
          unit="per cleaning"
          value={fixedCost}
          onChange={setFixedCost}
          error={fieldErrors.fixedCost}
          hint="In the plant’s currency"
        />
        <QuantityField
          required
          label="Cost per tube"
          unit="per tube"
          value={costPerTube}
          onChange={setCostPerTube}
          error={fieldErrors.costPerTube}
          hint="Per active tube cleaned"
        />
        <QuantityField required label="Duration" unit="days" value={durationDays} onChange={setDurationDays} error={fieldErrors.durationDays} />
        <SelectField
          required
          label="Unit during cleaning"
          value={during}
          onChange={(e) => setDuring(e.target.value as UnitDuringCleaning)}
          error={fieldErrors.unitDuringCleaning}
        >
          {UNIT_DURING_CLEANING.map((u) => (
            <option key={u} value={u}>
              {UNIT_DURING_CLEANING_LABELS[u]}
            </option>
          ))}
        </SelectField>
        {during === 'derate' && (
          <QuantityField
            required
            label="Derate"
            unit="% of rating"
            value={deratePct}
            onChange={setDeratePct}
            error={fieldErrors.deratePct}
            hint="Share of the rating lost while it runs"
          />
        )}
        <QuantityField
          required
          label="Cleanliness recovered"
          unit="%"
          value={recovered}
          onChange={setRecovered}
          error={fieldErrors.recoveredCleanliness}
          hint="Cleanliness factor right after"
        />
        <QuantityField
          required
          label="Fouling-rate multiplier"
          value={multiplier}
          onChange={setMultiplier}
          error={fieldErrors.foulingRateMultiplier}
          hint="1 = fouling regrows as before; below 1, slower"
        />
      </div>
      <fieldset className="flex flex-col gap-1.5">
        <legend className="mb-1 text-sm font-medium text-ink">Safety cautions this method carries</legend>
        {CAUTION_KEYS.map((k) => (
          <label key={k} className="flex items-start gap-2 text-sm">
            <input
              type="checkbox"
              className="mt-1"
              aria-describedby={`${fieldId}-${k}`}
              checked={cautions.includes(k)}
              onChange={(e) => setCautions(e.target.checked ? [...cautions, k] : cautions.filter((c) => c !== k))}
            />
            <span>
              <span className="block">{CAUTION_LABELS[k]}</span>
              <span id={`${fieldId}-${k}`} className="block text-xs text-ink-soft">
                {CAUTION_TEXT[k]}
              </span>
            </span>
          </label>
        ))}
        {fieldErrors.cautions && <p className="text-xs text-fault">{fieldErrors.cautions}</p>}
      </fieldset>
      <label className="flex items-start gap-2 text-sm" title={TYPICAL_VALUES_TITLE}>
        <input type="checkbox" className="mt-1" aria-describedby={`${fieldId}-typical`} checked={typical} onChange={(e) => setTypical(e.target.checked)} />
        <span>
          <span className="block">Typical values</span>
          <span id={`${fieldId}-typical`} className="block text-xs text-ink-soft">
            Tick only if these figures are typical orders of magnitude rather than the plant’s own quotes and results.
          </span>
        </span>
      </label>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${fieldId}-note`} className="text-sm font-medium text-ink">
          Note
        </label>
        <textarea
          id={`${fieldId}-note`}
          value={note}
          onChange={(e) => setNote(e.target.value)}
          rows={2}
          maxLength={2000}
          aria-invalid={fieldErrors.note ? true : undefined}
          className={`rounded border bg-paper-raised px-2.5 py-1.5 text-sm ${fieldErrors.note ? 'border-fault' : 'border-rule'}`}
        />
        {fieldErrors.note && <p className="text-xs text-fault">{fieldErrors.note}</p>}
      </div>
      {fieldErrors.form && <Notice tone="fault">{fieldErrors.form}</Notice>}
      {message && <Notice tone="fault">{message}</Notice>}
      {added && !method && <Notice tone="ok">Method added.</Notice>}
      <FormActions editing={!!method} pending={mutation.isPending} addLabel="Add method" saveLabel="Save method" onCancel={onDone} />
    </form>
  );
}
