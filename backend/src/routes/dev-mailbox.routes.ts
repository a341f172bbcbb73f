import type { DataSource } from 'typeorm';
import { User } from '../entities/user.entity.js';
import type { RouteSpec } from '../http/route-registry.js';
import { sinkMessagesFor } from '../mail/smtp-sink.js';
import { mailboxResponse } from '@shared/schemas/dev-mailbox.js';

/**
 * Mounted only while the local SMTP sink is in use (loopback, no SMTP_URL). Holding an account with an address
 * is not enough: the mailbox shows only mail received after the person proved the address is theirs (an
 * invitation or reset link followed, Google, the demo seed, or the confirmation link mailed after sign-up).
 */
export function devMailboxRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/dev/mailbox',
      response: mailboxResponse,
      access: 'signed-in',
      tenantScoped: false,
      description: 'Messages the local SMTP sink received for you since you confirmed your address (local runs only)',
      handler: async (req, res) => {
        const user = await ds.getRepository(User).findOneByOrFail({ id: req.actor!.user.id });
        const provenAt = user.emailProvenAt;
        res.json({ addressConfirmed: !!provenAt, messages: provenAt ? await sinkMessagesFor(ds, user.email, { since: provenAt }) : [] });
      },
    },
  ];
}
