/** Room left under the schema's 60 characters for a "-12" that keeps a key unique. */
const MAX_BASE = 50;

/**
 * The key events and cases refer to a method by, made from its name: lower-case letters, digits and dashes
 * (accents dropped), unique among the keys the organisation's library already holds ("-2", "-3" … when taken).
 */
export function methodKeyFrom(name: string, taken: Iterable<string>): string {
  const base =
    name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .slice(0, MAX_BASE)
      .replace(/^-+|-+$/g, '') || 'method';
  const used = new Set(taken);
  if (!used.has(base)) return base;
  for (let n = 2; ; n++) if (!used.has(`${base}-${n}`)) return `${base}-${n}`;
}
