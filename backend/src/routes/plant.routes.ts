import type { DataSource } from 'typeorm';
import { plantInput, unitInput } from '@shared/schemas/unit-setup.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { createPlant, createUnit, deletePlant, getPlant, listPlants, unitSummary, updatePlant } from '../services/plant.service.js';
import { plantsResponse, plantView, unitSummary as unitSummarySchema } from '@shared/schemas/plant.js';

export function plantRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/plants',
      response: plantsResponse,
      access: 'data.read',
      tenantScoped: true,
      description: 'Plants you may see, with their units',
      handler: async (req, res) => res.json({ plants: await listPlants(ds, scopeOf(req.actor)) }),
    },
    {
      method: 'post',
      path: '/api/plants',
      response: plantView,
      status: 201,
      access: 'data.write',
      tenantScoped: true,
      body: plantInput,
      description: 'Create a plant (name, IANA time zone, optional client group)',
      handler: async (req, res) => res.status(201).json(await createPlant(ds, scopeOf(req.actor), req.body)),
    },
    {
      method: 'get',
      path: '/api/plants/:id',
      response: plantView,
      access: 'data.read',
      tenantScoped: true,
      description: 'One plant with its units',
      handler: async (req, res) => res.json(await getPlant(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'put',
      path: '/api/plants/:id',
      response: plantView,
      access: 'data.write',
      tenantScoped: true,
      body: plantInput,
      description: 'Change a plant',
      handler: async (req, res) => res.json(await updatePlant(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'delete',
      path: '/api/plants/:id',
      response: 'empty',
      access: 'data.write',
      tenantScoped: true,
      description: 'Delete a plant with its units and data',
      handler: async (req, res) => {
        await deletePlant(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/api/plants/:id/units',
      response: unitSummarySchema,
      status: 201,
      access: 'data.write',
      tenantScoped: true,
      body: unitInput,
      description: 'Add a generating unit to a plant',
      handler: async (req, res) => res.status(201).json(unitSummary(await createUnit(ds, scopeOf(req.actor), idParam(req), req.body))),
    },
  ];
}
