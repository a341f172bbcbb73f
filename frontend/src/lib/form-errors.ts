import type { z } from 'zod';
import { ApiError } from './api-client';

export type FieldErrors = Record<string, string>;

/** The first message per field of a failed zod parse, keyed by the top-level field name. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? String(issue.path[0]) : 'form';
    out[key] ??= issue.message;
  }
  return out;
}

/** The server's `details.fieldErrors`, keyed like zodFieldErrors so both go beside the same field. */
export function serverFieldErrors(error: unknown): FieldErrors {
  if (!(error instanceof ApiError)) return {};
  const out: FieldErrors = {};
  for (const fe of error.details?.fieldErrors ?? []) {
    const [field = ''] = String(fe.path).split('.');
    out[field] ??= fe.message;
  }
  return out;
}

/** The message for the whole form, unless every problem is already shown beside a field. */
export function formMessage(error: unknown): string | null {
  if (!error) return null;
  if (error instanceof ApiError && (error.details?.fieldErrors?.length ?? 0) > 0) return null;
  return error instanceof Error ? error.message : 'Something went wrong';
}

/** Reads a form's text fields as strings, one per name asked for. */
export function formText<Name extends string>(form: HTMLFormElement, ...names: Name[]): Record<Name, string> {
  const data = new FormData(form);
  return Object.fromEntries(names.map((n) => [n, String(data.get(n) ?? '')])) as Record<Name, string>;
}

/** Like zodFieldErrors, but a problem inside a list says which row (1-based) and which column it is in. */
export function zodFieldErrorsByRow(error: z.ZodError, columnNames: Record<string, string> = {}): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? String(issue.path[0]) : 'form';
    const rowIndex = issue.path.findIndex((p) => typeof p === 'number');
    const column = issue.path.at(-1);
    const where =
      rowIndex > 0 ? `Row ${(issue.path[rowIndex] as number) + 1}${typeof column === 'string' && columnNames[column] ? `, ${columnNames[column]}` : ''}: ` : '';
    out[key] ??= `${where}${issue.message}`;
  }
  return out;
}
