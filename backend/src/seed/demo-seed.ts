import type { DataSource } from 'typeorm';
import { hashPassword } from '../auth/password.js';
import { ClientGroup } from '../entities/client-group.entity.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { User } from '../entities/user.entity.js';
import { DEMO_ORGANISATIONS, DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people.js';
import { seedDemoUnits, type DemoDay } from './demo-units-seed.js';
import { seedDemoCases } from './demo-cases-seed.js';
import { seedDemoOutage } from './demo-outage-seed.js';
import { seedTypicalMethods } from '../services/cleaning-method.service.js';
import { DEMO_TRIAL } from './demo-billing-seed.js';

export interface DemoSignIn {
  email: string;
  name: string;
  password: string;
  roles: string;
}

export function demoSignIns(): DemoSignIn[] {
  const orgName = (key: string) => DEMO_ORGANISATIONS.find((o) => o.key === key)?.name ?? key;
  const people = DEMO_PEOPLE.map((p) => ({
    email: p.email,
    name: p.name,
    password: DEMO_PASSWORD,
    roles: p.memberships.map((m) => `${m.role} at ${orgName(m.organisation)}${m.clientGroups ? ` (only ${m.clientGroups.join(', ')})` : ''}`).join('; '),
  }));
  const trial = { ...DEMO_TRIAL.admin, password: DEMO_PASSWORD, roles: `admin at ${DEMO_TRIAL.organisation} (on a trial)` };
  return [...people, trial];
}

/**
 * Seeds the demo scenario when the database holds no organisation yet: people and organisations, and with
 * `withData` the demo plants, units and their imported history up to the day before `day` (each plant's
 * yesterday by default). Returns true when it seeded.
 */
export async function seedDemoIfEmpty(dataSource: DataSource, log: (line: string) => void = () => {}, withData = true, day: DemoDay = {}): Promise<boolean> {
  if ((await dataSource.getRepository(Organisation).count()) > 0) return false;
  log('Empty database: seeding the demo scenario');
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await dataSource.transaction(async (em) => {
    const orgIds = new Map<string, string>();
    const groupIds = new Map<string, string>();
    for (const o of DEMO_ORGANISATIONS) {
      const saved = await em.getRepository(Organisation).save({
        name: o.name,
        kind: o.kind,
        plan: o.kind === 'consultancy' ? 'consultancy' : 'trial',
        subscriptionStatus: o.kind === 'consultancy' ? 'active' : 'trialing',
        trialEndsAt: o.kind === 'consultancy' ? null : new Date(Date.now() + 30 * 86_400_000),
      });
      orgIds.set(o.key, saved.id);
      await seedTypicalMethods(em, saved.id);
      for (const name of o.clientGroups) {
        const group = await em.getRepository(ClientGroup).save({ organisationId: saved.id, name });
        groupIds.set(name, group.id);
      }
    }
    for (const person of DEMO_PEOPLE) {
      const user = await em.getRepository(User).save({ email: person.email, name: person.name, passwordHash, unitPreference: 'us', emailProvenAt: new Date() });
      for (const m of person.memberships) {
        const clientGroupIds = m.clientGroups ? m.clientGroups.map((g) => groupIds.get(g)!) : null;
        await em.getRepository(Membership).save({ organisationId: orgIds.get(m.organisation)!, userId: user.id, role: m.role, clientGroupIds });
      }
    }
  });
  if (withData) {
    await seedDemoUnits(dataSource, log, day);
    await seedDemoCases(dataSource, log);
    await seedDemoOutage(dataSource, log);
  }
  return true;
}
