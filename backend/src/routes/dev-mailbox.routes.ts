import type { SmtpSink } from '../mail/smtp-sink.js';
import type { RouteSpec } from '../http/route-registry.js';

/** Mounted only while the local SMTP sink is in use. */
export function devMailboxRoutes(sink: SmtpSink): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/dev/mailbox',
      access: 'public',
      tenantScoped: false,
      description: 'Messages the app sent to the local SMTP sink (development only)',
      handler: (_req, res) => {
        res.json({ messages: sink.messages() });
      },
    },
  ];
}
