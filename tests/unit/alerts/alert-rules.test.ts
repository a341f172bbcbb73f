/** The pure rules of e-mail alerts: whose choice applies to a unit, conditions with the person's days, ISO weeks, mail text. */
import { describe, expect, it } from 'vitest';
import type { PortfolioUnit } from '@shared/schemas/portfolio.js';
import { notificationSettingsBody } from '@shared/schemas/notifications.js';
import { alertMail } from '../../../backend/src/services/alerts/alert-mail.js';
import { choiceFor, conditionsFor, isoWeekOf, type StoredChoice } from '../../../backend/src/services/alerts/alert-rules.js';

const all: StoredChoice = { unitId: null, kinds: ['data-stopped', 'cleaning-now-pays'], dataStoppedDays: 3 };
const own: StoredChoice = { unitId: 'u1', kinds: ['backpressure-unexplained'], dataStoppedDays: 10 };

const unit = (o: Partial<PortfolioUnit> = {}): PortfolioUnit => ({
  unitId: 'u1',
  unitName: 'Unit 2',
  plantId: 'p1',
  plantName: 'Harbour Point',
  clientGroup: null,
  currency: 'USD',
  cleanliness: 0.8,
  referenceCleanliness: 0.9,
  excessBackpressureKpa: 0.4,
  foulingCostPerDay: 900,
  foulingCostSinceCleaning: 10_000,
  lastCleaningDate: null,
  nextCleaning: { date: '2026-12-01', methodName: 'Brush cleaning', unitDuringCleaning: 'outage', saving: 5000 },
  nextCleaningNote: null,
  openCases: [],
  nextOutage: null,
  dataThrough: '2026-11-25',
  dataAgeDays: 7,
  stale: true,
  alerts: [
    { kind: 'cleaning-now-pays', sentence: 'Cleaning now pays: the cleaning outlook puts the next cleaning (Brush cleaning) on 1 Dec 2026.' },
    { kind: 'data-stopped', sentence: 'Data stopped arriving: the last day with data is 25 Nov 2026, 7 days ago.' },
  ],
  note: null,
  ...o,
});

describe('alert rules', () => {
  it('a unit’s own choice replaces the person-wide one; without either nothing is chosen', () => {
    expect(choiceFor([all, own], 'u1')).toBe(own);
    expect(choiceFor([all, own], 'u2')).toBe(all);
    expect(choiceFor([own], 'u2')).toBeNull();
    // A person-wide row with no conditions (it only holds the digest choice) chooses nothing.
    expect(choiceFor([{ ...all, kinds: [] }], 'u2')).toBeNull();
  });

  it('"data stopped" follows the person’s days: 7 days without data is raised at 3 and at 6, not at 7 or 10', () => {
    const kindsAt = (days: number) => conditionsFor(unit(), { unitId: 'u1', kinds: ['data-stopped'], dataStoppedDays: days }).map((c) => c.kind);
    expect(kindsAt(3)).toEqual(['data-stopped']);
    expect(kindsAt(6)).toEqual(['data-stopped']);
    expect(kindsAt(7)).toEqual([]);
    expect(kindsAt(10)).toEqual([]);
    const [c] = conditionsFor(unit(), { unitId: 'u1', kinds: ['data-stopped'], dataStoppedDays: 6 });
    expect(c?.sentence).toContain('25 Nov 2026, 7 days ago');
  });

  it('only the chosen kinds, in a fixed order; a unit without data never has "data stopped"', () => {
    expect(conditionsFor(unit(), { unitId: 'u1', kinds: ['data-stopped', 'cleaning-now-pays'], dataStoppedDays: 3 }).map((c) => c.kind)).toEqual([
      'cleaning-now-pays',
      'data-stopped',
    ]);
    expect(conditionsFor(unit(), { unitId: 'u1', kinds: ['backpressure-unexplained'], dataStoppedDays: 3 })).toEqual([]);
    expect(conditionsFor(unit({ dataThrough: null, dataAgeDays: null, alerts: [] }), all)).toEqual([]);
    expect(conditionsFor(unit(), null)).toEqual([]);
  });

  it('ISO weeks: Monday starts a week; the days around new year belong to the week of their Thursday', () => {
    expect(isoWeekOf(new Date('2026-11-30T00:00:00Z'))).toBe('2026-W49'); // a Monday
    expect(isoWeekOf(new Date('2026-12-06T23:59:59Z'))).toBe('2026-W49'); // the Sunday after
    expect(isoWeekOf(new Date('2026-12-07T00:00:00Z'))).toBe('2026-W50');
    // Closed form per ISO 8601: 1 Jan 2027 is a Friday, so it belongs to 2026's last week (2026 has 53 weeks: it starts on a Thursday).
    expect(isoWeekOf(new Date('2027-01-01T12:00:00Z'))).toBe('2026-W53');
    expect(isoWeekOf(new Date('2027-01-04T12:00:00Z'))).toBe('2027-W01');
    // 29 Dec 2025 is a Monday whose Thursday is 1 Jan 2026: week 1 of 2026.
    expect(isoWeekOf(new Date('2025-12-29T12:00:00Z'))).toBe('2026-W01');
  });

  it('the alert mail names the unit, the condition, the figures, the link and, for cleaning, the caution', () => {
    const u = unit();
    const mail = alertMail({ to: 'a@example.test', unit: u, raised: [u.alerts[0]!], baseUrl: 'https://app.example.test/' });
    expect(mail.subject).toBe('Unit 2 at Harbour Point: cleaning now pays');
    expect(mail.text).toContain('Fouling costs about $900 a day');
    expect(mail.text).toContain('https://app.example.test/units/u1');
    expect(mail.text).toContain('local codes, the equipment maker’s instructions and licensed practice');
    const quiet = alertMail({ to: 'a@example.test', unit: u, raised: [u.alerts[1]!], baseUrl: 'https://app.example.test' });
    expect(quiet.text).not.toContain('licensed practice');
  });

  it('settings input is bounded: days 1 to 60, whole numbers, each condition and unit once, nothing unknown', () => {
    const ok = { weeklyDigest: true, allUnits: { kinds: ['data-stopped'], dataStoppedDays: 60 }, units: [] };
    expect(notificationSettingsBody.safeParse(ok).success).toBe(true);
    const problem = (body: unknown) => notificationSettingsBody.safeParse(body).error?.issues[0]?.message;
    expect(problem({ ...ok, allUnits: { kinds: ['data-stopped'], dataStoppedDays: 61 } })).toMatch(/between 1 and 60/);
    expect(problem({ ...ok, allUnits: { kinds: ['data-stopped'], dataStoppedDays: 0 } })).toMatch(/between 1 and 60/);
    expect(problem({ ...ok, allUnits: { kinds: ['data-stopped'], dataStoppedDays: 2.5 } })).toMatch(/whole number/);
    expect(problem({ ...ok, allUnits: { kinds: ['data-stopped', 'data-stopped'], dataStoppedDays: 3 } })).toMatch(/once/);
    expect(problem({ ...ok, allUnits: { kinds: ['coffee'], dataStoppedDays: 3 } })).toMatch(/Choose among/);
    const u = { unitId: '5cef41e0-f9c0-48ca-bf61-db10461b7559', kinds: [], dataStoppedDays: 3 };
    expect(problem({ ...ok, units: [u, u] })).toMatch(/Each unit once/);
    expect(notificationSettingsBody.safeParse({ ...ok, organisationId: 'x' }).success).toBe(false);
  });
});
