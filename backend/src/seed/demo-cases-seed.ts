/**
 * Demo cleaning cases on the Northmere units, built by the same services a person uses: one approved case on
 * Harrow Creek Unit 1 and one waiting for a decision on Unit 2. Skipped for a unit the seed left out.
 */
import type { DataSource } from 'typeorm';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { Plant } from '../entities/plant.entity.js';
import { User } from '../entities/user.entity.js';
import { AppError } from '../http/app-error.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { changeCaseStatus } from '../services/cases/case-transitions.js';
import { addComment } from '../services/cases/case-comments.js';
import { createCase } from '../services/cases/create-case.js';

const DEMO_CASES = [
  {
    unit: 'Unit 1',
    title: 'Unit 1: condenser cleaning plan for the next two years',
    decision: 'approve' as const,
    comment: 'Crew availability confirmed for the autumn outage (demo).',
  },
  { unit: 'Unit 2', title: 'Unit 2: clean at the next outage or wait?', decision: null, comment: null },
];

async function scopeOf(ds: DataSource, organisationId: string, email: string): Promise<TenantScope | null> {
  const user = await ds.getRepository(User).findOneBy({ email });
  const m = user && (await ds.getRepository(Membership).findOneBy({ organisationId, userId: user.id }));
  return m ? { organisationId, userId: m.userId, role: m.role, clientGroupIds: m.clientGroupIds ?? null } : null;
}

export async function seedDemoCases(ds: DataSource, log: (line: string) => void): Promise<void> {
  const organisation = await ds.getRepository(Organisation).findOneBy({ name: 'Northmere Power Cooperative' });
  const plant = organisation && (await ds.getRepository(Plant).findOneBy({ organisationId: organisation.id, name: 'Harrow Creek Station' }));
  if (!organisation || !plant) return;
  const analyst = await scopeOf(ds, organisation.id, 'analyst@northmere.example');
  const approver = await scopeOf(ds, organisation.id, 'approver@northmere.example');
  if (!analyst || !approver) return;
  for (const demo of DEMO_CASES) {
    const unit = await ds.getRepository(GeneratingUnit).findOneBy({ plantId: plant.id, name: demo.unit });
    if (!unit) continue;
    try {
      const built = await createCase(ds, analyst, unit.id, { title: demo.title });
      await changeCaseStatus(ds, analyst, built.id, 'submit', { baseUrl: null });
      if (demo.comment) await addComment(ds, approver, built.id, { text: demo.comment });
      if (demo.decision) await changeCaseStatus(ds, approver, built.id, demo.decision, { baseUrl: null });
      log(`Demo cleaning case on Harrow Creek ${demo.unit}: ${demo.decision ? 'approved' : 'submitted'}`);
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      log(`No demo cleaning case on Harrow Creek ${demo.unit}: ${err.message}`);
    }
  }
}
