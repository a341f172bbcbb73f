import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { GENERAL_CAUTION } from '@shared/schemas/cleaning-method';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { SafetyCautions } from '@frontend/components/ui/safety-cautions';
import { usePortfolio } from '@frontend/features/portfolio/api/get-portfolio';
import { PortfolioFilters } from '@frontend/features/portfolio/components/portfolio-filters';
import { filterUnits, NO_FILTER, type PortfolioFilter } from '@frontend/features/portfolio/components/portfolio-order';
import { PortfolioTable } from '@frontend/features/portfolio/components/portfolio-table';
import { PortfolioTotalsPanel } from '@frontend/features/portfolio/components/portfolio-totals';
import { useSession } from '@frontend/features/session/api/get-session';
import { StartOrganisation } from '@frontend/features/session/components/start-organisation';
import type { UnitSystem } from '@frontend/lib/field-units';

function Portfolio({ organisationId, organisationName, system }: { organisationId: string; organisationName: string; system: UnitSystem }) {
  const portfolio = usePortfolio(organisationId);
  const [filter, setFilter] = useState<PortfolioFilter>(NO_FILTER);
  const shown = useMemo(() => (portfolio.data ? filterUnits(portfolio.data.units, filter) : []), [portfolio.data, filter]);
  if (portfolio.isPending) return <LoadingState what="the units" />;
  if (portfolio.isError) return <ErrorState what="the units" error={portfolio.error} onRetry={() => portfolio.refetch()} />;
  const p = portfolio.data;
  if (p.units.length === 0) {
    return (
      <EmptyState title="No generating units to show yet" next="Add a plant and its units, describe the condenser, then import performance data.">
        <Link className="text-sm text-tube-700 underline" to="/plants">
          Go to plants
        </Link>
      </EmptyState>
    );
  }
  return (
    <>
      <PortfolioTotalsPanel organisationName={organisationName} totals={p.totals} groups={p.groups} />
      <PortfolioFilters filter={filter} onChange={setFilter} groups={p.groups} staleAfterDays={p.staleAfterDays} />
      <p className="text-sm text-ink-soft" aria-live="polite" data-testid="portfolio-count">
        {shown.length === p.units.length ? `${p.units.length} units` : `${shown.length} of ${p.units.length} units`}
      </p>
      {shown.length === 0 ? (
        <p className="rounded border border-rule bg-paper-raised px-4 py-6 text-sm text-ink-soft">No unit matches these filters.</p>
      ) : (
        <PortfolioTable units={shown} system={system} />
      )}
      <p className="text-xs text-ink-faint">
        Cleanliness is the last day’s median; backpressure above expected and the fouling cost per day are means of the last 7 days with data. Money is in each
        unit’s own currency and totalled per currency. A plan’s saving is that of its whole year of cleanings against not cleaning.
      </p>
      <SafetyCautions texts={[GENERAL_CAUTION]} />
    </>
  );
}

export function OverviewPage() {
  const { data: session } = useSession();
  const active = session?.memberships.find((m) => m.organisationId === session.activeOrganisationId);
  return (
    <section className="flex flex-col gap-4">
      <h1>Portfolio{active ? ` — ${active.organisationName}` : ''}</h1>
      {active && session?.user ? (
        <Portfolio organisationId={active.organisationId} organisationName={active.organisationName} system={session.user.unitPreference} />
      ) : (
        <StartOrganisation />
      )}
    </section>
  );
}
