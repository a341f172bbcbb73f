import { useRef, useState, type FormEvent } from 'react';
import { UNIT_EVENT_KINDS, unitEventInput } from '@shared/schemas/unit-event';
import { DayField } from '@frontend/components/ui/day-field';
import { FormActions } from '@frontend/components/ui/form-actions';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { RequiredNote } from '@frontend/components/ui/required-mark';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { useDirty } from '@frontend/lib/use-dirty';
import { Notice } from '@frontend/components/ui/notice';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import { parseNumberText } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useAddEvent } from '../api/add-event';
import type { UnitEventView } from '../api/get-events';
import { useUpdateEvent } from '../api/update-event';

type Kind = (typeof UNIT_EVENT_KINDS)[number];

export const EVENT_KIND_LABELS: Record<Kind, string> = {
  cleaning: 'Cleaning',
  'tube-plugging': 'Tube plugging',
  'air-leak-repair': 'Air in-leakage repair',
  outage: 'Outage',
  other: 'Other',
};

const KIND_NOTES: Partial<Record<Kind, string>> = {
  cleaning: 'A cleaning restarts the fouling trend from its date; saving it recomputes the unit’s derived data.',
  'tube-plugging': 'Plugging changes the active tube count from its date; saving it recomputes the unit’s derived data.',
  outage: 'Give the first and last day of the outage.',
};

/** A method from the organisation's library, as the cleaning select offers it. */
export interface MethodChoice {
  id: string;
  name: string;
  /** the general caution first; shown where cleaning work is planned, not on this record of past work */
  cautionTexts: string[];
}

interface Props {
  organisationId: string;
  unitId: string;
  currency: string;
  /** The library's methods; undefined while they load (or if they could not be read). */
  methods?: MethodChoice[];
  event?: UnitEventView;
  onDone?: () => void;
}

const pct = (v: number | null | undefined) => (v === null || v === undefined ? '' : String(Number((v * 100).toFixed(2))));

