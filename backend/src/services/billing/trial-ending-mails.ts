/** Once per trial, a few days before it ends, each administrator of an organisation without a plan is told. */
import { Between, IsNull } from 'typeorm';
import type { DataSource } from 'typeorm';
import { TRIAL_BANNER_DAYS } from '@shared/billing-access.js';
import { formatDayOfMoment } from '@shared/text/display-format.js';
import type { Config } from '../../config.js';
import { Organisation } from '../../entities/organisation.entity.js';
import { baseUrl } from '../../http/base-url.js';
import { createOutboxMailer } from '../../mail/mailer.js';
import { trialEndingMail } from '../../mail/templates.js';
import { adminAddresses } from './billing-view.js';
import { lockOrganisation } from './organisation-billing.js';

export async function sendTrialEndingMails(ds: DataSource, config: Config, now = new Date()): Promise<number> {
  const soon = new Date(now.getTime() + TRIAL_BANNER_DAYS * 86_400_000);
  const due = await ds.getRepository(Organisation).find({
    where: { subscriptionStatus: 'trialing', stripeSubscriptionId: IsNull(), trialEndingMailAt: IsNull(), trialEndsAt: Between(now, soon) },
    select: { id: true },
  });
  let sent = 0;
  for (const { id } of due) {
    await ds.transaction(async (em) => {
      const org = await lockOrganisation(em, id);
      if (org.trialEndingMailAt || org.stripeSubscriptionId || !org.trialEndsAt || org.trialEndsAt <= now || org.trialEndsAt > soon) return;
      const mailer = createOutboxMailer(em);
      for (const admin of await adminAddresses(em, id)) {
        await mailer.send(
          trialEndingMail({
            to: admin.email,
            organisationName: org.name,
            endsOn: formatDayOfMoment(org.trialEndsAt, 'UTC'),
            link: `${baseUrl(config)}/settings/billing`,
          }),
        );
      }
      await em.getRepository(Organisation).update({ id }, { trialEndingMailAt: now });
      sent += 1;
    });
  }
  return sent;
}
