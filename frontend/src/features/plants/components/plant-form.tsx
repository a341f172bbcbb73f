import { useRef, useState, type FormEvent } from 'react';
import { plantInput } from '@shared/schemas/unit-setup';
import { FormActions } from '@frontend/components/ui/form-actions';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import type { GroupOption } from '@frontend/components/ui/client-group-picker';
import { Notice } from '@frontend/components/ui/notice';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import { browserTimeZone, TimeZonePicker } from '@frontend/components/ui/time-zone-picker';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreatePlant } from '../api/create-plant';
import type { PlantView } from '../api/get-plants';
import { useUpdatePlant } from '../api/update-plant';

interface Props {
  organisationId: string;
  groups: GroupOption[];
  /** The plant being changed; none: a new plant. */
  plant?: PlantView;
  onDone?: () => void;
  /** a new-plant form opened from a button closes again without creating */
  onCancel?: () => void;
}

/** Name, IANA time zone (days and schedules are plant-local) and client group of a plant. */
export function PlantForm({ organisationId, groups, plant, onDone, onCancel }: Props) {
  const create = useCreatePlant(organisationId);
  const update = useUpdatePlant(organisationId);
  const mutation = plant ? update : create;
  const [name, setName] = useState(plant?.name ?? '');
  const [timeZone, setTimeZone] = useState(plant?.timeZone ?? browserTimeZone());
  const [clientGroupId, setClientGroupId] = useState<string | null>(plant?.clientGroupId ?? null);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const initialZone = useState(() => plant?.timeZone ?? browserTimeZone())[0];
  const dirty =
    !mutation.isPending &&
    !mutation.isSuccess &&
    (name !== (plant?.name ?? '') || timeZone !== initialZone || clientGroupId !== (plant?.clientGroupId ?? null));

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = plantInput.safeParse({ name, timeZone, clientGroupId });
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    const onError = (e: Error) => setFieldErrors(serverFieldErrors(e));
    if (plant) update.mutate({ id: plant.id, ...parsed.data }, { onSuccess: () => onDone?.(), onError });
    else
      create.mutate(parsed.data, {
        onSuccess: () => {
          setName('');
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
      aria-label={plant ? `Change ${plant.name}` : 'New plant'}
      className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4"
      onKeyDown={(e) => e.key === 'Escape' && (plant ? onDone?.() : onCancel?.())}
    >
      <UnsavedChangesGuard dirty={dirty} />
      {!plant && <h2>New plant</h2>}
      <FormProblems errors={fieldErrors} />
      <div className="grid gap-3 md:grid-cols-[1fr_1.4fr_1fr]">
        <TextField label="Plant name" name="name" value={name} onChange={(e) => setName(e.target.value)} error={fieldErrors.name} required autoFocus />
        <TimeZonePicker
          label="Time zone"
          value={timeZone}
          onChange={setTimeZone}
          error={fieldErrors.timeZone}
          hint="The plant’s local clock: days, daily figures and schedules follow it."
        />
        <SelectField
          label="Client group"
          value={clientGroupId ?? ''}
          onChange={(e) => setClientGroupId(e.target.value || null)}
          error={fieldErrors.clientGroupId}
          hint={groups.length === 0 ? 'No client groups in this organisation.' : undefined}
        >
          <option value="">No client group</option>
          {groups.map((g) => (
            <option key={g.id} value={g.id}>
              {g.name}
            </option>
          ))}
        </SelectField>
      </div>
      {message && <Notice tone="fault">{message}</Notice>}
      <FormActions
        editing={!!plant}
        cancellable={!!plant || !!onCancel}
        pending={mutation.isPending}
        addLabel="Create plant"
        saveLabel="Save plant"
        onCancel={plant ? onDone : onCancel}
      />
    </form>
  );
}
