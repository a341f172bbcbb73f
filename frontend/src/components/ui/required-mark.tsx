import type { ReactNode } from 'react';

/** The asterisk beside a required field's label (the input itself carries aria-required for screen readers). */
export function RequiredMark() {
  return (
    <span aria-hidden="true" className="ml-0.5 text-fault" title="required">
      *
    </span>
  );
}

/** The line above a form that says what the asterisk means. */
export function RequiredNote() {
  return (
    <p className="text-xs text-ink-soft">
      Fields marked <span className="text-fault">*</span> are required.
    </p>
  );
}

/**
 * A field's label with the asterisk beside it, outside the label element: the field's accessible name stays the
 * label's words alone ("Date", not "Date*"); aria-required on the input says "required" to screen readers.
 */
export function FieldLabel({ htmlFor, required, children }: { htmlFor: string; required?: boolean; children: ReactNode }) {
  return (
    <div className="flex items-baseline">
      <label htmlFor={htmlFor} className="text-sm font-medium text-ink">
        {children}
      </label>
      {required && <RequiredMark />}
    </div>
  );
}
