import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { auditEventsResponse, auditQuery } from '@shared/schemas/accounts.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { listAuditEvents } from '../services/audit-log.service.js';

export function auditRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/audit-events',
      response: auditEventsResponse,
      access: 'audit.read',
      tenantScoped: true,
      query: auditQuery,
      description: 'Who changed what, newest first; filter by action prefix, person, record type and dates (members without a client-group limit)',
      handler: async (req, res) => res.json({ events: await listAuditEvents(ds, scopeOf(req.actor), req.validQuery as z.infer<typeof auditQuery>) }),
    },
  ];
}
