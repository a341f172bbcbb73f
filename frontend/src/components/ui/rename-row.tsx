import { useState, type FormEvent } from 'react';
import type { ZodType } from 'zod';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { Button } from './button';
import { td, tr } from './data-table';
import { TextField } from './text-field';

interface Props {
  currentName: string;
  colSpan: number;
  /** the shared schema of the rename request ({ name }) */
  schema: ZodType<{ name: string }>;
  pending: boolean;
  error: unknown;
  /** sends the new name; calls back with the server's field errors or when done */
  onSave: (name: string, callbacks: { onSuccess: () => void; onError: (e: unknown) => void }) => void;
  onDone: () => void;
}

/** A table row that turns into a one-field rename form; Escape or Cancel leaves it unchanged. */
export function RenameRow({ currentName, colSpan, schema, pending, error, onSave, onDone }: Props) {
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = schema.safeParse(formText(event.currentTarget, 'name'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    onSave(parsed.data.name, { onSuccess: onDone, onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };
  return (
    <tr className={`${tr} bg-tube-50/40`}>
      <td className={td} colSpan={colSpan}>
        <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3" onKeyDown={(e) => e.key === 'Escape' && onDone()}>
          <div className="min-w-64 flex-1">
            <TextField
              label={`New name for “${currentName}”`}
              name="name"
              defaultValue={currentName}
              autoFocus
              error={fieldErrors.name ?? formMessage(error) ?? undefined}
            />
          </div>
          <div className="mt-6 flex gap-2">
            <Button variant="quiet" onClick={onDone}>
              Cancel
            </Button>
            <Button type="submit" disabled={pending}>
              {pending ? 'Saving…' : 'Save name'}
            </Button>
          </div>
        </form>
      </td>
    </tr>
  );
}
