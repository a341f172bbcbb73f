/** The health view opens with one sentence: condition, cost per day, what to do and by when. */
import { describe, expect, it } from 'vitest';
import type { HealthHeadline } from '@frontend/features/health/api/get-health';
import { healthSentence } from '@frontend/features/health/components/health-sentence';

// demo-style figures, invented for the test
const plannedStep = { date: '2026-12-20', endDate: '2026-12-21', methodId: 'm1', methodName: 'Brush sweep', unitDuringCleaning: 'online' as const };
const base: HealthHeadline = {
  asOf: '2026-11-30',
  cleanliness: 0.712,
  trendCleanliness: 0.71,
  referenceCleanliness: 0.85,
  designCleanliness: 0.85,
  excessBackpressureKpa: 0.4,
  foulingCostPerDay: 4210.4,
  unexplainedCostPerDay: 120,
  foulingCostSinceCleaning: 250_000,
  lastCleaning: null,
  lastSampleUtc: '2026-11-30T23:00:00Z',
  averagingNote: '',
  costBasis: null,
  foulingPhysical: null,
  nextCleaning: {
    status: 'planned',
    planFrom: '2026-12-02',
    dataTo: '2026-11-30',
    plan: [plannedStep],
    next: {
      date: '2026-12-20',
      endDate: '2026-12-21',
      methodId: 'm1',
      methodName: 'Brush sweep',
      cleanlinessBefore: 0.7,
      cleanlinessAfter: 0.84,
      cleaningCost: 30_000,
      downtimeCost: 0,
      typicalValues: false,
    },
    methodsBasis: 'the library',
  },
};

describe('the health view’s opening sentence', () => {
  it('says the condition against the reference, the cost per day, and what to do by when', () => {
    expect(healthSentence(base, '2026-12-02', 'USD')).toBe(
      'Cleanliness is 71 %, 14 points below the 85 % reference and fouling costs about $4,210 a day: clean with the unit on line (Brush sweep) by 20 Dec 2026.',
    );
  });

  it('writes old data in the past tense on its own day, and says the plan rests on it', () => {
    const old = { ...base, asOf: '2026-03-19', nextCleaning: { ...base.nextCleaning!, dataTo: '2026-03-19' } };
    const text = healthSentence(old, '2026-12-02', 'USD');
    expect(text).toMatch(/^On 19 Mar 2026, the last day of data, cleanliness was 71 %/);
    expect(text).toContain('fouling cost about $4,210 a day');
    expect(text).toContain('(planned on data that ends 19 Mar 2026)');
  });

  it('says a plan date that has passed is overdue instead of offering it as what to do', () => {
    expect(healthSentence(base, '2026-12-24', 'USD')).toContain('the planned cleaning of 20 Dec 2026 is overdue');
  });

  it('says so when no cleaning pays, or when there is no plan yet', () => {
    expect(healthSentence({ ...base, nextCleaning: { status: 'none-needed', methodsBasis: '' } }, '2026-12-02', 'USD')).toMatch(
      /no cleaning pays for itself in the coming year\.$/,
    );
    expect(healthSentence({ ...base, nextCleaning: null }, '2026-12-02', 'USD')).toMatch(/there is no cleaning plan yet\.$/);
  });

  it('says an outage method is done in an outage, and a clean condenser is at its reference', () => {
    const outage = { ...base, cleanliness: 0.86, nextCleaning: { ...base.nextCleaning!, plan: [{ ...plannedStep, unitDuringCleaning: 'outage' as const }] } };
    const text = healthSentence(outage, '2026-12-02', 'USD');
    expect(text).toContain('at or above the 85 % reference');
    expect(text).toContain('clean in an outage (Brush sweep) by 20 Dec 2026');
  });
});
