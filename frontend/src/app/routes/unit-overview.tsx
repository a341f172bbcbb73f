import { Link } from 'react-router-dom';
import { linkClass } from '@frontend/components/ui/public-page';
import { UnitSummary } from '@frontend/features/units/components/unit-summary';
import { useUnitPage } from './unit-layout';

/** The unit's index page; the health view (charts of cleanliness and cost) will take this place. */
export function UnitOverviewPage() {
  const { unit, units } = useUnitPage();
  return (
    <section className="flex flex-col gap-4" aria-label="Unit summary">
      <p className="text-sm text-ink-soft">
        {unit.setupComplete && unit.samples.count > 0
          ? 'Setup and data are in place; cleanliness and cost figures are derived from them.'
          : 'Two steps before cleanliness and cost can be shown: '}
        {!(unit.setupComplete && unit.samples.count > 0) && (
          <>
            <Link className={linkClass} to={`/units/${unit.id}/setup`}>
              set up the unit
            </Link>{' '}
            and{' '}
            <Link className={linkClass} to={`/units/${unit.id}/import`}>
              import its data
            </Link>
            .
          </>
        )}
      </p>
      <UnitSummary unit={unit} units={units} />
    </section>
  );
}
