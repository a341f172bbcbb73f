import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { caseCreate } from '@shared/schemas/cases';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { TextField } from '@frontend/components/ui/text-field';
import { useCreateCase } from '../api/create-case';

/** Starts a case on a unit: a title is all it needs; the server fills the inputs from the unit's data. */
export function NewCaseForm({ organisationId, unitId }: { organisationId: string; unitId: string }) {
  const create = useCreateCase(organisationId, unitId);
  const navigate = useNavigate();
  const [title, setTitle] = useState('');
  const [error, setError] = useState<string | undefined>();
  return (
    <form
      aria-label="New case"
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        const checked = caseCreate.safeParse({ title });
        if (!checked.success) return setError(checked.error.issues[0]?.message);
        setError(undefined);
        create.mutate(checked.data, { onSuccess: (created) => navigate(`/cases/${created.id}`) });
      }}
    >
      <div className="min-w-64 flex-1">
        <TextField
          label="Title of the new case"
          value={title}
          maxLength={120}
          error={error}
          onChange={(e) => setTitle(e.target.value)}
          placeholder="e.g. Spring outage cleaning"
        />
      </div>
      <Button type="submit" disabled={create.isPending}>
        {create.isPending ? 'Building the case…' : 'New case'}
      </Button>
      {create.isError && (
        <Notice tone="fault" className="w-full">
          {create.error.message}
        </Notice>
      )}
    </form>
  );
}
