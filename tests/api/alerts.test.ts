/**
 * E-mail alerts against a real MariaDB: one mail per person, unit and condition until it clears (and one more when
 * it comes back), two evaluations at once sending once, client-group limits held, viewers told nothing of
 * unapproved cases, the weekly digest once per ISO week, and the evaluation that ends each recompute.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import type { NotificationSettingsBody } from '@shared/schemas/notifications.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import type { Membership } from '../../backend/src/entities/membership.entity.js';
import type { Plant } from '../../backend/src/entities/plant.entity.js';
import type { User } from '../../backend/src/entities/user.entity.js';
import { evaluateAlerts } from '../../backend/src/services/alerts/evaluate-alerts.js';
import { saveNotificationSettings } from '../../backend/src/services/alerts/save-notification-settings.js';
import { sendWeeklyDigests } from '../../backend/src/services/alerts/weekly-digest.js';
import { addMember, createTenant, createUser, type TenantFixture } from '../factories/accounts.js';
import { createCaseRecord } from '../factories/cases.js';
import { createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

const ZONE = 'America/Chicago'; // the factories' plants
const today = () => plantDayOf(Date.now(), ZONE);
const BASE = 'https://cleancase.example.test';

/** The parts of a stored analysis the portfolio (and so the alerts) read, as the recompute writes them. */
function analysis(o: { asOf: string; airLeakDays?: number; nextCleaning?: string | null }): Record<string, unknown> {
  const next = o.nextCleaning ?? null;
  return {
    computedAt: new Date().toISOString(),
    setupVersion: 1,
    lastDay: o.asOf,
    cycles: [],
    airLeakPeriods: [],
    forecast: null,
    current: {
      asOf: o.asOf,
      cleanliness: 0.78,
      excessBackpressureKpa: 0.5,
      foulingCostPerDay: 1234,
      foulingCostSinceCleaning: 40_000,
      lastCleaningDate: '2025-01-10',
      airLeakSuspectedDaysInLastWeek: o.airLeakDays ?? 0,
    },
    outlook: next
      ? {
          status: 'planned',
          planFrom: addDays(o.asOf, 1),
          next: {
            date: next,
            endDate: next,
            methodId: 'hp-water-lancing',
            methodName: 'High-pressure water lancing',
            cleanlinessBefore: 0.78,
            cleanlinessAfter: 0.9,
            cleaningCost: 60_000,
            downtimeCost: 20_000,
            typicalValues: true,
          },
          plan: [{ date: next, endDate: next, methodId: 'hp-water-lancing', methodName: 'High-pressure water lancing', unitDuringCleaning: 'outage' }],
          savingsVersusNoCleaning: 250_000,
          methodsBasis: 'typical cleaning methods',
        }
      : { status: 'none-needed', reason: 'Within the coming year no cleaning pays for itself', methodsBasis: 'typical cleaning methods' },
  };
}

