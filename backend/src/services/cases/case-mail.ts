/**
 * Mail about a case's decision, added to the outbox inside the status change's transaction (a refused or failed
 * change sends nothing): on submit to every approver and administrator who sees the unit, on a decision to the author.
 */
import type { EntityManager } from 'typeorm';
import { Membership } from '../../entities/membership.entity.js';
import { User } from '../../entities/user.entity.js';
import { enqueueMail } from '../../mail/outbox.js';
import { caseDecidedMail, caseSubmittedMail } from '../../mail/templates.js';
import type { CaseInScope } from './case-access.js';

/** As the tenant scope decides (policies/tenant-scope.ts): no limit sees all; a limit sees only plants in its groups. */
const seesUnit = (limit: string[] | null, plantGroup: string | null) => limit === null || (plantGroup !== null && limit.includes(plantGroup));

const caseLink = (baseUrl: string, id: string) => `${baseUrl}/cases/${id}`;

export async function mailDeciders(em: EntityManager, found: CaseInScope, submitter: { id: string; name: string }, baseUrl: string): Promise<void> {
  const members = await em.getRepository(Membership).find({ where: { organisationId: found.record.organisationId } });
  const deciders = members.filter(
    (m) =>
      (m.role === 'approver' || m.role === 'admin') &&
      m.userId !== submitter.id &&
      m.userId !== found.record.authorId &&
      seesUnit(m.clientGroupIds ?? null, found.plant.clientGroupId),
  );
  for (const m of deciders) {
    const user = await em.getRepository(User).findOneBy({ id: m.userId });
    if (!user) continue;
    await enqueueMail(
      em,
      caseSubmittedMail({
        to: user.email,
        caseTitle: found.record.title,
        unitName: found.unit.name,
        plantName: found.plant.name,
        submitterName: submitter.name,
        link: caseLink(baseUrl, found.record.id),
      }),
    );
  }
}

export async function mailAuthor(
  em: EntityManager,
  found: CaseInScope,
  decision: 'approved' | 'returned',
  deciderName: string,
  baseUrl: string,
): Promise<void> {
  const author = await em.getRepository(User).findOneBy({ id: found.record.authorId });
  if (!author) return;
  await enqueueMail(
    em,
    caseDecidedMail({
      to: author.email,
      caseTitle: found.record.title,
      decision,
      deciderName,
      reason: found.record.returnReason,
      link: caseLink(baseUrl, found.record.id),
    }),
  );
}
