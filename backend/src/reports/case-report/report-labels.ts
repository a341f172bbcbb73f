/** Names of the uncertain inputs of a case, as the sensitivity chart and the input table show them. */
import type { UncertainInput } from '@shared/domain/decision/uncertainty/schedule-uncertainty.js';

export const UNCERTAIN_INPUT_LABELS: Record<UncertainInput, { name: string; unit: string }> = {
  foulingRate: { name: 'Fouling rate', unit: '× base' },
  fuelPrice: { name: 'Fuel price', unit: '× base' },
  replacementPrice: { name: 'Replacement power price', unit: '× base' },
  cleaningCost: { name: 'Cleaning cost', unit: '× base' },
  recoveredCleanliness: { name: 'Cleanliness after cleaning', unit: 'shift in cleanliness factor' },
  discountRate: { name: 'Discount rate', unit: 'per year' },
};
