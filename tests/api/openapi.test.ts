/**
 * The API description: served without sign-in as OpenAPI 3.1, built from the route registry and the shared
 * zod schemas, so every registered route appears with its method, access, parameters, bodies and errors.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import type { RouteSpec } from '../../backend/src/http/route-registry.js';
import { openApiPath } from '../../backend/src/http/openapi.js';
import { CALC_COMMANDS } from '../../backend/src/cli/command-registry.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

type Operation = {
  'x-access': string;
  parameters: { name: string; in: string; required: boolean }[];
  requestBody?: { content: Record<string, { schema: Record<string, unknown> }> };
  responses: Record<string, { content?: Record<string, { schema: Record<string, unknown> }> }>;
};
type Doc = { openapi: string; paths: Record<string, Record<string, Operation>> };

const key = (r: RouteSpec) => `${r.method.toUpperCase()} ${r.path}`;
const withoutDialect = (schema: z.ZodType, io: 'input' | 'output') => {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any' }) as Record<string, unknown>;
  return rest;
};

/**
 * Routes that answer JSON but do not declare their response schema yet. The list may only shrink: a route
 * that gains a schema must leave it, and a new JSON route must bring its schema.
 */
const STILL_UNDESCRIBED = new Set<string>([]);

describe('the API description', () => {
  let t: TestApp;
  let doc: Doc;
  let routes: RouteSpec[];

  beforeAll(async () => {
    t = await createTestApp();
    routes = t.app.locals.routes;
    doc = (await request(t.app).get('/api/openapi.json').expect(200).expect('content-type', /json/)).body as Doc;
  });
  afterAll(async () => {
    await t?.close();
  });

  it('is served without sign-in as OpenAPI 3.1 with Express paths written as templates', () => {
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.paths['/api/plants/{id}']).toBeDefined();
    expect(Object.keys(doc.paths).filter((p) => p.includes(':'))).toEqual([]);
  });

  it('lists every registered route with who may call it and its path parameters', () => {
    for (const route of routes) {
      const op = doc.paths[openApiPath(route.path)]?.[route.method];
      expect(op, key(route)).toBeDefined();
      expect(op!['x-access'], key(route)).toBe(route.access);
      const pathParams = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
      expect(
        op!.parameters.filter((p) => p.in === 'path').map((p) => p.name),
        key(route),
      ).toEqual(pathParams);
    }
  });

  it('gives each route that takes a body its request schema, as generated from the zod schema', () => {
    const withBody = routes.filter((r) => r.body);
    expect(withBody.length).toBeGreaterThan(20);
    for (const route of withBody) {
      const schema = doc.paths[openApiPath(route.path)]![route.method]!.requestBody?.content['application/json']?.schema;
      expect(schema, key(route)).toEqual(withoutDialect(route.body!, 'input'));
    }
  });

  it('describes query parameters of a route from its query schema', () => {
    const health = doc.paths['/api/units/{id}/health']!.get!;
    expect(health.parameters.map((p) => `${p.in}:${p.name}:${p.required}`)).toEqual([
      'path:id:true',
      'query:from:false',
      'query:to:false',
      'query:breakdownBy:false',
    ]);
  });

  it('gives every route that answers JSON its response schema (except those still listed as undescribed)', () => {
    for (const route of routes) {
      const name = key(route);
      if (STILL_UNDESCRIBED.has(name)) {
        expect(route.response, `${name} has a response schema now: take it off the list`).toBeUndefined();
        continue;
      }
      expect(route.response, `${name} declares no response`).toBeDefined();
      const responses = doc.paths[openApiPath(route.path)]![route.method]!.responses;
      if (route.response === 'empty') {
        expect(responses['204'], name).toBeDefined();
      } else if (route.response && 'file' in route.response) {
        expect(Object.keys(responses[String(route.status ?? 200)]!.content!), name).toEqual(route.response.file);
      } else {
        const schema = responses[String(route.status ?? 200)]?.content?.['application/json']?.schema;
        expect(schema, name).toEqual(withoutDialect(route.response as z.ZodType, 'output'));
      }
    }
  });

  it('names the errors a caller can meet: sign-in, role, scope and bad input', () => {
    const create = doc.paths['/api/plants']!.post!;
    expect(Object.keys(create.responses).sort()).toEqual(['201', '400', '401', '403', '404', '500']);
    expect(create.responses['400']!.content!['application/json']!.schema).toEqual({ $ref: '#/components/schemas/Error' });
    const publicHealth = doc.paths['/api/health']!.get!;
    expect(Object.keys(publicHealth.responses).sort()).toEqual(['200', '500']);
  });

  it('describes each calculation command at its own path: its input, its result, and the 422 answer with errors in place', () => {
    const calcPaths = Object.keys(doc.paths).filter((p) => p.startsWith('/api/calc/'));
    expect(calcPaths.sort()).toEqual(
      Object.keys(CALC_COMMANDS)
        .map((n) => `/api/calc/${n}`)
        .sort(),
    );
    const schedule = doc.paths['/api/calc/schedule']!.post!;
    expect(JSON.stringify(schedule.requestBody!.content['application/json']!.schema)).toContain('horizonDays');
    expect(JSON.stringify(schedule.responses['200']!.content!['application/json']!.schema)).toContain('businessCase');
    expect(JSON.stringify(schedule.responses['422']!.content!['application/json']!.schema)).toContain('error');
  });

  it('describes a created plant: its units and time zone are required fields', () => {
    const schema = doc.paths['/api/plants']!.post!.responses['201']!.content!['application/json']!.schema as {
      required: string[];
      additionalProperties: unknown;
    };
    expect(schema.required).toEqual(expect.arrayContaining(['id', 'name', 'timeZone', 'clientGroupId', 'units']));
    expect(schema.additionalProperties).toBe(false);
  });
});
