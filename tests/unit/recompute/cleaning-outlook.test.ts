/**
 * The cleaning outlook stored with a unit's analysis: a plan never starts in the past however old the data,
 * it lists every cleaning it proposes, and it answers the same question with methods used while the unit runs
 * and with outage methods, so a person sees both kinds side by side.
 */
import { describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { TYPICAL_CLEANING_METHODS } from '@shared/schemas/cleaning-method.js';
import { cleaningOutlook as outlookSchema } from '@shared/schemas/unit-analysis.js';
import { cleaningOutlook, type OutlookInput } from '@backend/services/derived/cleaning-outlook.js';
import { MODEL, SETUP } from '../monitoring/monitoring-fixture.js';

const LAST_DAY = '2026-01-01';
/** A year of made-up history ending on LAST_DAY: a seasonal CW inlet and a steady load. */
const history = Array.from({ length: 365 }, (_, i) => {
  const date = addDays(LAST_DAY, i - 364);
  return { date, cwInletC: 18 + 6 * Math.sin((2 * Math.PI * i) / 365), loadFraction: 0.85 };
});
const base: OutlookInput = {
  model: MODEL,
  setup: SETUP,
  lastDay: LAST_DAY,
  today: addDays(LAST_DAY, 1),
  // a fast linear fouling trend since a cleaning 120 days before the data ended
  cycle: { startDay: addDays(LAST_DAY, -120), model: { model: 'linear', ratePerDay: 0.0015 }, cleanlinessAfterCleaning: 0.9 },
  history,
  plannedOutages: [],
  methods: TYPICAL_CLEANING_METHODS,
};

describe('the cleaning outlook', () => {
  it('plans from the day after the data when the data is current', () => {
    const o = cleaningOutlook(base);
    expect(o.planFrom).toBe(addDays(LAST_DAY, 1));
    expect(o.dataTo).toBe(LAST_DAY);
    expect(outlookSchema.safeParse(o).success).toBe(true);
  });

  it('plans from the plant’s today when the data ended long ago, so no proposed date has passed', () => {
    const today = '2026-12-02';
    const o = cleaningOutlook({ ...base, today });
    expect(o.planFrom).toBe(today);
    expect(o.dataTo).toBe(LAST_DAY);
    expect(o.status).toBe('planned');
    expect(o.next!.date >= today).toBe(true);
    for (const c of o.plan!) expect(c.date >= today).toBe(true);
  });

  it('lists every cleaning of the plan with its dates, the first being the next cleaning', () => {
    const o = cleaningOutlook(base);
    expect(o.status).toBe('planned');
    expect(o.plan).toHaveLength(o.cleaningsInHorizon!);
    expect(o.plan![0]).toMatchObject({ date: o.next!.date, endDate: o.next!.endDate, methodId: o.next!.methodId });
    const dates = o.plan!.map((c) => c.date);
    expect([...dates].sort()).toEqual(dates);
  });

  it('answers with methods used while the unit runs and with outage methods, each plan using only its kind', () => {
    const o = cleaningOutlook(base);
    const byKind = Object.fromEntries(o.options!.map((x) => [x.kind, x]));
    expect(Object.keys(byKind).sort()).toEqual(['in-an-outage', 'while-running']);
    const kindOf = (id: string) => TYPICAL_CLEANING_METHODS.find((m) => m.id === id)!.unitDuringCleaning;
    const running = byKind['while-running']!;
    const outage = byKind['in-an-outage']!;
    if (running.first) expect(kindOf(running.first.methodId)).not.toBe('outage');
    if (outage.first) expect(kindOf(outage.first.methodId)).toBe('outage');
    // Each restricted plan can do no better than the plan free to choose any method.
    expect(running.savingsVersusNoCleaning).toBeLessThanOrEqual(o.savingsVersusNoCleaning! + 0.01);
    expect(outage.savingsVersusNoCleaning).toBeLessThanOrEqual(o.savingsVersusNoCleaning! + 0.01);
  });

  it('says a kind has no method when the library holds none of it', () => {
    const onlyOutage = TYPICAL_CLEANING_METHODS.filter((m) => m.unitDuringCleaning === 'outage');
    const o = cleaningOutlook({ ...base, methods: onlyOutage });
    expect(o.options!.find((x) => x.kind === 'while-running')).toMatchObject({ status: 'no-method', cleaningsInHorizon: 0 });
  });
});
