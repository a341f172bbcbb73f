import type { DataSource } from 'typeorm';
import { apiTokenCreate, apiTokensResponse, createdApiToken } from '@shared/schemas/accounts.js';
import { idParam } from '../http/params.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { createApiToken, listApiTokens, revokeApiToken } from '../services/api-token.service.js';

export function apiTokenRoutes(ds: DataSource): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/api-tokens',
      response: apiTokensResponse,
      access: 'calc.use',
      tenantScoped: true,
      description: 'Your personal API tokens in this organisation',
      handler: async (req, res) => res.json({ apiTokens: await listApiTokens(ds, scopeOf(req.actor)) }),
    },
    {
      method: 'post',
      path: '/api/api-tokens',
      response: createdApiToken,
      status: 201,
      access: 'calc.use',
      tenantScoped: true,
      body: apiTokenCreate,
      description: 'Create a personal API token (the secret is shown once)',
      handler: async (req, res) => res.status(201).json(await createApiToken(ds, scopeOf(req.actor), req.body.name)),
    },
    {
      method: 'delete',
      path: '/api/api-tokens/:id',
      response: 'empty',
      access: 'calc.use',
      tenantScoped: true,
      description: 'Revoke one of your API tokens',
      handler: async (req, res) => {
        await revokeApiToken(ds, scopeOf(req.actor), idParam(req));
        res.status(204).end();
      },
    },
  ];
}
