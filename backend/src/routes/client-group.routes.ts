import type { DataSource } from 'typeorm';
import { clientGroupInput, clientGroupsResponse, clientGroupView } from '@shared/schemas/accounts.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { createGroup, deleteGroup, getGroup, listGroups, renameGroup } from '../services/client-group.service.js';

export function clientGroupRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/client-groups',
      response: clientGroupsResponse,
      access: 'data.read',
      tenantScoped: true,
      description: 'Client groups visible to you',
      handler: async (req, res) => res.json({ clientGroups: await listGroups(ds, scopeOf(req.actor)) }),
    },
    {
      method: 'get',
      path: '/api/client-groups/:id',
      response: clientGroupView,
      access: 'data.read',
      tenantScoped: true,
      description: 'One client group',
      handler: async (req, res) => res.json(await getGroup(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'post',
      path: '/api/client-groups',
      response: clientGroupView,
      status: 201,
      access: 'client-groups.manage',
      tenantScoped: true,
      body: clientGroupInput,
      description: 'Create a client group',
      handler: async (req, res) => res.status(201).json(await createGroup(ds, scopeOf(req.actor), req.body.name)),
    },
    {
      method: 'patch',
      path: '/api/client-groups/:id',
      response: clientGroupView,
      access: 'client-groups.manage',
      tenantScoped: true,
      body: clientGroupInput,
      description: 'Rename a client group',
      handler: async (req, res) => res.json(await renameGroup(ds, scopeOf(req.actor), idParam(req), req.body.name)),
    },
    {
      method: 'delete',
      path: '/api/client-groups/:id',
      response: 'empty',
      access: 'client-groups.manage',
      tenantScoped: true,
      description: 'Delete a client group (memberships limited to it lose that group)',
      handler: async (req, res) => {
        await deleteGroup(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
  ];
}
