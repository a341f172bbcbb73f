import { useEffect, type RefObject } from 'react';

/**
 * Said aloud when a form is refused: how many fields need attention (each field's own message stays beside it).
 * The live region is always in the page so a screen reader hears it change.
 */
export function FormProblems({ errors }: { errors: Record<string, string> }) {
  const count = Object.keys(errors).length;
  return (
    <p role="alert" className={count ? 'text-sm text-fault' : 'sr-only'} data-testid="form-problems">
      {count === 0
        ? ''
        : count === 1
          ? 'One field needs attention: it is marked below its box.'
          : `${count} fields need attention: each is marked below its box.`}
    </p>
  );
}

/** After a refused submit, focus goes to the first field marked invalid, so the person lands on what to fix. */
export function useFocusFirstProblem(form: RefObject<HTMLFormElement | null>, errors: Record<string, string>) {
  useEffect(() => {
    if (Object.keys(errors).length === 0) return;
    form.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [form, errors]);
}
