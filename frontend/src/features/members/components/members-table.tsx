import { useState } from 'react';
import { ROLES, type Role } from '@shared/permissions';
import { memberUpdate, type MemberView } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { ClientGroupPicker, describeGroupLimit, type GroupOption } from '@frontend/components/ui/client-group-picker';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { SelectField } from '@frontend/components/ui/select-field';
import { formatDate, ROLE_LABELS } from '@frontend/lib/format';
import { zodFieldErrors } from '@frontend/lib/form-errors';
import { useMembers } from '../api/get-members';
import { useRemoveMember } from '../api/remove-member';
import { useUpdateMember } from '../api/update-member';

export function MembersTable({
  organisationId,
  groups,
  currentUserId,
  mayGrantAll,
}: {
  organisationId: string;
  groups: GroupOption[];
  currentUserId: string;
  mayGrantAll: boolean;
}) {
  const members = useMembers(organisationId);
  const remove = useRemoveMember(organisationId);
  const [editing, setEditing] = useState<string | null>(null);

  if (members.isPending) return <LoadingState what="members" />;
  if (members.isError) return <ErrorState what="members" error={members.error} onRetry={() => members.refetch()} />;
  if (members.data.length === 0) return <EmptyState title="No members" next="Invite colleagues with the form below." />;

  return (
    <div className="flex flex-col gap-2">
      {remove.isError && <Notice tone="fault">{remove.error.message}</Notice>}
      <DataTable
        head={
          <>
            <th className={th}>Member</th>
            <th className={th}>Role</th>
            <th className={th}>Plants</th>
            <th className={`${th} hidden lg:table-cell`}>Joined</th>
            <th className={th}>
              <span className="sr-only">Actions</span>
            </th>
          </>
        }
      >
        {members.data.map((m) =>
          editing === m.membershipId ? (
            <MemberEditor
              key={m.membershipId}
              member={m}
              groups={groups}
              organisationId={organisationId}
              mayGrantAll={mayGrantAll}
              onDone={() => setEditing(null)}
            />
          ) : (
            <tr key={m.membershipId} className={tr}>
              <td className={td}>
                <p>
                  {m.name}
                  {m.userId === currentUserId && <span className="ml-1 text-xs text-ink-faint">(you)</span>}
                </p>
                <p className="break-all text-xs text-ink-soft">{m.email}</p>
              </td>
              <td className={td}>{ROLE_LABELS[m.role]}</td>
              <td className={`${td} ${m.clientGroupIds === null ? 'text-ink-soft' : ''}`}>{describeGroupLimit(m.clientGroupIds, groups)}</td>
              <td className={`${td} hidden whitespace-nowrap lg:table-cell`}>{formatDate(m.joinedAt)}</td>
              <td className={`${td} text-right`}>
                <div className="flex flex-col items-end gap-1 lg:flex-row lg:items-start lg:justify-end lg:gap-2">
                  <Button variant="quiet" onClick={() => setEditing(m.membershipId)} aria-label={`Change access of ${m.name}`}>
                    Change access
                  </Button>
                  <ConfirmAction
                    label="Remove"
                    question={`${m.name} loses access to this organisation at once. Their account and other organisations stay.`}
                    confirmLabel="Remove member"
                    pending={remove.isPending && remove.variables === m.membershipId}
                    onConfirm={() => remove.mutate(m.membershipId)}
                  />
                </div>
              </td>
            </tr>
          ),
        )}
      </DataTable>
    </div>
  );
}

function MemberEditor({
  member,
  groups,
  organisationId,
  mayGrantAll,
  onDone,
}: {
  member: MemberView;
  groups: GroupOption[];
  organisationId: string;
  mayGrantAll: boolean;
  onDone: () => void;
}) {
  const update = useUpdateMember(organisationId);
  const [role, setRole] = useState<Role>(member.role);
  const [clientGroupIds, setClientGroupIds] = useState<string[] | null>(member.clientGroupIds);
  const [errors, setErrors] = useState<Record<string, string>>({});

  const save = () => {
    const limitProblem = clientGroupIds !== null && clientGroupIds.length === 0 ? 'Tick at least one client group, or choose all plants' : null;
    const parsed = memberUpdate.safeParse({ role, clientGroupIds });
    if (!parsed.success || limitProblem)
      return setErrors({ ...(parsed.success ? {} : zodFieldErrors(parsed.error)), ...(limitProblem ? { clientGroupIds: limitProblem } : {}) });
    setErrors({});
    update.mutate({ membershipId: member.membershipId, ...parsed.data }, { onSuccess: onDone });
  };

  return (
    <tr className="border-b border-rule bg-tube-50/40 last:border-0">
      <td className={td}>
        <p className="font-medium">{member.name}</p>
        <p className="break-all text-xs text-ink-soft">{member.email}</p>
      </td>
      <td className={td}>
        <SelectField label="Role" value={role} onChange={(e) => setRole(e.target.value as Role)} error={errors.role}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </SelectField>
      </td>
      <td className={td} colSpan={2}>
        <ClientGroupPicker groups={groups} value={clientGroupIds} onChange={setClientGroupIds} error={errors.clientGroupIds} mayChooseAll={mayGrantAll} />
      </td>
      <td className={`${td} text-right`}>
        <div className="flex flex-col items-end gap-2">
          {update.isError && (
            <p role="alert" className="max-w-xs text-left text-xs text-fault">
              {update.error.message}
            </p>
          )}
          <div className="flex gap-2">
            <Button variant="quiet" onClick={onDone}>
              Cancel
            </Button>
            <Button onClick={save} disabled={update.isPending}>
              {update.isPending ? 'Saving…' : 'Save'}
            </Button>
          </div>
        </div>
      </td>
    </tr>
  );
}
