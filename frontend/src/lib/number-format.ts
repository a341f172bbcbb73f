import { groupedNumberText, numberFormatOf, readNumberText, writeNumberText, type NumberFormat, type NumberText } from '@shared/number-text';

/** The person's number format, from the browser's first language (a decimal point when there is none). */
export function personNumberFormat(): NumberFormat {
  const nav = (globalThis as { navigator?: { languages?: readonly string[]; language?: string } }).navigator;
  const locale = nav?.languages?.[0] ?? nav?.language;
  return locale ? numberFormatOf(locale) : { decimal: '.' };
}

/** How a typed text reads in the person's format. */
export const readTyped = (text: string): NumberText => readNumberText(text, personNumberFormat());

/** A number for an input, in the person's format. */
export const writeForInput = (value: number): string => writeNumberText(value, personNumberFormat());

/** A number for an input with its thousands grouped (a narrow space), in the person's format. */
export const writeGroupedForInput = (value: number): string => groupedNumberText(value, personNumberFormat());
