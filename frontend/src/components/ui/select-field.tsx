import { useId, type ReactNode, type SelectHTMLAttributes } from 'react';
import { FieldLabel } from './required-mark';

interface Props extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  error?: string;
  hint?: string;
  children: ReactNode;
}

/** A labelled native select with its error shown where the field is. */
export function SelectField({ label, error, hint, children, required, ...select }: Props) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <FieldLabel htmlFor={id} required={required}>
        {label}
      </FieldLabel>
      <select
        id={id}
        aria-required={required || undefined}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`rounded border bg-paper-raised px-2 py-1.5 text-sm ${error ? 'border-fault' : 'border-rule'}`}
        {...select}
      >
        {children}
      </select>
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
