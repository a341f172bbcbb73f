import { describe, expect, it } from 'vitest';
import { CAUTION_TEXT, cautionsFor, cleaningMethodSchema, GENERAL_CAUTION, TYPICAL_CLEANING_METHODS } from '@shared/schemas/cleaning-method.js';

describe('cleaning method library', () => {
  it('every seed method passes the schema, is marked typical and says its numbers are typical values', () => {
    expect(TYPICAL_CLEANING_METHODS.length).toBeGreaterThanOrEqual(5);
    for (const m of TYPICAL_CLEANING_METHODS) {
      expect(cleaningMethodSchema.parse(m)).toEqual(m);
      expect(m.typical).toBe(true);
      expect(m.note).toMatch(/typical order of magnitude/);
    }
  });

  it('covers on-line, outage and derate methods', () => {
    const kinds = new Set(TYPICAL_CLEANING_METHODS.map((m) => m.unitDuringCleaning));
    expect([...kinds].sort()).toEqual(['derate', 'online', 'outage']);
  });

  it('every method’s cautions start with the general one, which defers to local codes, the maker and licensed practice', () => {
    expect(GENERAL_CAUTION).toMatch(/local codes/);
    expect(GENERAL_CAUTION).toMatch(/equipment maker/);
    expect(GENERAL_CAUTION).toMatch(/licensed engineering practice/);
    for (const m of TYPICAL_CLEANING_METHODS) expect(cautionsFor(m)[0]).toBe(GENERAL_CAUTION);
    const lancing = TYPICAL_CLEANING_METHODS.find((m) => m.id === 'hp-water-lancing')!;
    expect(cautionsFor(lancing)).toContain(CAUTION_TEXT['water-jetting']);
    expect(cautionsFor(lancing)).toContain(CAUTION_TEXT['confined-space']);
  });

  it('a derate method needs a derate, and only a derate method may have one', () => {
    const base = TYPICAL_CLEANING_METHODS.find((m) => m.unitDuringCleaning === 'derate')!;
    expect(cleaningMethodSchema.safeParse({ ...base, deratePct: 0 }).success).toBe(false);
    expect(cleaningMethodSchema.safeParse({ ...base, unitDuringCleaning: 'outage' }).success).toBe(false);
    expect(cleaningMethodSchema.safeParse({ ...base, extra: 1 }).success).toBe(false);
  });
});