describe('e-mail alerts', () => {
  let t: TestApp;
  let tenant: TenantFixture;
  let plantOne: Plant;
  let plantTwo: Plant;

  const scopeOfMember = (user: User, m: Membership) => ({
    organisationId: m.organisationId,
    userId: user.id,
    role: m.role,
    clientGroupIds: m.clientGroupIds ?? null,
  });
  const subscribe = (user: User, m: Membership, body: Partial<NotificationSettingsBody>) =>
    saveNotificationSettings(t.dataSource, scopeOfMember(user, m), { weeklyDigest: false, allUnits: null, units: [], ...body });
  const setAnalysis = (unit: GeneratingUnit, a: Record<string, unknown>) =>
    t.dataSource.query('UPDATE generating_unit SET analysis = ? WHERE id = ?', [JSON.stringify(a), unit.id]);
  const evaluate = (now?: Date) => evaluateAlerts(t.dataSource, { organisationId: tenant.organisation.id, baseUrl: BASE, now });
  /** oldest first */
  const mailsTo = async (user: User) => (await t.mailTo(user.email)).sort((a, b) => a.receivedAt.localeCompare(b.receivedAt));

  beforeAll(async () => {
    t = await createTestApp();
    tenant = await createTenant(t.dataSource, 'alerts');
    plantOne = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    plantTwo = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[1].id);
  });
  afterAll(async () => {
    await t?.close();
  });

  it('data stopped: raised → one mail; evaluated again → none; cleared → none; raised again → one more', async () => {
    const unit = await createUnit(t.dataSource, plantOne);
    const user = await createUser(t.dataSource, 'dedup');
    const m = await addMember(t.dataSource, tenant.organisation.id, user, 'analyst');
    await subscribe(user, m, { units: [{ unitId: unit.id, kinds: ['data-stopped'], dataStoppedDays: 5 }] });

    await setAnalysis(unit, analysis({ asOf: addDays(today(), -9) }));
    await evaluate();
    let mails = await mailsTo(user);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toContain(unit.name);
    expect(mails[0]!.subject).toContain('data stopped');
    expect(mails[0]!.text).toContain('Data stopped arriving');
    expect(mails[0]!.text).toContain('9 days ago');
    expect(mails[0]!.text).toContain(`${BASE}/units/${unit.id}`);

    await evaluate();
    expect(await mailsTo(user)).toHaveLength(1);

    // Data arrives again: the alert closes without a mail.
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -1) }));
    const closing = await evaluate();
    expect(closing.cleared).toBeGreaterThanOrEqual(1);
    expect(await mailsTo(user)).toHaveLength(1);
    const [state] = await t.dataSource.query('SELECT clearedAt FROM alert_state WHERE unitId = ? AND membershipId = ?', [unit.id, m.id]);
    expect(state.clearedAt).not.toBeNull();

    // It stops again: one more mail.
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -7) }));
    await evaluate();
    await evaluate();
    mails = await mailsTo(user);
    expect(mails).toHaveLength(2);
    expect(mails[1]!.text).toContain('7 days ago');
  });

  it('the person’s own number of days decides "data stopped": 6 days without data raises it at 5 days, not at 10', async () => {
    const unit = await createUnit(t.dataSource, plantOne);
    const [quick, patient] = [await createUser(t.dataSource, 'quick'), await createUser(t.dataSource, 'patient')];
    await subscribe(quick, await addMember(t.dataSource, tenant.organisation.id, quick, 'analyst'), {
      units: [{ unitId: unit.id, kinds: ['data-stopped'], dataStoppedDays: 5 }],
    });
    await subscribe(patient, await addMember(t.dataSource, tenant.organisation.id, patient, 'analyst'), {
      units: [{ unitId: unit.id, kinds: ['data-stopped'], dataStoppedDays: 10 }],
    });
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -6) }));
    await evaluate();
    expect(await mailsTo(quick)).toHaveLength(1);
    expect(await mailsTo(patient)).toHaveLength(0);
  });

  it('two evaluations at once (and four) send each alert once', async () => {
    const unit = await createUnit(t.dataSource, plantOne);
    const user = await createUser(t.dataSource, 'race');
    const m = await addMember(t.dataSource, tenant.organisation.id, user, 'approver');
    await subscribe(user, m, { allUnits: { kinds: ['backpressure-unexplained', 'data-stopped'], dataStoppedDays: 3 } });
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -1), airLeakDays: 2 }));
    await Promise.all([evaluate(), evaluate()]);
    let mails = (await mailsTo(user)).filter((x) => x.subject.includes(unit.name));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toContain('2 of the last 7 days');

    await setAnalysis(unit, analysis({ asOf: addDays(today(), -1), airLeakDays: 0 }));
    await evaluate();
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -1), airLeakDays: 1 }));
    await Promise.all([evaluate(), evaluate(), evaluate(), evaluate()]);
    mails = (await mailsTo(user)).filter((x) => x.subject.includes(unit.name));
    expect(mails).toHaveLength(2);
    const [row] = await t.dataSource.query('SELECT COUNT(*) AS n FROM alert_state WHERE unitId = ? AND membershipId = ?', [unit.id, m.id]);
    expect(Number(row.n)).toBe(1);
  });

  it('cleaning now pays: the mail gives the figures and the cleaning caution', async () => {
    const unit = await createUnit(t.dataSource, plantOne);
    const user = await createUser(t.dataSource, 'pays');
    await subscribe(user, await addMember(t.dataSource, tenant.organisation.id, user, 'analyst'), {
      units: [{ unitId: unit.id, kinds: ['cleaning-now-pays'], dataStoppedDays: 3 }],
    });
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -1), nextCleaning: today() }));
    await evaluate();
    const [mail] = await mailsTo(user);
    expect(mail?.subject).toContain('cleaning now pays');
    expect(mail?.text).toContain('Cleanliness now: 78.0 % (reference 90.0 %)');
    expect(mail?.text).toMatch(/Fouling costs about \$1,234 a day/);
    expect(mail?.text).toContain('0.50 kPa (0.15 inHg)');
    expect(mail?.text).toContain('local codes, the equipment maker’s instructions and licensed practice');
  });

  it('a client-limited member never gets mail about a unit outside their groups; a viewer’s mail names no unapproved case', async () => {
    const inGroupOne = await createUnit(t.dataSource, plantOne);
    const inGroupTwo = await createUnit(t.dataSource, plantTwo);
    await createCaseRecord(t.dataSource, inGroupTwo, tenant.users.analyst.id, 'draft', 'Secret draft about tube leaks');
    const limited = await createUser(t.dataSource, 'limited');
    const m = await addMember(t.dataSource, tenant.organisation.id, limited, 'viewer', [tenant.groups[1].id]);
    await subscribe(limited, m, { weeklyDigest: true, allUnits: { kinds: ['data-stopped'], dataStoppedDays: 2 } });
    for (const u of [inGroupOne, inGroupTwo]) await setAnalysis(u, analysis({ asOf: addDays(today(), -12) }));

    // Even naming the other group's unit is refused (and nothing saved).
    await expect(subscribe(limited, m, { units: [{ unitId: inGroupOne.id, kinds: ['data-stopped'], dataStoppedDays: 2 }] })).rejects.toMatchObject({
      status: 404,
    });

    await evaluate();
    await sendWeeklyDigests(t.dataSource, { organisationId: tenant.organisation.id, baseUrl: BASE });
    const mails = await mailsTo(limited);
    expect(mails.length).toBeGreaterThanOrEqual(2);
    expect(mails.some((x) => x.subject.includes(inGroupTwo.name))).toBe(true);
    for (const mail of mails) {
      expect(mail.text).not.toContain(inGroupOne.name);
      expect(mail.subject).not.toContain(inGroupOne.name);
      expect(mail.text).not.toContain('Secret draft');
    }
    const [row] = await t.dataSource.query('SELECT COUNT(*) AS n FROM alert_state WHERE unitId = ? AND membershipId = ?', [inGroupOne.id, m.id]);
    expect(Number(row.n)).toBe(0);
  });

  it('the weekly digest goes once per ISO week per person, even from two processes at once', async () => {
    const unit = await createUnit(t.dataSource, plantOne);
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -1) }));
    const user = await createUser(t.dataSource, 'digest');
    await subscribe(user, await addMember(t.dataSource, tenant.organisation.id, user, 'admin'), { weeklyDigest: true });
    const monday = new Date('2026-11-30T08:00:00Z'); // ISO week 2026-W49
    const send = (now: Date) => sendWeeklyDigests(t.dataSource, { organisationId: tenant.organisation.id, baseUrl: BASE, now });
    await Promise.all([send(monday), send(monday)]);
    await send(new Date('2026-12-06T20:00:00Z')); // Sunday of the same week
    let mails = await mailsTo(user);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toContain('2026-W49');
    expect(mails[0]!.text).toContain(unit.name);
    expect(mails[0]!.text).toMatch(/Fouling cost a day: \$1,234/);
    await send(new Date('2026-12-07T08:00:00Z')); // the next Monday: 2026-W50
    mails = await mailsTo(user);
    expect(mails.map((x) => x.subject.slice(-8))).toEqual(['2026-W49', '2026-W50']);
  });

  it('someone who chose nothing gets nothing', async () => {
    const unit = await createUnit(t.dataSource, plantOne);
    await setAnalysis(unit, analysis({ asOf: addDays(today(), -20), airLeakDays: 3, nextCleaning: today() }));
    const user = await createUser(t.dataSource, 'quiet');
    await subscribe(user, await addMember(t.dataSource, tenant.organisation.id, user, 'analyst'), { weeklyDigest: false, allUnits: null, units: [] });
    await evaluate();
    await sendWeeklyDigests(t.dataSource, { organisationId: tenant.organisation.id, baseUrl: BASE });
    expect(await mailsTo(user)).toHaveLength(0);
  });
});
