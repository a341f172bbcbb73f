import { describeGroupLimit, type GroupOption } from '@frontend/components/ui/client-group-picker';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { formatDate, ROLE_LABELS } from '@frontend/lib/format';
import { useInvitations } from '../api/get-invitations';
import { useWithdrawInvitation } from '../api/withdraw-invitation';

export function PendingInvitations({ organisationId, groups }: { organisationId: string; groups: GroupOption[] }) {
  const invitations = useInvitations(organisationId);
  const withdraw = useWithdrawInvitation(organisationId);
  if (invitations.isPending) return <LoadingState what="pending invitations" />;
  if (invitations.isError) return <ErrorState what="pending invitations" error={invitations.error} onRetry={() => invitations.refetch()} />;
  if (invitations.data.length === 0) {
    return <p className="text-sm text-ink-soft">No invitations are waiting for an answer. New ones appear here until they are accepted or expire.</p>;
  }
  return (
    <div className="flex flex-col gap-2">
      {withdraw.isError && <Notice tone="fault">{withdraw.error.message}</Notice>}
      <DataTable
        head={
          <>
            <th className={th}>E-mail</th>
            <th className={th}>Role</th>
            <th className={th}>Plants</th>
            <th className={th}>Sent</th>
            <th className={th}>Expires</th>
            <th className={th}>
              <span className="sr-only">Actions</span>
            </th>
          </>
        }
      >
        {invitations.data.map((inv) => (
          <tr key={inv.id} className={tr}>
            <td className={td}>{inv.email}</td>
            <td className={td}>{ROLE_LABELS[inv.role]}</td>
            <td className={td}>{describeGroupLimit(inv.clientGroupIds, groups)}</td>
            <td className={`${td} whitespace-nowrap`}>{formatDate(inv.createdAt)}</td>
            <td className={`${td} whitespace-nowrap`}>{formatDate(inv.expiresAt)}</td>
            <td className={`${td} text-right`}>
              <ConfirmAction
                label="Withdraw"
                question={`The link sent to ${inv.email} stops working.`}
                confirmLabel="Withdraw invitation"
                pending={withdraw.isPending && withdraw.variables === inv.id}
                onConfirm={() => withdraw.mutate(inv.id)}
              />
            </td>
          </tr>
        ))}
      </DataTable>
    </div>
  );
}
