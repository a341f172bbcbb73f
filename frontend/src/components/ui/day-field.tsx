import { useId, useRef, useState, type InputHTMLAttributes } from 'react';
import { readDayText } from '@shared/text/day-text';
import { formatDay } from '@frontend/lib/format';
import { FieldLabel } from './required-mark';

interface Props extends Omit<InputHTMLAttributes<HTMLInputElement>, 'onChange' | 'value' | 'type'> {
  label: string;
  /** the day as stored ("2026-03-14"), '' for none, or the person's text while it is not a day yet */
  value: string;
  onChange: (value: string) => void;
  error?: string;
  hint?: string;
}

/**
 * A calendar day typed in the form the app shows days everywhere ("14 Mar 2026"; ISO days are read too), with a
 * calendar to pick from. The form receives the ISO day once the text is one, or the text itself so its schema
 * refuses it; the field says why beside the box.
 */
export function DayField({ label, value, onChange, error: formError, hint, required, className = '', ...input }: Props) {
  const id = useId();
  const picker = useRef<HTMLInputElement>(null);
  const shown = (v: string) => (readDayText(v).kind === 'day' ? formatDay(v) : v);
  const [text, setText] = useState(() => shown(value));
  // A value set from outside (a reset, a prefill) replaces the text unless the text already says that day
  // (state adjusted while rendering, as React advises for props that reset state).
  const [lastValue, setLastValue] = useState(value);
  if (value !== lastValue) {
    setLastValue(value);
    const now = readDayText(text);
    const same = (now.kind === 'day' && now.day === value) || (now.kind === 'blank' && value === '') || text === value;
    if (!same) setText(shown(value));
  }
  const read = readDayText(text);
  const error = formError ?? (read.kind === 'invalid' ? read.message : undefined);
  const describedBy = error ? `${id}-error` : `${id}-hint`;
  const type = (t: string) => {
    setText(t);
    const r = readDayText(t);
    onChange(r.kind === 'day' ? r.day : r.kind === 'blank' ? '' : t);
  };
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <FieldLabel htmlFor={id} required={required}>
        {label}
      </FieldLabel>
      <div className="flex items-stretch">
        <input
          id={id}
          autoComplete="off"
          placeholder="14 Mar 2026"
          aria-invalid={error ? true : undefined}
          aria-required={required || undefined}
          aria-describedby={describedBy}
          value={text}
          onChange={(e) => type(e.target.value)}
          onBlur={() => read.kind === 'day' && setText(formatDay(read.day))}
          className={`w-full min-w-0 rounded-l border bg-paper-raised px-2.5 py-1.5 text-sm ${error ? 'border-fault' : 'border-rule'}`}
          {...input}
        />
        <button
          type="button"
          className="rounded-r border border-l-0 border-rule bg-paper-sunk px-2 text-xs text-ink-soft hover:text-ink"
          title="Pick the day from a calendar"
          disabled={input.disabled}
          onClick={() => picker.current?.showPicker?.()}
        >
          Calendar
        </button>
        <input
          ref={picker}
          type="date"
          tabIndex={-1}
          aria-hidden="true"
          className="sr-only"
          value={read.kind === 'day' ? read.day : ''}
          onChange={(e) => e.target.value && type(formatDay(e.target.value))}
        />
      </div>
      {!error && (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint ?? 'A day such as 14 Mar 2026'}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-xs text-fault">
          {error}
        </p>
      )}
    </div>
  );
}
