import { describe, expect, it } from 'vitest';
import { runScheduleCommand } from '@shared/domain/decision/schedule/schedule-command.js';
import { calcScheduleInput } from '@shared/schemas/calc-schedule.js';
import { CAUTION_TEXT, cautionsFor, GENERAL_CAUTION, TYPICAL_CLEANING_METHODS, type CleaningMethod } from '@shared/schemas/cleaning-method.js';

const lancing = TYPICAL_CLEANING_METHODS.find((m) => m.id === 'hp-water-lancing')!;
const stripped = (m: CleaningMethod, over: Partial<CleaningMethod> = {}): CleaningMethod => ({ ...m, cautions: [], ...over });

describe('a method always carries the cautions its kind needs, whatever its list says', () => {
  it('an outage method with its cautions removed still carries confined-space entry and lock-out/tag-out, after the general caution', () => {
    const texts = cautionsFor(stripped(lancing));
    expect(texts[0]).toBe(GENERAL_CAUTION);
    expect(texts).toContain(CAUTION_TEXT['confined-space']);
    expect(texts).toContain(CAUTION_TEXT['lockout-tagout']);
  });

  it('a method named for chemicals or acid carries chemical handling; one named for jetting or lancing carries water jetting', () => {
    expect(cautionsFor(stripped(lancing, { name: 'Citric acid soak' }))).toContain(CAUTION_TEXT.chemical);
    expect(cautionsFor(stripped(lancing, { name: 'Chemical clean', unitDuringCleaning: 'online' }))).toContain(CAUTION_TEXT.chemical);
    expect(cautionsFor(stripped(lancing))).toContain(CAUTION_TEXT['water-jetting']);
  });

  it('a derate method keeps the on-line isolation caution; an on-line method keeps at least the general one', () => {
    expect(cautionsFor(stripped(lancing, { name: 'Half brushing', unitDuringCleaning: 'derate', deratePct: 50 }))).toContain(CAUTION_TEXT['online-isolation']);
    expect(cautionsFor(stripped(lancing, { id: 'sponge-balls', name: 'Sponge balls', unitDuringCleaning: 'online' }))).toEqual([GENERAL_CAUTION]);
  });

  it('each caution appears once when the list already names it', () => {
    const texts = cautionsFor(lancing);
    expect(new Set(texts).size).toBe(texts.length);
  });

  it('a case whose method lost its cautions still schedules it with them', () => {
    const out = runScheduleCommand(
      calcScheduleInput.parse({
        startDate: '2027-01-01',
        horizonDays: 120,
        drivers: { cwInletC: 20, loadFraction: 0.85, fuelPricePerMmbtu: 3.5, replacementPricePerMwh: 60 },
        unit: { ratingMw: 300, heatRateBtuKwh: 9500, activeTubes: 18_000 },
        directPenalty: {
          points: [
            { cleanliness: 0.5, costPerDay: 60_000 },
            { cleanliness: 0.92, costPerDay: 0 },
          ],
        },
        fouling: { model: 'linear', ratePerDay: 0.01 },
        initial: { daysSinceCleaning: 60, cleanlinessAfterCleaning: 0.9 },
        methods: [stripped(lancing)],
        discountRate: 0.08,
        includeDaily: false,
      }),
    );
    expect(out.cleanings.length).toBeGreaterThan(0);
    expect(out.cleanings[0]!.cautions).toContain(CAUTION_TEXT['confined-space']);
    expect(out.cleanings[0]!.cautions).toContain(CAUTION_TEXT['lockout-tagout']);
  });
});
