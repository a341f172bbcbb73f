import type { DisplayUnit } from '@shared/units';
import { fromInputText, parseNumberText, toInputText } from '@frontend/lib/field-units';
import { writeForInput, writeGroupedForInput } from '@frontend/lib/number-format';

/** How one form field is entered: a physical quantity in the user's units, a count, or a percentage of a stored fraction. */
export type FieldKind = { unit: DisplayUnit } | 'count' | 'percent' | 'plain';

export function storedFromText(text: string, kind: FieldKind): number | undefined {
  if (kind === 'count' || kind === 'plain') return parseNumberText(text);
  if (kind === 'percent') {
    const n = parseNumberText(text);
    return n === undefined ? n : n / 100;
  }
  return fromInputText(text, kind.unit);
}

export function textFromStored(stored: number | null | undefined, kind: FieldKind): string {
  if (stored === null || stored === undefined) return '';
  if (kind === 'count') return writeGroupedForInput(stored);
  if (kind === 'plain') return writeForInput(stored);
  if (kind === 'percent') return writeForInput(Number((stored * 100).toFixed(2)));
  return toInputText(stored, kind.unit);
}

export const unitLabel = (kind: FieldKind): string | undefined => (kind === 'percent' ? '%' : typeof kind === 'object' ? kind.unit.label : undefined);

/** Reads every listed field of a text form into stored values; blank optional fields become `blankAs`. */
export function storedValues<K extends string>(
  texts: Record<K, string>,
  kinds: Record<K, FieldKind>,
  blankAs: Partial<Record<K, null>> = {},
): Record<K, number | null | undefined> {
  const out = {} as Record<K, number | null | undefined>;
  for (const key of Object.keys(kinds) as K[]) {
    const v = storedFromText(texts[key] ?? '', kinds[key]);
    out[key] = v === undefined && key in blankAs ? null : v;
  }
  return out;
}
