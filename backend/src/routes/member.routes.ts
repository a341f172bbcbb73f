import type { DataSource } from 'typeorm';
import { membersResponse, memberUpdate } from '@shared/schemas/accounts.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { listMembers, removeMember, updateMember } from '../services/member.service.js';

export function memberRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/members',
      response: membersResponse,
      access: 'members.manage',
      tenantScoped: true,
      description: 'Members of the organisation with their roles and client-group limits',
      handler: async (req, res) => res.json({ members: await listMembers(ds, scopeOf(req.actor)) }),
    },
    {
      method: 'patch',
      path: '/api/members/:id',
      response: 'empty',
      access: 'members.manage',
      tenantScoped: true,
      allowsPrivilegedFields: true,
      body: memberUpdate,
      description: 'Change a member’s role or client-group limit',
      handler: async (req, res) => {
        await updateMember(ds, scopeOf(req.actor), idParam(req), req.body);
        res.status(204).end();
      },
    },
    {
      method: 'delete',
      path: '/api/members/:id',
      response: 'empty',
      access: 'members.manage',
      tenantScoped: true,
      description: 'Remove a member from the organisation (their account stays)',
      handler: async (req, res) => {
        await removeMember(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
  ];
}
