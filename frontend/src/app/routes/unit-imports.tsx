import { ImportHistory } from '@frontend/features/imports/components/import-history';
import { useUnitPage } from './unit-layout';

export function UnitImportsPage() {
  const { organisationId, unit, cannotWrite } = useUnitPage();
  return (
    <section className="flex flex-col gap-3" aria-label="Import history">
      <p className="text-sm text-ink-soft">Every file imported for this unit, newest first. Undo removes the rows an import brought and recomputes the unit.</p>
      <ImportHistory organisationId={organisationId} unitId={unit.id} plantTimeZone={unit.plant.timeZone} cannotWrite={cannotWrite} />
    </section>
  );
}
