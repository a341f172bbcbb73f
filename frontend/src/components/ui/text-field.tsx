import { useId, type InputHTMLAttributes } from 'react';
import { FieldLabel } from './required-mark';

interface Props extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled input with its error shown where the field is; a required one is marked with an asterisk beside its label. */
export function TextField({ label, error, hint, required, ...input }: Props) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <FieldLabel htmlFor={id} required={required}>
        {label}
      </FieldLabel>
      <input
        id={id}
        required={required}
        aria-required={required || undefined}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`rounded border bg-paper-raised px-2.5 py-1.5 text-sm ${error ? 'border-fault' : 'border-rule'}`}
        {...input}
      />
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
