/**
 * The weekly digest for each person who chose it: their units with conditions, fouling cost a day, next cleaning
 * and the alerts open to them. Once per ISO week per person, whatever number of processes send at once: only the
 * transaction whose conditional UPDATE moves the person's digestWeek to this week queues the mail (in that same
 * transaction).
 */
import type { DataSource } from 'typeorm';
import { AlertState } from '../../entities/alert-state.entity.js';
import { Organisation } from '../../entities/organisation.entity.js';
import { enqueueMail } from '../../mail/outbox.js';
import { CONDITION_EXPLAINED } from '@shared/schemas/notifications.js';
import { portfolioOf } from '../portfolio/portfolio.service.js';
import { digestMail, type DigestUnit } from './alert-mail.js';
import { isoWeekOf } from './alert-rules.js';
import { affectedRows, subscribersOf } from './alert-subscribers.js';

export async function sendWeeklyDigests(ds: DataSource, o: { organisationId: string; now?: Date; baseUrl: string }): Promise<number> {
  const now = o.now ?? new Date();
  const week = isoWeekOf(now);
  const organisation = await ds.getRepository(Organisation).findOneBy({ id: o.organisationId });
  if (!organisation) return 0;
  let sent = 0;
  for (const s of await subscribersOf(ds.manager, o.organisationId)) {
    const person = s.person;
    if (!person?.weeklyDigest || person.digestWeek === week) continue;
    const { units } = await portfolioOf(ds, s.scope, now);
    const weekAgo = new Date(now.getTime() - 7 * 86_400_000);
    const states = (await ds.getRepository(AlertState).findBy({ membershipId: s.membershipId })).filter(
      (st) => st.clearedAt === null || st.clearedAt >= weekAgo,
    );
    const digest: DigestUnit[] = units.map((unit) => ({
      unit,
      open: unit.alerts.filter((a) => states.some((st) => st.unitId === unit.unitId && st.kind === a.kind && st.clearedAt === null)),
      cleared: states.filter((st) => st.unitId === unit.unitId && st.clearedAt !== null).map((st) => CONDITION_EXPLAINED[st.kind].title.toLowerCase()),
    }));
    const queued = await ds.transaction('READ COMMITTED', async (em) => {
      const claimed = await em.query(
        `UPDATE alert_subscription SET digestWeek = ? WHERE id = ? AND weeklyDigest = 1 AND (digestWeek IS NULL OR digestWeek <> ?)`,
        [week, person.id, week],
      );
      if (affectedRows(claimed) !== 1) return false;
      await enqueueMail(em, digestMail({ to: s.email, organisationName: organisation.name, week, units: digest, baseUrl: o.baseUrl }));
      return true;
    });
    if (queued) sent += 1;
  }
  return sent;
}
