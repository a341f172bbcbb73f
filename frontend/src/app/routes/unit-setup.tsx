import type { ReactNode } from 'react';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { CondenserForm } from '@frontend/features/units/components/condenser-form';
import { EconomicsForm } from '@frontend/features/units/components/economics-form';
import { RecomputeStatus } from '@frontend/features/units/components/recompute-status';
import { TurbineForm } from '@frontend/features/units/components/turbine-form';
import { useUnitPage } from './unit-layout';

function Section({ id, title, done, children }: { id: string; title: string; done: boolean; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4">
      <h2 id={id} className="flex items-baseline gap-2">
        {title}
        <span className={`text-xs font-normal ${done ? 'text-ok' : 'text-warn'}`}>{done ? 'saved' : 'not set up yet'}</span>
      </h2>
      {children}
    </section>
  );
}

export function UnitSetupPage() {
  const { organisationId, unit, units, system, cannotWrite } = useUnitPage();
  // keyed by unit and unit system: a change of preference refills the fields in the new units
  const key = `${unit.id}-${system}`;
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-soft">
        Values in {system === 'us' ? 'US customary' : 'SI'} units (change under your profile).
        {cannotWrite ? '' : ' Each section saves on its own; every save recomputes the unit’s derived data.'}
      </p>
      <RecomputeStatus jobs={unit.jobs} />
      {cannotWrite && <ReadOnlyReason reason={cannotWrite} action="change this unit’s setup" />}
      <Section id="condenser-heading" title="Condenser" done={!!unit.condenser}>
        <CondenserForm
          key={key}
          organisationId={organisationId}
          unitId={unit.id}
          saved={unit.condenser}
          units={units}
          system={system}
          cannotWrite={cannotWrite}
        />
      </Section>
      <Section id="turbine-heading" title="Turbine" done={!!unit.turbine}>
        <TurbineForm key={key} organisationId={organisationId} unitId={unit.id} saved={unit.turbine} units={units} cannotWrite={cannotWrite} />
      </Section>
      <Section id="economics-heading" title="Economics" done={!!unit.economics}>
        <EconomicsForm key={key} organisationId={organisationId} unitId={unit.id} saved={unit.economics} units={units} cannotWrite={cannotWrite} />
      </Section>
    </div>
  );
}
