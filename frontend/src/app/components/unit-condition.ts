import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { healthQueryOptions, type HealthHeadline } from '@frontend/features/health/api/get-health';
import { unitQueryOptions } from '@frontend/features/units/api/get-unit';
import { formatCurrency, formatDay, formatPercent } from '@frontend/lib/format';
import { physicalCostParts } from '@shared/text/physical-cost-text';

/** Data older than this reads as stale beside a unit (the health view's own threshold, common practice for daily monitoring). */
const STALE_AFTER_DAYS = 2;

/** Today as an ISO day: the health request then carries no daily series, only the headline (which never depends on the period). */
const headlineOnlyDay = () => new Date().toISOString().slice(0, 10);

export interface UnitCondition {
  state: 'loading' | 'error' | 'ready';
  cleanliness: string;
  reference: string | null;
  costPerDay: string;
  /** a negative cost is real (the unit runs better than its reference): said in words, not as a minus sign alone */
  costNote: string | null;
  /** the MW and t CO2 the cost per day stands for, one part per quantity */
  physical: string[];
  dataAge: string;
  stale: boolean;
  lastDay: string | null;
}

function ageInWords(days: number): string {
  if (days < 1) return 'less than a day old';
  const whole = Math.floor(days);
  return `${whole.toLocaleString('en-US')} day${whole === 1 ? '' : 's'} old`;
}

/** One unit's condition as the lists show it: cleanliness, fouling cost per day, how old its data is. */
export function useUnitCondition(organisationId: string, unitId: string): UnitCondition {
  const unit = useQuery(unitQueryOptions(organisationId, unitId));
  const [day] = useState(headlineOnlyDay);
  const health = useQuery({ ...healthQueryOptions(organisationId, unitId, { from: day, to: day, breakdownBy: 'month' }), placeholderData: undefined });
  // the data's age is measured from when the figures were fetched, as on the unit's own page
  const now = health.dataUpdatedAt;
  const empty = { cleanliness: '—', reference: null, costPerDay: '—', costNote: null, physical: [], dataAge: '—', stale: false, lastDay: null };
  if (unit.isError || health.isError) return { state: 'error', ...empty };
  if (!unit.data || !health.data) return { state: 'loading', ...empty };
  const h: HealthHeadline = health.data.headline;
  const currency = unit.data.economics?.currency ?? 'USD';
  const ageDays = h.lastSampleUtc ? (now - Date.parse(h.lastSampleUtc)) / 86_400_000 : null;
  const cost = h.foulingCostPerDay;
  return {
    state: 'ready',
    cleanliness: formatPercent(h.cleanliness, 1),
    reference: h.referenceCleanliness === null ? null : formatPercent(h.referenceCleanliness, 0),
    costPerDay: cost === null ? '—' : `${formatCurrency(Math.abs(cost), currency)}/day`,
    costNote: cost !== null && cost < 0 ? 'saved: cleaner than the reference' : null,
    physical: cost !== null && h.foulingPhysical ? physicalCostParts(h.foulingPhysical.perDay, h.foulingPhysical.capacityLimitedShare, 'a day') : [],
    dataAge: ageDays === null ? 'no data yet' : ageInWords(ageDays),
    stale: ageDays !== null && ageDays > STALE_AFTER_DAYS,
    lastDay: h.asOf ? formatDay(h.asOf) : null,
  };
}
