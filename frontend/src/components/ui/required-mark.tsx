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
