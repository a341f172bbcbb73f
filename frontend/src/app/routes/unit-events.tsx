import { useCleaningMethods } from '@frontend/features/cleaning-methods/api/get-cleaning-methods';
import { EventsTimeline } from '@frontend/features/events/components/events-timeline';
import { useUnitPage } from './unit-layout';

export function UnitEventsPage() {
  const { organisationId, unit, cannotWrite } = useUnitPage();
  const methods = useCleaningMethods(organisationId);
  return (
    <section className="flex flex-col gap-3" aria-label="Events">
      <p className="text-sm text-ink-soft">
        What happened to the condenser: cleanings, tube plugging, air in-leakage repairs and outages. A cleaning restarts the fouling trend from its date and
        plugging changes the tube count from its date; both recompute the derived data.
      </p>
      <EventsTimeline
        organisationId={organisationId}
        unitId={unit.id}
        currency={unit.economics?.currency ?? 'USD'}
        methods={methods.data}
        cannotWrite={cannotWrite}
      />
    </section>
  );
}
