import type { OutageView } from '@shared/schemas/outages';
import { SafetyCautions } from '@frontend/components/ui/safety-cautions';
import { cautionsGeneralFirst } from './outage-words';

/** The safety notes for the kinds of work listed (for an approved outage: the work chosen), never hidden. */
export function OutageCautions({ outage }: { outage: OutageView }) {
  return (
    <section aria-label="Safety" className="flex flex-col gap-1">
      <SafetyCautions texts={cautionsGeneralFirst(outage)} testId="outage-cautions" />
    </section>
  );
}
