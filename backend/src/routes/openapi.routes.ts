import { buildOpenApi } from '../http/openapi.js';
import type { RouteSpec } from '../http/route-registry.js';
import { openApiDocument } from '@shared/schemas/openapi.js';

/** The API description covers every registered route, this one included; built once on first request. */
export function openApiRoutes(allRoutes: () => readonly RouteSpec[], sessionCookie: string): RouteSpec[] {
  let built: unknown;
  return [
    {
      method: 'get',
      path: '/api/openapi.json',
      access: 'public',
      tenantScoped: false,
      response: openApiDocument,
      description: 'This API described in OpenAPI 3.1: paths, methods, who may call them, request and response bodies, errors',
      handler: (_req, res) => res.json((built ??= buildOpenApi(allRoutes(), sessionCookie))),
    },
  ];
}
