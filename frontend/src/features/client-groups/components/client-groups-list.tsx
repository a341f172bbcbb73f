import { useState, type FormEvent } from 'react';
import { clientGroupInput, type ClientGroupView } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { Notice } from '@frontend/components/ui/notice';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { RenameRow } from '@frontend/components/ui/rename-row';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { TextField } from '@frontend/components/ui/text-field';
import { formatDate } from '@frontend/lib/format';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreateClientGroup } from '../api/create-client-group';
import { useDeleteClientGroup } from '../api/delete-client-group';
import { useClientGroups } from '../api/get-client-groups';
import { useRenameClientGroup } from '../api/rename-client-group';

interface Props {
  organisationId: string;
  /** null when the person may manage groups; otherwise the reason shown beside the disabled actions. */
  cannotManage: string | null;
}

export function ClientGroupsList({ organisationId, cannotManage }: Props) {
  const groups = useClientGroups(organisationId);
  const remove = useDeleteClientGroup(organisationId);
  const [renaming, setRenaming] = useState<string | null>(null);

  return (
    <div className="flex flex-col gap-4">
      {cannotManage ? (
        <ReadOnlyReason reason={cannotManage} action="create, rename and delete client groups" />
      ) : (
        <CreateClientGroupForm organisationId={organisationId} />
      )}
      {remove.isError && <Notice tone="fault">{remove.error.message}</Notice>}
      {groups.isPending ? (
        <LoadingState what="client groups" />
      ) : groups.isError ? (
        <ErrorState what="client groups" error={groups.error} onRetry={() => groups.refetch()} />
      ) : groups.data.length === 0 ? (
        <EmptyState
          title="No client groups"
          next={
            cannotManage
              ? 'An administrator can create client groups to sort plants by owner or client.'
              : 'Create one above for each client or owner whose plants you look after; then limit members to the groups they work on.'
          }
        />
      ) : (
        <DataTable
          caption="Client groups"
          head={
            <>
              <th className={th}>Name</th>
              <th className={th}>Created</th>
              {!cannotManage && (
                <th className={th}>
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </>
          }
        >
          {groups.data.map((g) =>
            renaming === g.id ? (
              <RenameGroupRow key={g.id} group={g} organisationId={organisationId} onDone={() => setRenaming(null)} />
            ) : (
              <tr key={g.id} className={tr} data-testid="client-group-row">
                <td className={`${td} font-medium`}>{g.name}</td>
                <td className={`${td} whitespace-nowrap text-ink-soft`}>{formatDate(g.createdAt)}</td>
                {!cannotManage && (
                  <td className={`${td} text-right`}>
                    <div className="flex items-start justify-end gap-2">
                      <Button variant="quiet" onClick={() => setRenaming(g.id)} aria-label={`Rename ${g.name}`}>
                        Rename
                      </Button>
                      <ConfirmAction
                        label="Delete"
                        question={`Delete “${g.name}”? Members limited to this group lose access to its plants; members with other groups keep those.`}
                        confirmLabel="Delete group"
                        pending={remove.isPending && remove.variables === g.id}
                        onConfirm={() => remove.mutate(g.id)}
                      />
                    </div>
                  </td>
                )}
              </tr>
            ),
          )}
        </DataTable>
      )}
    </div>
  );
}

function CreateClientGroupForm({ organisationId }: { organisationId: string }) {
  const create = useCreateClientGroup(organisationId);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = clientGroupInput.safeParse(formText(form, 'name'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    create.mutate(parsed.data, { onSuccess: () => form.reset(), onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };
  const message = formMessage(create.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3 rounded border border-rule bg-paper-raised p-4">
      <div className="min-w-64 flex-1">
        <TextField label="New client group" name="name" placeholder="e.g. the plant owner’s name" error={fieldErrors.name} />
      </div>
      <Button type="submit" className="mt-6" disabled={create.isPending}>
        {create.isPending ? 'Creating…' : 'Create group'}
      </Button>
      {message && (
        <Notice tone="fault" className="w-full">
          {message}
        </Notice>
      )}
    </form>
  );
}

function RenameGroupRow({ group, organisationId, onDone }: { group: ClientGroupView; organisationId: string; onDone: () => void }) {
  const rename = useRenameClientGroup(organisationId);
  return (
    <RenameRow
      currentName={group.name}
      colSpan={3}
      schema={clientGroupInput}
      pending={rename.isPending}
      error={rename.error}
      onSave={(name, callbacks) => rename.mutate({ id: group.id, name }, callbacks)}
      onDone={onDone}
    />
  );
}
