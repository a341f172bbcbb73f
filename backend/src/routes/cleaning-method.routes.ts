import type { DataSource } from 'typeorm';
import { cleaningMethodSchema, cleaningMethodsResponse, cleaningMethodView } from '@shared/schemas/cleaning-method.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { createMethod, deleteMethod, listMethods, updateMethod } from '../services/cleaning-method.service.js';

export function cleaningMethodRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/cleaning-methods',
      response: cleaningMethodsResponse,
      access: 'data.read',
      tenantScoped: true,
      description: 'The organisation’s cleaning-method library, each with its safety cautions',
      handler: async (req, res) => res.json({ methods: await listMethods(ds, scopeOf(req.actor)) }),
    },
    {
      method: 'post',
      path: '/api/cleaning-methods',
      response: cleaningMethodView,
      status: 201,
      access: 'data.write',
      tenantScoped: true,
      body: cleaningMethodSchema,
      description: 'Add a cleaning method',
      handler: async (req, res) => res.status(201).json(await createMethod(ds, scopeOf(req.actor), req.body)),
    },
    {
      method: 'put',
      path: '/api/cleaning-methods/:id',
      response: cleaningMethodView,
      access: 'data.write',
      tenantScoped: true,
      body: cleaningMethodSchema,
      description: 'Change a cleaning method (costs, duration, recovered cleanliness, cautions)',
      handler: async (req, res) => res.json(await updateMethod(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'delete',
      path: '/api/cleaning-methods/:id',
      response: 'empty',
      access: 'data.write',
      tenantScoped: true,
      description: 'Remove a cleaning method from the library',
      handler: async (req, res) => {
        await deleteMethod(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
  ];
}
