import type { DataSource } from 'typeorm';
import type { ZodType } from 'zod';
import { dailyQuery, unitEventInput, unitEventsResponse, unitEventView } from '@shared/schemas/unit-event.js';
import { condenserSetup, economicsSetup, turbineSetup, unitInput } from '@shared/schemas/unit-setup.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { dailyFigures } from '../services/daily-figures.service.js';
import { deleteUnit, renameUnit, unitSummary } from '../services/plant.service.js';
import { addEvent, deleteEvent, listEvents, updateEvent } from '../services/unit-event.service.js';
import { saveSetupPart, unitDetail, type SetupPart } from '../services/unit-setup.service.js';
import { unitDetail as unitDetailSchema, unitSummary as unitSummarySchema } from '@shared/schemas/plant.js';
import { dailyFiguresResponse } from '@shared/schemas/health.js';

const SETUP_PARTS: [SetupPart, ZodType, string][] = [
  ['condenser', condenserSetup, 'Save the condenser: geometry (HEI outside surface), design point, plugged tubes'],
  ['turbine', turbineSetup, 'Save the turbine: rating, heat rate, heat-balance duty, exhaust-pressure correction curves'],
  ['economics', economicsSetup, 'Save the economics: fuel and its CO2 factor, prices, capacity-limited share, discount rate'],
];

export function unitRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/units/:id',
      response: unitDetailSchema,
      access: 'data.read',
      tenantScoped: true,
      description: 'A unit with its setup, data span and recent background work',
      handler: async (req, res) => res.json(await unitDetail(ds, scopeOf(req.actor), idParam(req))),
    },
    {
      method: 'patch',
      path: '/api/units/:id',
      response: unitSummarySchema,
      access: 'data.write',
      tenantScoped: true,
      body: unitInput,
      description: 'Rename a unit',
      handler: async (req, res) => res.json(unitSummary(await renameUnit(ds, scopeOf(req.actor), idParam(req), req.body))),
    },
    {
      method: 'delete',
      path: '/api/units/:id',
      response: 'empty',
      access: 'data.write',
      tenantScoped: true,
      description: 'Delete a unit with all its data',
      handler: async (req, res) => {
        await deleteUnit(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
    ...SETUP_PARTS.map(([part, schema, description]): RouteSpec => ({
      method: 'put',
      path: `/api/units/:id/${part}`,
      access: 'data.write',
      tenantScoped: true,
      body: schema,
      response: unitDetailSchema,
      description,
      handler: async (req, res) => res.json(await saveSetupPart(ds, scopeOf(req.actor), idParam(req), part, req.body)),
    })),
    {
      method: 'get',
      path: '/api/units/:id/daily',
      response: dailyFiguresResponse,
      access: 'data.read',
      tenantScoped: true,
      query: dailyQuery,
      description: 'Daily figures in plant-local days: cleanliness, TTD, backpressures, deviation parts, costs, points used and dropped',
      handler: async (req, res) => res.json(await dailyFigures(ds, scopeOf(req.actor), idParam(req), req.validQuery as { from?: string; to?: string })),
    },
    {
      method: 'get',
      path: '/api/units/:id/events',
      response: unitEventsResponse,
      access: 'data.read',
      tenantScoped: true,
      description: 'The unit’s timeline: cleanings, plugging, air in-leakage repairs, outages',
      handler: async (req, res) => res.json({ events: await listEvents(ds, scopeOf(req.actor), idParam(req)) }),
    },
    {
      method: 'post',
      path: '/api/units/:id/events',
      response: unitEventView,
      status: 201,
      access: 'data.write',
      tenantScoped: true,
      body: unitEventInput,
      description: 'Record an event; cleanings and plugging recompute the derived data',
      handler: async (req, res) => res.status(201).json(await addEvent(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'put',
      path: '/api/events/:id',
      response: unitEventView,
      access: 'data.write',
      tenantScoped: true,
      body: unitEventInput,
      description: 'Change an event',
      handler: async (req, res) => res.json(await updateEvent(ds, scopeOf(req.actor), idParam(req), req.body)),
    },
    {
      method: 'delete',
      path: '/api/events/:id',
      response: 'empty',
      access: 'data.write',
      tenantScoped: true,
      description: 'Delete an event',
      handler: async (req, res) => {
        await deleteEvent(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
  ];
}
