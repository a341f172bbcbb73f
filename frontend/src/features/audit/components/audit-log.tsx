import { useId, useMemo, type FormEvent } from 'react';
import type { AuditEventView } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import { formatDateTime } from '@frontend/lib/format';
import { formText } from '@frontend/lib/form-errors';
import { useAuditEvents, type AuditFilters } from '../api/get-audit-events';

interface Props {
  organisationId: string;
  filters: AuditFilters;
  onFiltersChange: (filters: AuditFilters) => void;
}

/** Who changed what, newest first. Filter choices come from what the unfiltered log contains. */
export function AuditLog({ organisationId, filters, onFiltersChange }: Props) {
  const events = useAuditEvents(organisationId, filters);
  const everything = useAuditEvents(organisationId, {});
  const choices = useMemo(() => filterChoices(everything.data ?? []), [everything.data]);
  const listId = useId();
  const filtered = Object.values(filters).some(Boolean);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const f = formText(event.currentTarget, 'action', 'userId', 'entityType', 'from', 'to');
    onFiltersChange(Object.fromEntries(Object.entries(f).filter(([, v]) => v.trim() !== '').map(([k, v]) => [k, v.trim()])));
  };

  return (
    <div className="flex flex-col gap-4">
      <form
        key={JSON.stringify(filters)}
        onSubmit={onSubmit}
        noValidate
        className="no-print grid grid-cols-2 items-end gap-3 rounded border border-rule bg-paper-raised p-4 md:grid-cols-6"
        aria-label="Filter the audit log"
      >
        <TextField label="Action starts with" name="action" list={`${listId}-actions`} defaultValue={filters.action} placeholder="e.g. member." />
        <datalist id={`${listId}-actions`}>
          {choices.actionPrefixes.map((a) => (
            <option key={a} value={a} />
          ))}
        </datalist>
        <SelectField label="Person" name="userId" defaultValue={filters.userId ?? ''}>
          <option value="">Anyone</option>
          {choices.people.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
        <SelectField label="Record type" name="entityType" defaultValue={filters.entityType ?? ''}>
          <option value="">Any</option>
          {choices.entityTypes.map((t) => (
            <option key={t} value={t}>
              {t}
            </option>
          ))}
        </SelectField>
        <TextField label="From" name="from" type="date" defaultValue={filters.from} />
        <TextField label="To" name="to" type="date" defaultValue={filters.to} />
        <div className="flex gap-2">
          <Button type="submit">Filter</Button>
          {filtered && (
            <Button variant="quiet" onClick={() => onFiltersChange({})}>
              Clear
            </Button>
          )}
        </div>
      </form>
      {events.isPending ? (
        <LoadingState what="the audit log" />
      ) : events.isError ? (
        <ErrorState what="the audit log" error={events.error} onRetry={() => events.refetch()} />
      ) : events.data.length === 0 ? (
        <EmptyState
          title={filtered ? 'Nothing matches these filters' : 'Nothing recorded yet'}
          next={filtered ? 'Widen the dates or clear a filter.' : 'Changes to members, invitations, client groups and tokens are recorded here as they happen.'}
        />
      ) : (
        <>
          <p className="text-xs text-ink-soft" aria-live="polite">
            {events.data.length} {events.data.length === 1 ? 'entry' : 'entries'}, newest first{events.data.length >= 100 ? ' (the latest 100; narrow the filters to see older ones)' : ''}
            {events.isFetching ? ' · updating…' : ''}
          </p>
          <DataTable
            caption="Audit log"
            head={
              <>
                <th className={th}>When</th>
                <th className={th}>Person</th>
                <th className={th}>Action</th>
                <th className={th}>Record</th>
                <th className={th}>Details</th>
              </>
            }
          >
            {events.data.map((e) => (
              <tr key={e.id} className={tr}>
                <td className={`${td} whitespace-nowrap`}>{formatDateTime(e.createdAt)}</td>
                <td className={td}>{e.userName ?? <span className="text-ink-faint">system</span>}</td>
                <td className={`${td} font-mono text-xs`}>{e.action}</td>
                <td className={td}>
                  {e.entityType}
                  {e.entityId && <span className="ml-1 font-mono text-2xs text-ink-faint" title={e.entityId}>{e.entityId.slice(0, 8)}</span>}
                </td>
                <td className={`${td} max-w-md break-words font-mono text-2xs text-ink-soft`}>{describeDetails(e.details)}</td>
              </tr>
            ))}
          </DataTable>
        </>
      )}
    </div>
  );
}

function filterChoices(events: AuditEventView[]) {
  const people = new Map<string, string>();
  const entityTypes = new Set<string>();
  const actionPrefixes = new Set<string>();
  for (const e of events) {
    if (e.userId) people.set(e.userId, e.userName ?? e.userId);
    entityTypes.add(e.entityType);
    actionPrefixes.add(`${e.action.split('.')[0]}.`);
  }
  return {
    people: [...people].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name)),
    entityTypes: [...entityTypes].sort(),
    actionPrefixes: [...actionPrefixes].sort(),
  };
}

function describeDetails(details: Record<string, unknown> | null): string {
  if (!details) return '';
  return Object.entries(details)
    .map(([k, v]) => `${k}: ${typeof v === 'string' ? v : JSON.stringify(v)}`)
    .join(' · ');
}
