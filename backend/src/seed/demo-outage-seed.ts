/**
 * The demo outage on Harrow Creek Station, made by the same services a person uses: a draft autumn outage of Unit 1
 * (and Unit 2 when seeded) holding the approved case's cleaning and three pieces of work typed in by hand in two crew
 * lanes, with the optimiser's proposal, so the outage screens open on something. Every figure is invented for the
 * demo. Skipped when the seed left Unit 1 out or its case could not be built.
 */
import type { DataSource } from 'typeorm';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { CleaningCase } from '../entities/cleaning-case.entity.js';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { Plant } from '../entities/plant.entity.js';
import { User } from '../entities/user.entity.js';
import { AppError } from '../http/app-error.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { addItem } from '../services/outages/add-item.js';
import { createOutage } from '../services/outages/create-outage.js';
import { optimiseOutage } from '../services/outages/optimise-outage.js';

async function scopeOf(ds: DataSource, organisationId: string, email: string): Promise<TenantScope | null> {
  const user = await ds.getRepository(User).findOneBy({ email });
  const m = user && (await ds.getRepository(Membership).findOneBy({ organisationId, userId: user.id }));
  return m ? { organisationId, userId: m.userId, role: m.role, clientGroupIds: m.clientGroupIds ?? null } : null;
}

export async function seedDemoOutage(ds: DataSource, log: (line: string) => void): Promise<void> {
  const organisation = await ds.getRepository(Organisation).findOneBy({ name: 'Northmere Power Cooperative' });
  const plant = organisation && (await ds.getRepository(Plant).findOneBy({ organisationId: organisation.id, name: 'Harrow Creek Station' }));
  if (!organisation || !plant) return;
  const approver = await scopeOf(ds, organisation.id, 'approver@northmere.example');
  const units = await ds.getRepository(GeneratingUnit).find({ where: { plantId: plant.id }, order: { name: 'ASC' } });
  const unitOne = units.find((u) => u.name === 'Unit 1');
  if (!approver || !unitOne) return;
  const approved = await ds.getRepository(CleaningCase).findOneBy({ unitId: unitOne.id, status: 'approved' });
  const first = approved?.results.cleanings[0];
  if (!approved || !first) {
    log('No demo outage: Harrow Creek Unit 1 has no approved case with a cleaning');
    return;
  }
  try {
    // the window opens on the day the approved case plans its first cleaning and runs three weeks
    const outage = await createOutage(ds, approver, {
      name: 'Harrow Creek autumn outage (demo)',
      unitIds: units.map((u) => u.id),
      startDate: first.date,
      endDate: addDays(first.date, 20),
      budget: 160_000,
    });
    const work = [
      { unitId: unitOne.id, kind: 'case-cleaning' as const, caseId: approved.id, lane: 'Waterbox crew' },
      {
        unitId: unitOne.id,
        kind: 'tube-plugging' as const,
        title: 'Plug the tubes the last inspection flagged',
        cost: 18_000,
        durationDays: 2,
        lane: 'Waterbox crew',
        benefit: 35_000,
      },
      {
        unitId: unitOne.id,
        kind: 'air-in-leakage-repair' as const,
        title: 'Replace the exhaust-hood expansion joint',
        cost: 42_000,
        durationDays: 6,
        lane: 'Vacuum crew',
        benefit: { cleanlinessRecovered: 0.02, horizonDays: 365 },
      },
      {
        unitId: unitOne.id,
        kind: 'eddy-current-inspection' as const,
        title: 'Eddy-current survey of one tube in ten',
        cost: 24_000,
        durationDays: 4,
        lane: 'Waterbox crew',
        benefit: 12_000,
      },
    ];
    for (const item of work) await addItem(ds, approver, outage.id, item);
    await optimiseOutage(ds, approver, outage.id);
    log('Demo outage on Harrow Creek: a draft with the approved case’s cleaning and three other items');
  } catch (err) {
    if (!(err instanceof AppError)) throw err;
    log(`No demo outage on Harrow Creek: ${err.message}`);
  }
}
