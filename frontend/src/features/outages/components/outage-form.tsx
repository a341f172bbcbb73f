import { useEffect, useRef, useState, type FormEvent } from 'react';
import { outageCreate, outagePatch, windowDays, type OutageView } from '@shared/schemas/outages';
import { readDayText } from '@shared/text/day-text';
import { DayField } from '@frontend/components/ui/day-field';
import { FormActions } from '@frontend/components/ui/form-actions';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { Notice } from '@frontend/components/ui/notice';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { RequiredMark, RequiredNote } from '@frontend/components/ui/required-mark';
import { TextField } from '@frontend/components/ui/text-field';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { parseNumberText } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreateOutage } from '../api/create-outage';
import { useUpdateOutage } from '../api/update-outage';
import { daysText } from './outage-words';

/** A unit the person may put in an outage, with its plant. */
export interface UnitChoice {
  id: string;
  name: string;
  plantId: string;
  plantName: string;
}

interface Props {
  organisationId: string;
  /** every unit of the plants the person may see */
  units: UnitChoice[];
  /** the currency of the chosen units (money is counted in one), null until known */
  currency: string | null;
  /** a line under the budget: where the currency comes from, or why it is not known */
  currencyNote?: string;
  onUnitsChange?: (unitIds: string[]) => void;
  /** the outage being changed; none: a new outage */
  outage?: OutageView;
  onDone?: (outageId: string) => void;
  onCancel?: () => void;
}

const budgetText = (v: number | undefined) => (v === undefined ? '' : String(v));

/**
 * A day field's problem in the words of the day fields (the schema speaks of the stored form, YYYY-MM-DD): blank
 * asks for the day, text that is no day says why; a day that breaks the window's rules keeps the schema's words.
 */
function dayProblem(what: string, value: string, schemaMessage: string | undefined): string | undefined {
  if (schemaMessage === undefined) return undefined;
  const read = readDayText(value);
  if (read.kind === 'blank') return `Enter the ${what}, e.g. 6 Apr 2026`;
  if (read.kind === 'invalid') return read.message;
  return schemaMessage;
}

/**
 * Name, units, window (first and last plant-local day, both inside it) and budget of an outage. The same schema
 * the server uses checks it here first; each problem shows beside its field and focus goes to the first.
 */
