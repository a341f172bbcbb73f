import type { Response } from 'express';
import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { exportQuery, healthQuery, samplesQuery, samplesResponse, unitHealthResponse, type HealthQuery } from '@shared/schemas/health.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { exportUnitData } from '../services/export.service.js';
import { unitHealth, unitSamples } from '../services/health.service.js';

/** The JSON text of each cached view, made once per view (the cache hands back the same object while it holds). */
const serialised = new WeakMap<object, string>();
function sendView(res: Response, view: object): void {
  let text = serialised.get(view);
  if (text === undefined) {
    text = JSON.stringify(view);
    serialised.set(view, text);
  }
  res.type('application/json').send(text);
}

export function unitHealthRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/units/:id/health',
      response: unitHealthResponse,
      access: 'data.read',
      tenantScoped: true,
      query: healthQuery,
      description:
        'Condenser health over a period: headline figures, daily series, trend and forecast, deviation breakdown, events, air in-leakage, data quality',
      handler: async (req, res) => sendView(res, await unitHealth(ds, scopeOf(req.actor), idParam(req), req.validQuery as HealthQuery)),
    },
    {
      method: 'get',
      path: '/api/units/:id/samples',
      response: samplesResponse,
      access: 'data.read',
      tenantScoped: true,
      query: samplesQuery,
      description: 'Hourly points of one quantity over plant-local days, downsampled (LTTB) to at most 2,000',
      handler: async (req, res) => sendView(res, await unitSamples(ds, scopeOf(req.actor), idParam(req), req.validQuery as z.infer<typeof samplesQuery>)),
    },
    {
      method: 'get',
      path: '/api/units/:id/export',
      response: { file: ['text/csv', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet'] },
      access: 'data.read',
      tenantScoped: true,
      query: exportQuery,
      description: 'Download the daily figures or the deviation breakdown as CSV or XLSX',
      handler: async (req, res) => {
        const file = await exportUnitData(ds, scopeOf(req.actor), idParam(req), req.validQuery as z.infer<typeof exportQuery>);
        res.setHeader('content-type', file.contentType);
        res.setHeader('content-disposition', `attachment; filename="${file.fileName}"`);
        res.send(file.body);
      },
    },
  ];
}
