import { useId, type InputHTMLAttributes } from 'react';
import { numberTextNote } from '@frontend/lib/field-units';
import { FieldLabel } from './required-mark';

interface Props extends Omit<InputHTMLAttributes<HTMLInputElement>, 'onChange' | 'value'> {
  label: string;
  /** The unit printed beside the input, e.g. "inHgA"; none for counts. */
  unit?: string;
  value: string;
  onChange: (text: string) => void;
  error?: string;
  hint?: string;
}

/**
 * A labelled number input in the user's units and number format, with the unit beside it and the error where the
 * field is; a number read by the person's format (164,800 as thousands) says how it was read.
 */
export function QuantityField({ label, unit, value, onChange, error: formError, hint: givenHint, className = '', required, ...input }: Props) {
  const id = useId();
  // text that could be two numbers is refused here, in the person's words, before the form's "Enter …"
  const note = numberTextNote(value);
  const error = note.error ?? formError;
  const hint = note.hint ?? givenHint;
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <FieldLabel htmlFor={id} required={required}>
        {label}
        {unit && <span className="sr-only"> ({unit})</span>}
      </FieldLabel>
      <div className="flex items-stretch">
        <input
          id={id}
          inputMode="decimal"
          autoComplete="off"
          aria-invalid={error ? true : undefined}
          aria-required={required || undefined}
          aria-describedby={describedBy}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          className={`w-full min-w-0 border bg-paper-raised px-2.5 py-1.5 text-right text-sm tabular-nums ${unit ? 'rounded-l' : 'rounded'} ${error ? 'border-fault' : 'border-rule'}`}
          {...input}
        />
        {unit && (
          <span
            className="inline-flex shrink-0 items-center rounded-r border border-l-0 border-rule bg-paper-sunk px-2 text-xs whitespace-nowrap text-ink-soft"
            aria-hidden
          >
            {unit}
          </span>
        )}
      </div>
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
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
