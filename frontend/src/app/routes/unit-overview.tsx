import { Link } from 'react-router-dom';
import { linkClass } from '@frontend/components/ui/public-page';
import { UnitSummary } from '@frontend/features/units/components/unit-summary';
import { useUnitPage } from './unit-layout';

/** The unit's index page; the health view (charts of cleanliness and cost) will take this place. */
export function UnitOverviewPage() {
  const { unit, units } = useUnitPage();
  const hasData = unit.samples.count > 0;
  const next = [
    !unit.setupComplete && (
      <Link key="setup" className={linkClass} to={`/units/${unit.id}/setup`}>
        finish the setup
      </Link>
    ),
    !hasData && (
      <Link key="import" className={linkClass} to={`/units/${unit.id}/import`}>
        import its performance data
      </Link>
    ),
  ].filter(Boolean);
  return (
    <section className="flex flex-col gap-4" aria-label="Unit summary">
      <p className="text-sm text-ink-soft">
        {next.length === 0 ? (
          'Setup and data are in place; cleanliness and cost figures are derived from them.'
        ) : (
          <>
            Before cleanliness and cost can be shown: {next[0]}
            {next.length > 1 && <> and {next[1]}</>}.
          </>
        )}
      </p>
      <UnitSummary unit={unit} units={units} />
    </section>
  );
}
