import { useState } from 'react';

/**
 * Whether a form's values differ from what was loaded or last saved: compares a plain snapshot of the values
 * (strings, numbers, arrays) with the one taken at mount; `rebase` makes the current values the saved ones.
 */
export function useDirty(values: unknown): { dirty: boolean; rebase: () => void } {
  const now = JSON.stringify(values);
  const [base, setBase] = useState(now);
  return { dirty: now !== base, rebase: () => setBase(now) };
}
