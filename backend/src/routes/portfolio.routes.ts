import type { DataSource } from 'typeorm';
import { portfolioResponse } from '@shared/schemas/portfolio.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { portfolioView } from '../services/portfolio/portfolio.service.js';

export function portfolioRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/portfolio',
      response: portfolioResponse,
      access: 'data.read',
      tenantScoped: true,
      description:
        'Every unit you may see with its figures now, next recommended cleaning, open cases, next outage, data age and current conditions, by client group with totals per currency',
      handler: async (req, res) => res.json(await portfolioView(ds, scopeOf(req.actor))),
    },
  ];
}
