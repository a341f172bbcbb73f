import { useMemo, useState, type FormEvent } from 'react';
import type { AuditEventView } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { DayField } from '@frontend/components/ui/day-field';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { SelectField } from '@frontend/components/ui/select-field';
import { formatDateTime } from '@frontend/lib/format';
import { formText } from '@frontend/lib/form-errors';
import { useAuditEvents, type AuditFilters } from '../api/get-audit-events';
import { AUDIT_AREAS, auditSentence, NO_NAMES, type AuditNames } from './audit-words';

interface Props {
  organisationId: string;
  filters: AuditFilters;
  onFiltersChange: (filters: AuditFilters) => void;
  /** unit and client group names for the ids the log holds */
  names?: AuditNames;
}

/**
 * A day typed as the app shows days ("14 Mar 2026"), sent with the form as its ISO day once the text is one
 * (the field says why beside it otherwise, and nothing is filtered on it).
 */
function DayFilter({ label, name, initial }: { label: string; name: string; initial: string | undefined }) {
  const [day, setDay] = useState(initial ?? '');
  return (
    <div>
      <DayField label={label} value={day} onChange={setDay} />
      <input type="hidden" name={name} value={/^\d{4}-\d{2}-\d{2}$/.test(day) ? day : ''} />
    </div>
  );
}

/** Who changed what, newest first, each entry a sentence with names. Filter choices come from what the unfiltered log contains. */
export function AuditLog({ organisationId, filters, onFiltersChange, names = NO_NAMES }: Props) {
  const events = useAuditEvents(organisationId, filters);
  const everything = useAuditEvents(organisationId, {});
  const choices = useMemo(() => filterChoices(everything.data ?? []), [everything.data]);
  const filtered = Object.values(filters).some(Boolean);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const f = formText(event.currentTarget, 'action', 'userId', 'from', 'to');
    onFiltersChange(
      Object.fromEntries(
        Object.entries(f)
          .filter(([, v]) => v.trim() !== '')
          .map(([k, v]) => [k, v.trim()]),
      ),
    );
  };

  return (
    <div className="flex flex-col gap-4">
      <form
        key={JSON.stringify(filters)}
        onSubmit={onSubmit}
        noValidate
        className="no-print grid grid-cols-2 items-end gap-3 rounded border border-rule bg-paper-raised p-4 md:grid-cols-5"
        aria-label="Filter the audit log"
      >
        <SelectField label="About" name="action" defaultValue={filters.action ?? ''}>
          <option value="">Anything</option>
          {AUDIT_AREAS.filter((a) => choices.actionPrefixes.includes(a.prefix) || filters.action === a.prefix).map((a) => (
            <option key={a.prefix} value={a.prefix}>
              {a.label}
            </option>
          ))}
        </SelectField>
        <SelectField label="Person" name="userId" defaultValue={filters.userId ?? ''}>
          <option value="">Anyone</option>
          {choices.people.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
        <DayFilter label="From" name="from" initial={filters.from} />
        <DayFilter label="To" name="to" initial={filters.to} />
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
            {events.data.length} {events.data.length === 1 ? 'entry' : 'entries'}, newest first
            {events.data.length >= 100 ? ' (the latest 100; narrow the filters to see older ones)' : ''}
            {events.isFetching ? ' · updating…' : ''}
          </p>
          <DataTable
            caption="Audit log"
            head={
              <>
                <th className={th}>When</th>
                <th className={th}>What happened</th>
              </>
            }
          >
            {events.data.map((e) => (
              <tr key={e.id} className={tr} data-testid="audit-entry">
                <td className={`${td} whitespace-nowrap`}>{formatDateTime(e.createdAt)}</td>
                <td className={td}>{auditSentence(e, names)}</td>
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
  const actionPrefixes = new Set<string>();
  for (const e of events) {
    if (e.userId) people.set(e.userId, e.userName ?? e.userId);
    actionPrefixes.add(`${e.action.split('.')[0]}.`);
  }
  return {
    people: [...people].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name)),
    actionPrefixes: [...actionPrefixes].sort(),
  };
}
