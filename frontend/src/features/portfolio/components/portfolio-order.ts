/** Sorting and filtering of the portfolio's rows: pure, so the table and its tests share one rule. */
import type { UnitConditionKind } from '@shared/domain/portfolio/unit-conditions';
import type { PortfolioUnit } from '@shared/schemas/portfolio';

export const SORT_KEYS = [
  'unit',
  'group',
  'cleanliness',
  'excess',
  'costPerDay',
  'costSince',
  'nextCleaning',
  'cases',
  'outage',
  'dataAge',
  'conditions',
] as const;
export type SortKey = (typeof SORT_KEYS)[number];
export interface SortOrder {
  key: SortKey;
  direction: 'ascending' | 'descending';
}

/** The value a column sorts by; null sorts last whichever the direction. */
function sortValue(u: PortfolioUnit, key: SortKey): string | number | null {
  switch (key) {
    case 'unit':
      return `${u.plantName} ${u.unitName}`.toLowerCase();
    case 'group':
      return u.clientGroup?.name.toLowerCase() ?? null;
    case 'cleanliness':
      return u.cleanliness;
    case 'excess':
      return u.excessBackpressureKpa;
    case 'costPerDay':
      return u.foulingCostPerDay;
    case 'costSince':
      return u.foulingCostSinceCleaning;
    case 'nextCleaning':
      return u.nextCleaning?.date ?? null;
    case 'cases':
      return u.openCases.length;
    case 'outage':
      return u.nextOutage?.startDate ?? null;
    case 'dataAge':
      return u.dataAgeDays;
    case 'conditions':
      return u.alerts.length;
  }
}

export function sortUnits(units: readonly PortfolioUnit[], order: SortOrder): PortfolioUnit[] {
  const sign = order.direction === 'ascending' ? 1 : -1;
  return [...units].sort((a, b) => {
    const x = sortValue(a, order.key);
    const y = sortValue(b, order.key);
    if (x === null && y === null) return 0;
    if (x === null) return 1;
    if (y === null) return -1;
    return sign * (typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y)));
  });
}

export interface PortfolioFilter {
  /** a client group's id, 'none' for units in no group, or '' for every group */
  group: string;
  /** '' any, 'attention' any condition, 'clear' none, or one condition's kind */
  condition: '' | 'attention' | 'clear' | UnitConditionKind;
  staleOnly: boolean;
  text: string;
}

export const NO_FILTER: PortfolioFilter = { group: '', condition: '', staleOnly: false, text: '' };

export function filterUnits(units: readonly PortfolioUnit[], f: PortfolioFilter): PortfolioUnit[] {
  const text = f.text.trim().toLowerCase();
  return units.filter((u) => {
    if (f.group === 'none' ? u.clientGroup !== null : f.group !== '' && u.clientGroup?.id !== f.group) return false;
    if (f.condition === 'attention' && u.alerts.length === 0) return false;
    if (f.condition === 'clear' && u.alerts.length > 0) return false;
    if (f.condition !== '' && f.condition !== 'attention' && f.condition !== 'clear' && !u.alerts.some((a) => a.kind === f.condition)) return false;
    if (f.staleOnly && !u.stale) return false;
    if (text && !`${u.plantName} ${u.unitName}`.toLowerCase().includes(text)) return false;
    return true;
  });
}
