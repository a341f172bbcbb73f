import { useSearchParams } from 'react-router-dom';
import { CASE_STATUSES, caseListQuery, type CaseListQuery } from '@shared/schemas/cases';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { SelectField } from '@frontend/components/ui/select-field';
import { useCases } from '@frontend/features/cases/api/get-cases';
import { CasesTable } from '@frontend/features/cases/components/cases-table';
import { STATUS_WORDS } from '@frontend/features/cases/components/case-status-badge';
import { usePlants } from '@frontend/features/plants/api/get-plants';
import { useSession } from '@frontend/features/session/api/get-session';

/** The filters in the address, so a filtered list can be shared; anything unreadable is left out. */
export function caseFiltersFrom(params: URLSearchParams): CaseListQuery {
  const raw = { status: params.get('status') ?? undefined, unitId: params.get('unitId') ?? undefined };
  const checked = caseListQuery.safeParse(raw);
  return checked.success ? checked.data : {};
}

export function CasesPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const [params, setParams] = useSearchParams();
  const filters = caseFiltersFrom(params);
  const cases = useCases(organisationId, filters);
  const plants = usePlants(organisationId);
  if (!session?.user || !organisationId) return <NoOrganisation />;
  const setFilter = (key: keyof CaseListQuery, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  const viewerOnly = !session.permissions.includes('data.write') && !session.permissions.includes('cases.approve');
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1>Cleaning cases</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Each case says when to clean a unit’s condenser, with which method, and what that is worth. A new case starts from a unit’s Cases tab.
          {viewerOnly && ' Viewers see approved cases.'}
        </p>
      </div>
      <div className="flex flex-wrap gap-3">
        <SelectField label="Status" value={filters.status ?? ''} onChange={(e) => setFilter('status', e.target.value)}>
          <option value="">Any status</option>
          {CASE_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_WORDS[s]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Unit" value={filters.unitId ?? ''} onChange={(e) => setFilter('unitId', e.target.value)}>
          <option value="">Every unit</option>
          {plants.data?.flatMap((p) =>
            p.units.map((u) => (
              <option key={u.id} value={u.id}>
                {p.name} — {u.name}
              </option>
            )),
          )}
        </SelectField>
      </div>
      {cases.isPending && <LoadingState what="the cases" />}
      {cases.isError && <ErrorState what="the cases" error={cases.error} onRetry={() => cases.refetch()} />}
      {cases.data?.length === 0 && (
        <EmptyState
          title={filters.status || filters.unitId ? 'No case matches these filters' : 'No cases yet'}
          next={
            filters.status || filters.unitId
              ? 'Change or clear the filters above.'
              : session.permissions.includes('data.write')
                ? 'Open a unit under Plants and start one from its Cases tab.'
                : viewerOnly
                  ? 'Cases appear here once an approver approves them.'
                  : 'Cases appear here once an analyst or administrator starts one.'
          }
        />
      )}
      {cases.data && cases.data.length > 0 && <CasesTable cases={cases.data} showUnit />}
    </section>
  );
}
