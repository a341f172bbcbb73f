/**
 * Text a person sends must be well-formed Unicode. A lone UTF-16 surrogate ("\ud800") survives JSON but
 * cannot be stored as UTF-8, so it is refused where requests are validated, before anything is written.
 * Control characters (NUL, bell, escape, DEL…) have no place in a name or a note either; tab and line breaks do.
 */

const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;

export type TextProblem = 'surrogate' | 'control';

export function isWellFormedText(text: string): boolean {
  return !LONE_SURROGATE.test(text);
}

function problemOf(text: string): TextProblem | null {
  if (LONE_SURROGATE.test(text)) return 'surrogate';
  if (CONTROL.test(text)) return 'control';
  return null;
}

/** A printable form of a path segment (a broken key is shown with U+FFFD in its place). */
const printable = (key: string) => key.replace(new RegExp(LONE_SURROGATE.source, 'g'), '\ufffd');

/** A step of the walk: the value, its key and the step it came from (the path is rebuilt only when needed). */
interface Step {
  value: unknown;
  key: string | null;
  parent: Step | null;
}

const pathOf = (step: Step | null): string => {
  const keys: string[] = [];
  for (let s = step; s; s = s.parent) if (s.key !== null) keys.push(s.key);
  return keys.reverse().join('.');
};

/** The dotted path of the first string (value or key) in a parsed body that is not well-formed, or null. */
export function findIllFormedText(value: unknown): string | null {
  const found = findTextProblem(value);
  return found?.problem === 'surrogate' ? found.path : null;
}

/**
 * The first string (value or key) in a parsed body with a broken character or a control character, and which.
 * Walks with its own stack, so a deeply nested body cannot overflow the call stack.
 */
export function findTextProblem(value: unknown): { path: string; problem: TextProblem } | null {
  const stack: Step[] = [{ value, key: null, parent: null }];
  while (stack.length > 0) {
    const step = stack.pop()!;
    const v = step.value;
    if (typeof v === 'string') {
      const problem = problemOf(v);
      if (problem) return { path: pathOf(step), problem };
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ value: v[i], key: String(i), parent: step });
    } else if (v !== null && typeof v === 'object') {
      const entries = Object.entries(v as Record<string, unknown>);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [key, child] = entries[i]!;
        const problem = problemOf(key);
        if (problem) return { path: pathOf({ value: child, key: printable(key), parent: step }), problem };
        stack.push({ value: child, key, parent: step });
      }
    }
  }
  return null;
}
