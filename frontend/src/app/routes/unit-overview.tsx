import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { Link } from 'react-router-dom';
import { linkClass } from '@frontend/components/ui/public-page';
import { useCleaningMethods } from '@frontend/features/cleaning-methods/api/get-cleaning-methods';
import { AddCleaning } from '@frontend/features/events/components/add-cleaning';
import { unitHealthKey } from '@frontend/features/health/api/get-health';
import { HealthView } from '@frontend/features/health/components/health-view';
import { jobIsActive } from '@frontend/features/units/api/get-unit';
import { RecomputeStatus } from '@frontend/features/units/components/recompute-status';
import { UnitSummary } from '@frontend/features/units/components/unit-summary';
import { useUnitPage } from './unit-layout';

/** The unit's index page: the condenser health view, or what to do before there can be one. */
export function UnitOverviewPage() {
  const { organisationId, unit, units, cannotWrite } = useUnitPage();
  const queryClient = useQueryClient();
  const hasData = unit.samples.count > 0;
  const working = unit.jobs.some(jobIsActive);
  const methods = useCleaningMethods(organisationId, unit.setupComplete && hasData && !cannotWrite);
  const wasWorking = useRef(working);
  useEffect(() => {
    // a recompute (after a cleaning, a setup change or an import) just ended: the health figures changed
    if (wasWorking.current && !working) void queryClient.invalidateQueries({ queryKey: unitHealthKey(organisationId, unit.id) });
    wasWorking.current = working;
  }, [working, organisationId, unit.id, queryClient]);

  if (unit.setupComplete && hasData) {
    const lastJob = unit.jobs[0];
    return (
      <div className="flex flex-col gap-6">
        <HealthView
          organisationId={organisationId}
          unit={{
            id: unit.id,
            timeZone: unit.plant.timeZone,
            firstSampleUtc: unit.samples.first,
            lastSampleUtc: unit.samples.last,
            currency: unit.economics?.currency ?? 'USD',
          }}
          units={units}
          cannotWrite={cannotWrite}
          progress={working || lastJob?.status === 'failed' ? <RecomputeStatus jobs={unit.jobs} /> : null}
          addCleaning={(p) => (
            <AddCleaning organisationId={organisationId} unitId={unit.id} currency={unit.economics?.currency ?? 'USD'} methods={methods.data} {...p} />
          )}
        />
        {/* the basis of the figures: design point, data span, recent background work */}
        <section aria-label="Unit basis" className="no-print border-t border-rule pt-4">
          <UnitSummary unit={unit} units={units} showStatus={false} cannotWrite={cannotWrite} />
        </section>
      </div>
    );
  }

  const next = [
    !unit.setupComplete && (
      <Link key="setup" className={linkClass} to={`/units/${unit.id}/setup`}>
        finish the setup
      </Link>
    ),
    !hasData && (
      <Link key="import" className={linkClass} to={`/units/${unit.id}/data`}>
        import its performance data
      </Link>
    ),
  ].filter(Boolean);
  return (
    <section className="flex flex-col gap-4" aria-label="Unit summary">
      <p className="text-sm text-ink-soft">
        Before cleanliness and cost can be shown: {next[0]}
        {next.length > 1 && <> and {next[1]}</>}.
      </p>
      <UnitSummary unit={unit} units={units} cannotWrite={cannotWrite} />
    </section>
  );
}
