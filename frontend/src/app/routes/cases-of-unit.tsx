import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { useCases } from '@frontend/features/cases/api/get-cases';
import { CasesTable } from '@frontend/features/cases/components/cases-table';
import { NewCaseForm } from '@frontend/features/cases/components/new-case-form';
import { useUnitPage } from './unit-layout';

/** A unit's Cases tab: its cleaning cases, and a new one for those who may write. */
export function UnitCasesPage() {
  const { organisationId, unit, cannotWrite } = useUnitPage();
  const cases = useCases(organisationId, { unitId: unit.id });
  return (
    <section className="flex flex-col gap-3" aria-label="Cases">
      <p className="text-sm text-ink-soft">
        A case builds the least-cost cleaning schedule for this unit over the next two years from its fouling trend, seasons, prices and planned outages, and
        what it is worth against a plain plan. Every prefilled input can be changed.
      </p>
      {cannotWrite ? <p className="text-xs text-ink-soft">{cannotWrite}: start a case.</p> : <NewCaseForm organisationId={organisationId} unitId={unit.id} />}
      {cases.isPending && <LoadingState what="the unit's cases" />}
      {cases.isError && <ErrorState what="the unit's cases" error={cases.error} onRetry={() => cases.refetch()} />}
      {cases.data?.length === 0 && (
        <EmptyState title="No cases for this unit yet" next={cannotWrite ? 'An analyst starts one here.' : 'Give the first one a title above.'} />
      )}
      {cases.data && cases.data.length > 0 && <CasesTable cases={cases.data} showUnit={false} />}
    </section>
  );
}
