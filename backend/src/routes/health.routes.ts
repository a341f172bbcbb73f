import type { DataSource } from 'typeorm';
import type { RouteSpec } from '../http/route-registry.js';
import { serviceHealthResponse } from '@shared/schemas/service-health.js';

export function healthRoutes(dataSource: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/health',
      response: serviceHealthResponse,
      access: 'public',
      tenantScoped: false,
      description: 'Liveness and database connectivity',
      handler: async (_req, res) => {
        const started = Date.now();
        try {
          await dataSource.query('SELECT 1');
          res.json({ status: 'ok', database: { status: 'up', latencyMs: Date.now() - started } });
        } catch {
          res.status(503).json({ status: 'degraded', database: { status: 'down' } });
        }
      },
    },
  ];
}
