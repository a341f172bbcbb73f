import { useState, type FormEvent } from 'react';
import { ROLES, type Role } from '@shared/permissions';
import { inviteRequest } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { ClientGroupPicker, type GroupOption } from '@frontend/components/ui/client-group-picker';
import { Notice } from '@frontend/components/ui/notice';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import { ROLE_LABELS, ROLE_NOTES } from '@frontend/lib/format';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useSendInvitation } from '../api/send-invitation';

export function InviteForm({ organisationId, groups, mayGrantAll }: { organisationId: string; groups: GroupOption[]; mayGrantAll: boolean }) {
  const send = useSendInvitation(organisationId);
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('analyst');
  const [clientGroupIds, setClientGroupIds] = useState<string[] | null>(mayGrantAll ? null : []);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [sentTo, setSentTo] = useState<string | null>(null);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = inviteRequest.safeParse({ email, role, clientGroupIds });
    const local = parsed.success ? {} : zodFieldErrors(parsed.error);
    if (clientGroupIds !== null && clientGroupIds.length === 0) local.clientGroupIds ??= 'Tick at least one client group, or choose all plants';
    if (!parsed.success || Object.keys(local).length) return setFieldErrors(local);
    setFieldErrors({});
    setSentTo(null);
    send.mutate(parsed.data, {
      onSuccess: (inv) => {
        setSentTo(inv.email);
        setEmail('');
        setClientGroupIds(mayGrantAll ? null : []);
      },
      onError: (e) => setFieldErrors(serverFieldErrors(e)),
    });
  };

  const message = formMessage(send.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded border border-rule bg-paper-raised p-4">
      <h2>Invite a colleague</h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="E-mail" name="email" type="email" value={email} onChange={(e) => setEmail(e.target.value)} error={fieldErrors.email} />
        <SelectField label="Role" name="role" value={role} onChange={(e) => setRole(e.target.value as Role)} hint={ROLE_NOTES[role]} error={fieldErrors.role}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </SelectField>
      </div>
      <ClientGroupPicker groups={groups} value={clientGroupIds} onChange={setClientGroupIds} error={fieldErrors.clientGroupIds} mayChooseAll={mayGrantAll} />
      {message && <Notice tone="fault">{message}</Notice>}
      {sentTo && <Notice tone="ok">Invitation sent to {sentTo}. The link works once and for 7 days.</Notice>}
      <div>
        <Button type="submit" disabled={send.isPending}>
          {send.isPending ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
    </form>
  );
}
