import { describe, expect, it } from 'vitest';
import { dataAgeDays, isStale, unitConditions } from '@shared/domain/portfolio/unit-conditions.js';
import type { PortfolioUnit } from '@shared/schemas/portfolio.js';
import { filterUnits, NO_FILTER, sortUnits } from '../../../frontend/src/features/portfolio/components/portfolio-order.js';

const base = { today: '2026-03-20', dataThrough: '2026-03-19', nextCleaning: null, currency: 'USD', airLeakDaysInLastWeek: 0 };

describe('a unit’s current conditions', () => {
  it('raises nothing for a unit with fresh data, no cleaning due and no unexplained backpressure', () => {
    expect(unitConditions(base)).toEqual([]);
  });

  it('says cleaning pays now when the outlook’s first cleaning is due today or earlier, with the plan’s saving in the unit’s currency', () => {
    const due = unitConditions({ ...base, nextCleaning: { date: '2026-03-20', methodName: 'Sponge balls', savingsVersusNoCleaning: 48_200.4 } });
    expect(due).toHaveLength(1);
    expect(due[0]!.kind).toBe('cleaning-now-pays');
    expect(due[0]!.sentence).toContain('20 Mar 2026');
    expect(due[0]!.sentence).toContain('$48,200');
    expect(unitConditions({ ...base, nextCleaning: { date: '2026-03-21', methodName: 'Sponge balls', savingsVersusNoCleaning: 1 } })).toEqual([]);
  });

  it('says backpressure is not from fouling when the air in-leakage verdicts flagged a recent day', () => {
    const c = unitConditions({ ...base, airLeakDaysInLastWeek: 1 });
    expect(c.map((x) => x.kind)).toEqual(['backpressure-unexplained']);
    expect(c[0]!.sentence).toContain('1 of the last 7 days');
  });

  it('says data stopped after more than 3 days without data, and counts a unit without data as stale without raising it', () => {
    expect(dataAgeDays('2026-03-20', '2026-03-17')).toBe(3);
    expect(isStale('2026-03-20', '2026-03-17')).toBe(false);
    expect(unitConditions({ ...base, dataThrough: '2026-03-17' })).toEqual([]);
    expect(isStale('2026-03-20', '2026-03-16')).toBe(true);
    expect(unitConditions({ ...base, dataThrough: '2026-03-16' })).toEqual([
      { kind: 'data-stopped', sentence: 'Data stopped arriving: the last day with data is 16 Mar 2026, 4 days ago.' },
    ]);
    expect(isStale('2026-03-20', null)).toBe(true);
    expect(unitConditions({ ...base, dataThrough: null })).toEqual([]);
  });
});

const unit = (id: string, over: Partial<PortfolioUnit>): PortfolioUnit => ({
  unitId: id,
  unitName: id,
  plantId: 'p',
  plantName: 'Plant',
  clientGroup: null,
  currency: 'USD',
  cleanliness: null,
  referenceCleanliness: null,
  excessBackpressureKpa: null,
  foulingCostPerDay: null,
  foulingCostSinceCleaning: null,
  lastCleaningDate: null,
  nextCleaning: null,
  nextCleaningNote: null,
  openCases: [],
  nextOutage: null,
  dataThrough: null,
  dataAgeDays: null,
  stale: false,
  alerts: [],
  note: null,
  ...over,
});

describe('sorting and filtering the portfolio', () => {
  const a = unit('a', { foulingCostPerDay: 100, clientGroup: { id: 'g1', name: 'One' } });
  const b = unit('b', { foulingCostPerDay: 300, stale: true, alerts: [{ kind: 'data-stopped', sentence: '…' }] });
  const c = unit('c', { foulingCostPerDay: null, clientGroup: { id: 'g2', name: 'Two' } });

  it('sorts by a column either way and keeps units without the figure last', () => {
    expect(sortUnits([a, b, c], { key: 'costPerDay', direction: 'descending' }).map((u) => u.unitId)).toEqual(['b', 'a', 'c']);
    expect(sortUnits([a, b, c], { key: 'costPerDay', direction: 'ascending' }).map((u) => u.unitId)).toEqual(['a', 'b', 'c']);
  });

  it('filters by client group (or none), condition and stale data', () => {
    expect(filterUnits([a, b, c], { ...NO_FILTER, group: 'g2' })).toEqual([c]);
    expect(filterUnits([a, b, c], { ...NO_FILTER, group: 'none' })).toEqual([b]);
    expect(filterUnits([a, b, c], { ...NO_FILTER, condition: 'attention' })).toEqual([b]);
    expect(filterUnits([a, b, c], { ...NO_FILTER, condition: 'clear' })).toEqual([a, c]);
    expect(filterUnits([a, b, c], { ...NO_FILTER, condition: 'cleaning-now-pays' })).toEqual([]);
    expect(filterUnits([a, b, c], { ...NO_FILTER, staleOnly: true })).toEqual([b]);
  });
});
