/**
 * Text a person sends must be well-formed Unicode. A lone UTF-16 surrogate ("\ud800") survives JSON but
 * cannot be stored as UTF-8, so it is refused where requests are validated, before anything is written.
 */

const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

export function isWellFormedText(text: string): boolean {
  return !LONE_SURROGATE.test(text);
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

/**
 * The dotted path of the first string (value or key) in a parsed body that is not well-formed, or null.
 * Walks with its own stack, so a deeply nested body cannot overflow the call stack.
 */
export function findIllFormedText(value: unknown): string | null {
  const stack: Step[] = [{ value, key: null, parent: null }];
  while (stack.length > 0) {
    const step = stack.pop()!;
    const v = step.value;
    if (typeof v === 'string') {
      if (!isWellFormedText(v)) return pathOf(step);
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ value: v[i], key: String(i), parent: step });
    } else if (v !== null && typeof v === 'object') {
      const entries = Object.entries(v as Record<string, unknown>);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [key, child] = entries[i];
        if (!isWellFormedText(key)) return pathOf({ value: child, key: printable(key), parent: step });
        stack.push({ value: child, key, parent: step });
      }
    }
  }
  return null;
}
