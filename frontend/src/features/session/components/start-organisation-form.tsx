import { useState, type FormEvent } from 'react';
import { createOrganisationRequest } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { TextField } from '@frontend/components/ui/text-field';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreateOrganisation } from '../api/create-organisation';

/** Starts another organisation from the header's organisation list. */
export default function StartOrganisationForm({ onCreated, onCancel }: { onCreated: () => void; onCancel: () => void }) {
  const create = useCreateOrganisation();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = createOrganisationRequest.safeParse(formText(event.currentTarget, 'name'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    create.mutate(parsed.data, { onSuccess: onCreated, onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };
  const message = formMessage(create.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2 px-2 pb-1">
      <TextField label="New organisation’s name" name="name" autoFocus error={fieldErrors.name} hint="Starts a 14-day trial with you as administrator." />
      {message && (
        <p role="alert" className="text-xs text-fault">
          {message}
        </p>
      )}
      <div className="flex justify-end gap-2">
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? 'Starting…' : 'Start'}
        </Button>
      </div>
    </form>
  );
}
