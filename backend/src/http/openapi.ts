/**
 * The API description (OpenAPI 3.1) built from the route registry and the shared zod schemas, so it cannot
 * drift from what the routes check and answer: paths, methods, who may call them, bodies and errors.
 */
import { z, type ZodType } from 'zod';
import { errorResponse } from '@shared/schemas/errors.js';
import { CSRF_HEADER } from './csrf.js';
import type { RouteSpec } from './route-registry.js';

type JsonSchema = Record<string, unknown>;

/** Express `:id` → OpenAPI `{id}`. */
export const openApiPath = (expressPath: string) => expressPath.replace(/:([A-Za-z_]\w*)/g, '{$1}');

/** Requests are described as a caller writes them (defaults optional), responses as the server sends them. */
function jsonSchemaOf(schema: ZodType, io: 'input' | 'output'): JsonSchema {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any' }) as JsonSchema;
  return rest;
}

function whoMayCall(spec: RouteSpec): string {
  const token = spec.apiToken ? ' A personal API token may call it too.' : '';
  if (spec.access === 'public') return `Anyone, without signing in.${token}`;
  if (spec.access === 'signed-in') return `Any signed-in person.${token}`;
  return `Members of the active organisation whose role has the permission “${spec.access}”.${token}`;
}

function parameters(spec: RouteSpec): JsonSchema[] {
  const path = [...spec.path.matchAll(/:([A-Za-z_]\w*)/g)].map((m) => ({ name: m[1], in: 'path', required: true, schema: { type: 'string' } }));
  if (!spec.query) return path;
  const query = jsonSchemaOf(spec.query, 'input');
  const properties = (query.properties ?? {}) as Record<string, JsonSchema>;
  const required = new Set((query.required ?? []) as string[]);
  return [...path, ...Object.entries(properties).map(([name, schema]) => ({ name, in: 'query', required: required.has(name), schema }))];
}

const errorBody = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } });

function errors(spec: RouteSpec): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const takesInput = spec.body || spec.bodyCheckedByHandler || spec.query || spec.method !== 'get' || spec.path.includes(':');
  if (takesInput) out['400'] = errorBody('The request needs attention: details.fieldErrors names each field and what is wrong');
  if (spec.access !== 'public') out['401'] = errorBody('Sign in first');
  if (spec.access !== 'public' && spec.access !== 'signed-in') out['403'] = errorBody('Your role cannot do this, or no organisation is chosen');
  if (spec.method !== 'get' && spec.csrf !== false && !out['403']) out['403'] = errorBody('The request lacks the CSRF header a browser session needs');
  if (spec.tenantScoped || spec.path.includes(':')) out['404'] = errorBody('No such record, or it lies outside what you may see');
  if (spec.rateLimit) out['429'] = errorBody('Too many attempts: wait and try again');
  out['500'] = errorBody('Something went wrong on our side; the request changed nothing');
  return out;
}

function success(spec: RouteSpec): Record<string, unknown> {
  const { response } = spec;
  if (response === 'empty') return { '204': { description: 'Done; no content' } };
  const status = String(spec.status ?? 200);
  if (!response) return { [status]: { description: 'Success' } };
  if ('file' in response) {
    return {
      [status]: {
        description: 'A file download',
        content: Object.fromEntries(response.file.map((t) => [t, { schema: { type: 'string', format: 'binary' } }])),
      },
    };
  }
  return { [status]: { description: 'Success', content: { 'application/json': { schema: jsonSchemaOf(response, 'output') } } } };
}

function operation(spec: RouteSpec): JsonSchema {
  const op: JsonSchema = {
    summary: spec.description,
    description: `Who may call it: ${whoMayCall(spec)}`,
    'x-access': spec.access,
    security: spec.access === 'public' ? [] : spec.apiToken ? [{ session: [] }, { apiToken: [] }] : [{ session: [] }],
    parameters: parameters(spec),
    responses: {
      ...success(spec),
      ...errors(spec),
      ...(spec.otherAnswer
        ? {
            [spec.otherAnswer.status]: {
              description: spec.otherAnswer.description,
              content: { 'application/json': { schema: jsonSchemaOf(spec.otherAnswer.schema, 'output') } },
            },
          }
        : {}),
    },
  };
  const body = spec.body ?? spec.bodyCheckedByHandler;
  if (body) op.requestBody = { required: true, content: { 'application/json': { schema: jsonSchemaOf(body, 'input') } } };
  return op;
}

export function buildOpenApi(routes: readonly RouteSpec[], sessionCookie: string): JsonSchema {
  const paths: Record<string, Record<string, JsonSchema>> = {};
  for (const spec of routes) (paths[openApiPath(spec.path)] ??= {})[spec.method] = operation(spec);
  return {
    openapi: '3.1.0',
    info: {
      title: 'Cleancase API',
      version: '1',
      description: `Condenser health, cleaning decisions and the records behind them. A browser session signs in with POST /api/session; unsafe methods then need the header “${CSRF_HEADER}: 1”. Personal API tokens (Authorization: Bearer) call only the calculation API.`,
    },
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    paths,
    components: {
      schemas: { Error: jsonSchemaOf(errorResponse, 'output') },
      securitySchemes: {
        session: { type: 'apiKey', in: 'cookie', name: sessionCookie },
        apiToken: { type: 'http', scheme: 'bearer' },
      },
    },
  };
}