export function OutageForm({ organisationId, units, currency, currencyNote, onUnitsChange, outage, onDone, onCancel }: Props) {
  const create = useCreateOutage(organisationId);
  const update = useUpdateOutage(organisationId, outage?.id ?? '');
  const mutation = outage ? update : create;
  const initial = {
    name: outage?.name ?? '',
    unitIds: outage?.units.map((u) => u.id) ?? [],
    startDate: outage?.startDate ?? '',
    endDate: outage?.endDate ?? '',
    budget: budgetText(outage?.budget),
  };
  const [name, setName] = useState(initial.name);
  const [unitIds, setUnitIds] = useState<string[]>(initial.unitIds);
  const [startDate, setStartDate] = useState(initial.startDate);
  const [endDate, setEndDate] = useState(initial.endDate);
  const [budget, setBudget] = useState(initial.budget);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  useEffect(() => onUnitsChange?.(unitIds), [unitIds, onUnitsChange]);
  const dirty =
    !mutation.isPending &&
    !mutation.isSuccess &&
    (name !== initial.name ||
      unitIds.join() !== initial.unitIds.join() ||
      startDate !== initial.startDate ||
      endDate !== initial.endDate ||
      budget !== initial.budget);

  const plants = [...new Map(units.map((u) => [u.plantId, u.plantName]))];
  const isDay = (d: string) => /^\d{4}-\d{2}-\d{2}$/.test(d);
  const days = isDay(startDate) && isDay(endDate) && endDate >= startDate ? windowDays(startDate, endDate) : null;

  const refuse = (errors: FieldErrors) => {
    const out: FieldErrors = { ...errors };
    const first = dayProblem('first day', startDate, errors.startDate);
    const last = dayProblem('last day', endDate, errors.endDate);
    if (first) out.startDate = first;
    if (last) out.endDate = last;
    setFieldErrors(out);
  };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const values = { name, unitIds, startDate, endDate, budget: parseNumberText(budget) };
    const onError = (e: Error) => setFieldErrors(serverFieldErrors(e));
    if (outage) {
      const changed = Object.fromEntries(
        Object.entries(values).filter(([k, v]) => JSON.stringify(v) !== JSON.stringify(k === 'budget' ? outage.budget : initial[k as keyof typeof initial])),
      );
      const parsed = outagePatch.safeParse({ ...changed, seenUpdatedAt: outage.updatedAt });
      if (!parsed.success) return refuse(zodFieldErrors(parsed.error));
      setFieldErrors({});
      update.mutate(parsed.data, { onSuccess: () => onDone?.(outage.id), onError });
      return;
    }
    const parsed = outageCreate.safeParse(values);
    if (!parsed.success) return refuse(zodFieldErrors(parsed.error));
    setFieldErrors({});
    create.mutate(parsed.data, { onSuccess: (created) => onDone?.(created.id), onError });
  };

  const message = formMessage(mutation.error);
  return (
    <form
      ref={formRef}
      onSubmit={onSubmit}
      noValidate
      aria-label={outage ? `Change ${outage.name}` : 'New outage'}
      className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4"
      onKeyDown={(e) => e.key === 'Escape' && onCancel?.()}
    >
      <UnsavedChangesGuard dirty={dirty} />
      {!outage && <h2>New outage</h2>}
      <RequiredNote />
      <FormProblems errors={fieldErrors} />
      <TextField
        label="Name"
        name="name"
        value={name}
        maxLength={120}
        onChange={(e) => setName(e.target.value)}
        error={fieldErrors.name}
        placeholder="e.g. Autumn outage, Unit 1"
        required
      />
      <fieldset className="flex flex-col gap-1.5" aria-describedby={fieldErrors.unitIds ? 'outage-units-error' : undefined}>
        <legend className="mb-1 text-sm font-medium text-ink">
          Units taken off line
          <RequiredMark />
        </legend>
        {units.length === 0 && <p className="text-xs text-ink-faint">No units you may see: add a plant and its units under Plants first.</p>}
        <div className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
          {plants.map(([plantId, plantName]) => (
            <div key={plantId} role="group" aria-label={plantName} className="flex flex-col gap-1">
              <span className="text-xs text-ink-soft">{plantName}</span>
              {units
                .filter((u) => u.plantId === plantId)
                .map((u, i) => (
                  <label key={u.id} className="flex items-center gap-2 text-sm">
                    <input
                      type="checkbox"
                      name="unitIds"
                      value={u.id}
                      checked={unitIds.includes(u.id)}
                      // the first box carries the field's state, so focus lands on the units when they are refused
                      aria-invalid={fieldErrors.unitIds && i === 0 && plantId === plants[0]?.[0] ? true : undefined}
                      onChange={(e) => setUnitIds((ids) => (e.target.checked ? [...ids, u.id] : ids.filter((x) => x !== u.id)))}
                    />
                    {u.name}
                  </label>
                ))}
            </div>
          ))}
        </div>
        {fieldErrors.unitIds && (
          <p id="outage-units-error" className="text-xs text-fault">
            {fieldErrors.unitIds}
          </p>
        )}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-3">
        <DayField required label="First day" value={startDate} onChange={setStartDate} error={fieldErrors.startDate} hint="Plant-local, e.g. 14 Mar 2026" />
        <DayField
          required
          label="Last day"
          value={endDate}
          onChange={setEndDate}
          error={fieldErrors.endDate}
          hint={days ? `A window of ${daysText(days)}, both ends inside` : 'Inside the window too'}
        />
        <QuantityField
          required
          label="Budget"
          unit={currency ?? undefined}
          value={budget}
          onChange={setBudget}
          error={fieldErrors.budget}
          hint={currencyNote ?? (currency ? `In ${currency}, the units’ currency` : 'Choose the units to see their currency')}
        />
      </div>
      {outage && <p className="text-xs text-ink-soft">A changed window, budget or units makes the latest proposal out of date: propose again after saving.</p>}
      {fieldErrors.form && <Notice tone="fault">{fieldErrors.form}</Notice>}
      {message && <Notice tone="fault">{message}</Notice>}
      <FormActions
        editing={!!outage}
        cancellable={!!onCancel}
        pending={mutation.isPending}
        addLabel="Create outage"
        saveLabel="Save outage"
        onCancel={onCancel}
      />
    </form>
  );
}
