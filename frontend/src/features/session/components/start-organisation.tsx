import { useState, type FormEvent } from 'react';
import { Button } from '@frontend/components/ui/button';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { TextField } from '@frontend/components/ui/text-field';
import { useCreateOrganisation } from '../api/create-organisation';

/** Someone signed in (e.g. with Google) who belongs to no organisation yet can start one here. */
export function StartOrganisation() {
  const create = useCreateOrganisation();
  const [name, setName] = useState('');
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    if (name.trim().length >= 2) create.mutate({ name: name.trim() });
  };
  return (
    <EmptyState title="You belong to no organisation yet" next="Ask an administrator to invite you, or start your own organisation on a 14-day trial.">
      <form onSubmit={onSubmit} className="flex items-end gap-2 text-left">
        <TextField label="Organisation name" value={name} onChange={(e) => setName(e.target.value)} error={create.error?.message} />
        <Button type="submit" disabled={create.isPending || name.trim().length < 2}>
          Start organisation
        </Button>
      </form>
    </EmptyState>
  );
}
