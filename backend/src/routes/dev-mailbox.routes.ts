import type { DataSource } from 'typeorm';
import type { RouteSpec } from '../http/route-registry.js';
import { sinkMessagesFor } from '../mail/smtp-sink.js';

/** Mounted only while the local SMTP sink is in use (loopback, no SMTP_URL). */
export function devMailboxRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/dev/mailbox',
      access: 'signed-in',
      tenantScoped: false,
      description: 'Messages the local SMTP sink received for you (local runs only)',
      handler: async (req, res) => {
        res.json({ messages: await sinkMessagesFor(ds, req.actor!.user.email) });
      },
    },
  ];
}
