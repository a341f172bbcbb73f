import { useState, type FormEvent } from 'react';
import { apiTokenCreate } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { CopyButton } from '@frontend/components/ui/copy-button';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { TextField } from '@frontend/components/ui/text-field';
import { formatDate, formatDateTime } from '@frontend/lib/format';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreateApiToken } from '../api/create-api-token';
import { useApiTokens } from '../api/get-api-tokens';
import { useRevokeApiToken } from '../api/revoke-api-token';

export function ApiTokensPanel({ organisationId, origin }: { organisationId: string; origin: string }) {
  const tokens = useApiTokens(organisationId);
  const revoke = useRevokeApiToken(organisationId);
  const [fresh, setFresh] = useState<{ name: string; token: string } | null>(null);

  return (
    <div className="flex flex-col gap-5">
      <CreateTokenForm organisationId={organisationId} onCreated={setFresh} />
      {fresh && (
        <div className="flex flex-col gap-2 rounded border border-warn/50 bg-ledger-50 p-4" data-testid="new-api-token">
          <p className="text-sm font-medium text-warn">Copy the secret of “{fresh.name}” now. It is shown this once and cannot be read again.</p>
          <div className="flex flex-wrap items-center gap-2">
            <code className="break-all rounded border border-rule bg-paper-raised px-2 py-1 font-mono text-sm">{fresh.token}</code>
            <CopyButton text={fresh.token} label="Copy secret" />
            <Button variant="quiet" onClick={() => setFresh(null)}>
              I have stored it
            </Button>
          </div>
          <p className="text-xs text-ink-soft">Anyone holding it can use the calculation API as you. Lost it? Revoke the token and create another.</p>
        </div>
      )}
      {revoke.isError && <Notice tone="fault">{revoke.error.message}</Notice>}
      {tokens.isPending ? (
        <LoadingState what="API tokens" />
      ) : tokens.isError ? (
        <ErrorState what="API tokens" error={tokens.error} onRetry={() => tokens.refetch()} />
      ) : tokens.data.length === 0 ? (
        <EmptyState title="No API tokens" next="Create one above to call the calculation API from a script or a spreadsheet." />
      ) : (
        <DataTable
          caption="Your API tokens"
          head={
            <>
              <th className={th}>Name</th>
              <th className={th}>Starts with</th>
              <th className={th}>Created</th>
              <th className={th}>Last used</th>
              <th className={th}>
                <span className="sr-only">Actions</span>
              </th>
            </>
          }
        >
          {tokens.data.map((t) => (
            <tr key={t.id} className={tr}>
              <td className={`${td} font-medium`}>{t.name}</td>
              <td className={`${td} font-mono`}>{t.prefix}…</td>
              <td className={`${td} whitespace-nowrap`}>{formatDate(t.createdAt)}</td>
              <td className={`${td} whitespace-nowrap ${t.lastUsedAt ? '' : 'text-ink-faint'}`}>{t.lastUsedAt ? formatDateTime(t.lastUsedAt) : 'Never'}</td>
              <td className={`${td} text-right`}>
                <ConfirmAction
                  label="Revoke"
                  question={`Scripts using “${t.name}” stop working at once.`}
                  confirmLabel="Revoke token"
                  pending={revoke.isPending && revoke.variables === t.id}
                  onConfirm={() => revoke.mutate(t.id)}
                />
              </td>
            </tr>
          ))}
        </DataTable>
      )}
      <UsageExample origin={origin} />
    </div>
  );
}

function CreateTokenForm({ organisationId, onCreated }: { organisationId: string; onCreated: (t: { name: string; token: string }) => void }) {
  const create = useCreateApiToken(organisationId);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = apiTokenCreate.safeParse(formText(form, 'name'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    create.mutate(parsed.data, {
      onSuccess: (t) => {
        form.reset();
        onCreated({ name: t.name, token: t.token });
      },
      onError: (e) => setFieldErrors(serverFieldErrors(e)),
    });
  };
  const message = formMessage(create.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3 rounded border border-rule bg-paper-raised p-4">
      <div className="min-w-64 flex-1">
        <TextField
          label="Token name"
          name="name"
          placeholder="e.g. unit 2 historian script"
          hint="Say where it will be used, so you know what breaks when you revoke it."
          error={fieldErrors.name}
        />
      </div>
      <Button type="submit" className="mt-6" disabled={create.isPending}>
        {create.isPending ? 'Creating…' : 'Create token'}
      </Button>
      {message && (
        <Notice tone="fault" className="w-full">
          {message}
        </Notice>
      )}
    </form>
  );
}

function UsageExample({ origin }: { origin: string }) {
  const example = `curl -H "Authorization: Bearer <token>" -H "content-type: application/json" -d '{"pressureKpa": 8}' ${origin}/api/calc/saturation`;
  return (
    <section className="flex flex-col gap-2">
      <h2>Trying it out</h2>
      <p className="text-sm text-ink-soft">
        Saturation temperature at 8 kPa absolute, from a terminal. Replace <code className="font-mono">&lt;token&gt;</code> with the secret. Tokens act in this
        organisation only, with your role.
      </p>
      <pre className="whitespace-pre-wrap break-all rounded border border-rule bg-paper-sunk p-3 font-mono text-xs">{example}</pre>
      <div>
        <CopyButton text={example} label="Copy command" />
      </div>
    </section>
  );
}
