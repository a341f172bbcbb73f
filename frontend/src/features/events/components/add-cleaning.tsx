import { useState, type FormEvent } from 'react';
import { unitEventInput } from '@shared/schemas/unit-event';
import { DayField } from '@frontend/components/ui/day-field';
import { formatDay } from '@frontend/lib/format';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { SelectField } from '@frontend/components/ui/select-field';
import { parseNumberText } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useAddEvent } from '../api/add-event';
import type { MethodChoice } from './event-form';

interface Props {
  organisationId: string;
  unitId: string;
  currency: string;
  /** the last day with data, offered as the latest sensible date */
  lastDay: string | null;
  /** The library's methods; undefined while they load (or if they could not be read). */
  methods?: MethodChoice[];
  onAdded: () => void;
}

/**
 * "A cleaning happened on this day": the quick way to restart the fouling trend from the health page. It records
 * a cleaning event like the events form; the server queues a recompute, which the unit's jobs show.
 */
export function AddCleaning({ organisationId, unitId, currency, lastDay, methods, onAdded }: Props) {
  const [open, setOpen] = useState(false);
  const add = useAddEvent(organisationId, unitId);
  const [date, setDate] = useState('');
  const [methodId, setMethodId] = useState('');
  const [cost, setCost] = useState('');
  const [after, setAfter] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});

  if (!open) {
    return (
      <Button variant="quiet" onClick={() => setOpen(true)} className="no-print self-start">
        Add cleaning
      </Button>
    );
  }

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const afterPct = parseNumberText(after);
    const parsed = unitEventInput.safeParse({
      kind: 'cleaning',
      startDate: date,
      endDate: null,
      methodId: methodId || null,
      cost: parseNumberText(cost) ?? null,
      cleanlinessBefore: null,
      cleanlinessAfter: afterPct === undefined ? null : afterPct / 100,
      notes: null,
    });
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    add.mutate(parsed.data, {
      onSuccess: () => {
        setOpen(false);
        setDate('');
        setCost('');
        setAfter('');
        onAdded();
      },
      onError: (err) => setErrors(serverFieldErrors(err)),
    });
  };

  const message = formMessage(add.error);
  return (
    <form onSubmit={submit} noValidate aria-label="Add a cleaning" className="no-print flex flex-col gap-3 rounded border border-tube-100 bg-tube-50/50 p-3">
      <p className="text-sm font-medium">Record a cleaning</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <DayField
          label="Cleaning date"
          required
          value={date}
          onChange={setDate}
          error={errors.startDate}
          hint={lastDay ? `A day up to ${formatDay(lastDay)}, the last day with data` : undefined}
        />
        <SelectField label="Method" value={methodId} onChange={(e) => setMethodId(e.target.value)} error={errors.methodId}>
          <option value="">Not recorded</option>
          {(methods ?? []).map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
            </option>
          ))}
        </SelectField>
        <QuantityField label="Cost" unit={currency} value={cost} onChange={setCost} error={errors.cost} />
        <QuantityField label="Cleanliness after (if measured)" unit="%" value={after} onChange={setAfter} error={errors.cleanlinessAfter} />
      </div>
      <p className="text-xs text-ink-soft">The fouling trend restarts from this date; the unit’s figures are recomputed, which takes a little while.</p>
      {message && <Notice tone="fault">{message}</Notice>}
      <div className="flex gap-2">
        <Button type="submit" disabled={add.isPending}>
          {add.isPending ? 'Saving…' : 'Save cleaning'}
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