/** Add or change one event on the unit's timeline; the fields follow the kind. */
export function EventForm({ organisationId, unitId, currency, methods, event, onDone }: Props) {
  const add = useAddEvent(organisationId, unitId);
  const update = useUpdateEvent(organisationId, unitId);
  const mutation = event ? update : add;
  const [kind, setKind] = useState<Kind>(event?.kind ?? 'cleaning');
  const [startDate, setStartDate] = useState(event?.startDate ?? '');
  const [endDate, setEndDate] = useState(event?.endDate ?? '');
  const [methodId, setMethodId] = useState(event?.methodId ?? '');
  const [cost, setCost] = useState(event?.cost === null || event?.cost === undefined ? '' : String(event.cost));
  const [before, setBefore] = useState(pct(event?.cleanlinessBefore));
  const [after, setAfter] = useState(pct(event?.cleanlinessAfter));
  const [plugged, setPlugged] = useState(event?.pluggedTubesAfter === null || event?.pluggedTubesAfter === undefined ? '' : String(event.pluggedTubesAfter));
  const [notes, setNotes] = useState(event?.notes ?? '');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  // the kind and method stay chosen after an event is added, so only what is typed counts as unsaved
  const { dirty } = useDirty({ startDate, endDate, cost, before, after, plugged, notes });
  const [added, setAdded] = useState(false);
  const library = methods ?? [];
  const chosenMethod = library.find((m) => m.id === methodId);

  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const num = (t: string) => parseNumberText(t) ?? null;
    const fraction = (t: string) => {
      const n = num(t);
      return n === null ? null : n / 100;
    };
    const cleaning = kind === 'cleaning';
    const parsed = unitEventInput.safeParse({
      kind,
      startDate,
      endDate: endDate || null,
      methodId: cleaning ? methodId.trim() || null : null,
      cost: num(cost),
      cleanlinessBefore: cleaning ? fraction(before) : null,
      cleanlinessAfter: cleaning ? fraction(after) : null,
      pluggedTubesAfter: kind === 'tube-plugging' ? num(plugged) : null,
      notes: notes.trim() || null,
    });
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    setAdded(false);
    const onError = (err: Error) => setFieldErrors(serverFieldErrors(err));
    if (event) update.mutate({ id: event.id, ...parsed.data }, { onSuccess: () => onDone?.(), onError });
    else
      add.mutate(parsed.data, {
        onSuccess: () => {
          setAdded(true);
          setStartDate('');
          setEndDate('');
          setCost('');
          setBefore('');
          setAfter('');
          setPlugged('');
          setNotes('');
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
      aria-label={event ? 'Change event' : 'Add an event'}
      className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4"
      onKeyDown={(e) => event && e.key === 'Escape' && onDone?.()}
    >
      <UnsavedChangesGuard dirty={dirty && !mutation.isPending && !mutation.isSuccess} />
      {!event && <h2>Add an event</h2>}
      <RequiredNote />
      <FormProblems errors={fieldErrors} />
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField required label="Kind" value={kind} onChange={(e) => setKind(e.target.value as Kind)} error={fieldErrors.kind}>
          {UNIT_EVENT_KINDS.map((k) => (
            <option key={k} value={k}>
              {EVENT_KIND_LABELS[k]}
            </option>
          ))}
        </SelectField>
        <DayField required label={kind === 'outage' ? 'First day' : 'Date'} value={startDate} onChange={setStartDate} error={fieldErrors.startDate} />
        <DayField
          required={kind === 'outage'}
          label={kind === 'outage' ? 'Last day' : 'Last day (if several)'}
          value={endDate}
          onChange={setEndDate}
          error={fieldErrors.endDate}
        />
        <QuantityField label="Cost" unit={currency} value={cost} onChange={setCost} error={fieldErrors.cost} />
      </div>
      {kind === 'cleaning' && (
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          {library.length > 0 ? (
            <SelectField label="Cleaning method" value={methodId} onChange={(e) => setMethodId(e.target.value)} error={fieldErrors.methodId}>
              <option value="">Not recorded</option>
              {library.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
              {methodId && !chosenMethod && <option value={methodId}>{methodId} (not in the library)</option>}
            </SelectField>
          ) : (
            <TextField
              label="Cleaning method"
              value={methodId}
              onChange={(e) => setMethodId(e.target.value)}
              error={fieldErrors.methodId}
              hint={methods ? 'The method library is empty: type a short key, e.g. hp-water-jetting' : 'A short key, e.g. hp-water-jetting'}
            />
          )}
          <QuantityField label="Cleanliness before" unit="%" value={before} onChange={setBefore} error={fieldErrors.cleanlinessBefore} />
          <QuantityField label="Cleanliness after" unit="%" value={after} onChange={setAfter} error={fieldErrors.cleanlinessAfter} />
        </div>
      )}
      {kind === 'tube-plugging' && (
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <QuantityField
            label="Plugged tubes after"
            unit="tubes"
            value={plugged}
            onChange={setPlugged}
            error={fieldErrors.pluggedTubesAfter}
            hint="The total plugged, not the number added"
          />
        </div>
      )}
      <label className="flex flex-col gap-1 text-sm font-medium">
        Notes
        <textarea
          value={notes}
          onChange={(e) => setNotes(e.target.value)}
          rows={2}
          maxLength={2000}
          className="rounded border border-rule bg-paper-raised px-2.5 py-1.5 text-sm font-normal"
        />
      </label>
      {KIND_NOTES[kind] && <p className="text-xs text-ink-soft">{KIND_NOTES[kind]}</p>}
      {message && <Notice tone="fault">{message}</Notice>}
      {added && !event && <Notice tone="ok">Event added.</Notice>}
      <FormActions editing={!!event} pending={mutation.isPending} addLabel="Add event" saveLabel="Save event" onCancel={onDone} />
    </form>
  );
}
