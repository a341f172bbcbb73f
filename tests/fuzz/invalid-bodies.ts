/**
 * Request bodies a route's own schema refuses, generated from that schema (any zod schema: it is read through
 * z.toJSONSchema, and every candidate is kept only if the same schema's safeParse fails on what the server
 * will see). Each body starts from a plausible value of the schema and breaks it in one or two places: a
 * missing required field, a wrong type, a number out of range or written as text ("NaN", "1.000,5"), a huge
 * or broken string, deep nesting, an array where an object belongs, a prototype-pollution key, an unknown key;
 * or the whole body is not an object at all (array, string, null, malformed JSON, another content type).
 */
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { z, type ZodType } from 'zod';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

interface JsonSchema {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema | JsonSchema[];
  prefixItems?: JsonSchema[];
  enum?: Json[];
  const?: Json;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minLength?: number;
  maxLength?: number;
  minItems?: number;
  maxItems?: number;
  pattern?: string;
  format?: string;
  $ref?: string;
  $defs?: Record<string, JsonSchema>;
  additionalProperties?: boolean | JsonSchema;
}

/** One generated request: the bytes on the wire, their content type, and what the server's schema check will see. */
export interface BadBody {
  label: string;
  contentType: string;
  wire: string;
  /** The value express.json hands to the route's validator; 'unreadable' when the parser refuses the text first. */
  seen: unknown;
}

/** Read any zod schema as JSON Schema (input side); a schema it cannot describe becomes {} and still gets generic junk. */
export function describeSchema(schema: ZodType): JsonSchema {
  try {
    return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', cycles: 'ref', reused: 'inline' }) as JsonSchema;
  } catch {
    return {};
  }
}

const MAX_DEPTH = 6;

function resolve(s: JsonSchema, root: JsonSchema): JsonSchema {
  if (s.$ref?.startsWith('#/$defs/')) return root.$defs?.[s.$ref.slice('#/$defs/'.length)] ?? {};
  if (s.$ref === '#') return root;
  return s;
}

function typeOf(s: JsonSchema): string | undefined {
  if (Array.isArray(s.type)) return s.type.find((t) => t !== 'null') ?? 'null';
  if (s.type) return s.type;
  if (s.properties) return 'object';
  if (s.items || s.prefixItems) return 'array';
  return undefined;
}

/** A plausible (often valid) value of the schema, to break in one place. */
export function plausible(s0: JsonSchema, root: JsonSchema, depth = 0): Json {
  const s = resolve(s0, root);
  if (s.const !== undefined) return s.const;
  if (s.enum?.length) return s.enum[0]!;
  const branch = s.anyOf?.[0] ?? s.oneOf?.[0] ?? s.allOf?.[0];
  if (branch && !s.type) return plausible(branch, root, depth);
  switch (typeOf(s)) {
    case 'object': {
      const out: Record<string, Json> = {};
      if (depth < MAX_DEPTH) for (const [k, v] of Object.entries(s.properties ?? {})) out[k] = plausible(v, root, depth + 1);
      return out;
    }
    case 'array': {
      const item = Array.isArray(s.items) ? s.items[0] : s.items;
      const n = Math.min(s.minItems ?? 0, 3);
      if (s.prefixItems) return s.prefixItems.map((p) => plausible(p, root, depth + 1));
      return depth < MAX_DEPTH && item ? Array.from({ length: Math.max(n, 1) }, () => plausible(item, root, depth + 1)) : [];
    }
    case 'string':
      if (s.format === 'uuid') return randomUUID();
      if (s.format === 'email') return 'someone@example.test';
      if (s.format === 'date-time') return '2026-01-05T10:00:00.000Z';
      if (s.format === 'date' || s.pattern?.startsWith('^\\d{4}-\\d{2}-\\d{2}')) return '2026-01-05';
      return 'x'.repeat(Math.max(1, Math.min(s.minLength ?? 1, 64)));
    case 'integer':
    case 'number': {
      const lo = s.minimum ?? (s.exclusiveMinimum !== undefined ? s.exclusiveMinimum + 1 : undefined);
      const hi = s.maximum ?? (s.exclusiveMaximum !== undefined ? s.exclusiveMaximum - 1 : undefined);
      if (lo !== undefined && hi !== undefined) return typeOf(s) === 'integer' ? Math.ceil((lo + hi) / 2) : (lo + hi) / 2;
      return lo ?? (hi !== undefined ? Math.min(hi, 1) : 1);
    }
    case 'boolean':
      return true;
    case 'null':
      return null;
    default:
      return 'x';
  }
}

/** Every place in a plausible value with the schema that governs it ([] is the whole body). */
interface Spot {
  path: (string | number)[];
  schema: JsonSchema;
}

function spots(s0: JsonSchema, root: JsonSchema, value: Json, path: (string | number)[] = [], out: Spot[] = []): Spot[] {
  const s = resolve(s0, root);
  out.push({ path, schema: s });
  if (path.length >= MAX_DEPTH) return out;
  const branch = !s.type && (s.anyOf?.[0] ?? s.oneOf?.[0]);
  if (branch) return spots(branch, root, value, path, out.slice(0, -1));
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(s.properties ?? {})) if (k in value) spots(v, root, value[k]!, [...path, k], out);
  } else if (Array.isArray(value)) {
    const item = Array.isArray(s.items) ? s.items[0] : s.items;
    value.forEach((v, i) => spots(s.prefixItems?.[i] ?? item ?? {}, root, v, [...path, i], out));
  }
  return out;
}

const clone = (v: Json): Json => JSON.parse(JSON.stringify(v)) as Json;

function setAt(value: Json, path: (string | number)[], replacement: Json | typeof REMOVE): Json {
  if (path.length === 0) return replacement === REMOVE ? {} : replacement;
  const copy = clone(value);
  let node: Json = copy;
  for (const key of path.slice(0, -1)) {
    const next: Json | undefined = node !== null && typeof node === 'object' ? (node as Record<string, Json>)[key as string] : undefined;
    // An earlier break replaced this part already: this one has nowhere to go.
    if (next === null || next === undefined || typeof next !== 'object') return copy;
    node = next;
  }
  if (node === null || typeof node !== 'object') return copy;
  const last = path[path.length - 1]!;
  // An array has only its indices to break (a key such as "length" would break the generator, not the body).
  if (Array.isArray(node) && !/^\d+$/.test(String(last))) return copy;
  if (replacement === REMOVE) {
    if (Array.isArray(node)) node.splice(Number(last), 1);
    else delete (node as Record<string, Json>)[last];
  } else if (last === '__proto__') {
    Object.defineProperty(node, '__proto__', { value: replacement, enumerable: true, configurable: true, writable: true });
  } else (node as Record<string, Json>)[last] = replacement;
  return copy;
}
const REMOVE = Symbol('remove');

/** Characters that break naive code: lone surrogates, NUL, escape, bidi override, zero width, BOM, combining marks, astral and joined emoji. */
export const UNICODE_EDGES = [
  '\ud800',
  'abc\udfff',
  'a\u0000b',
  '\u001b[31mred',
  '\u202eevil',
  'zero\u200bwidth',
  '\ufeffbom',
  'e\u0301\u0301\u0301',
  '𝔘𝔫𝔦𝔱',
  '👩🏽‍🔧',
  '\u0085next line',
  '\u2028\u2029',
  'ＦＵＬＬ',
  'İıß',
  '\ufffd\ufffe\uffff',
  ' ',
  '',
];

/** Numbers as people and programs mistype them, each sent as a JSON string. */
export const NUMBER_TEXTS = [
  'NaN',
  'Infinity',
  '-Infinity',
  '1e999',
  '-1e999',
  '0x1A',
  '1_000',
  '1,000.5',
  '1.000,5',
  '12,5',
  ' 42 ',
  '4 2',
  '12 kPa',
  '',
  '٣',
];

const hugeString = fc.tuple(fc.integer({ min: 20_000, max: 120_000 }), fc.constantFrom('x', 'é', '𝔘', '\u0301', 'ab\n')).map(([n, c]) => c.repeat(n));
const junkValue: fc.Arbitrary<Json> = fc.oneof(
  fc.constantFrom<Json>(null, true, false, 0, -1, 1e308, -1e308, 5e-324, 2 ** 53 + 1, '', [], {}, [[]], { '': null }),
  fc.constantFrom(...NUMBER_TEXTS),
  fc.constantFrom(...UNICODE_EDGES),
  fc.string({ maxLength: 40 }),
  fc.double(),
  fc.jsonValue({ maxDepth: 3 }) as fc.Arbitrary<Json>,
);

/** A value whose JSON type differs from what the schema wants at this spot. */
function wrongType(s: JsonSchema): fc.Arbitrary<Json> {
  const t = typeOf(s);
  const choices: Json[] = [null, true, 0, 'text', [], {}, [1, 2], { nested: { deeper: 'x' } }];
  const wrong = choices.filter((v) => {
    const k = v === null ? 'null' : Array.isArray(v) ? 'array' : typeof v === 'number' ? 'number' : typeof v;
    return k !== t && !(t === 'integer' && k === 'number');
  });
  return t === 'number' || t === 'integer' ? fc.oneof(fc.constantFrom(...wrong), fc.constantFrom(...NUMBER_TEXTS)) : fc.constantFrom(...wrong);
}

/** Just past a bound of the schema at this spot (numbers, lengths, item counts, enums, patterns). */
function outOfRange(s: JsonSchema, root: JsonSchema): fc.Arbitrary<Json> {
  const t = typeOf(s);
  const out: Json[] = [];
  if (t === 'number' || t === 'integer') {
    if (s.maximum !== undefined) out.push(s.maximum + Math.max(1, Math.abs(s.maximum) * 1e-6), s.maximum * 10 + 1);
    if (s.exclusiveMaximum !== undefined) out.push(s.exclusiveMaximum);
    if (s.minimum !== undefined) out.push(s.minimum - Math.max(1, Math.abs(s.minimum) * 1e-6), s.minimum < 0 ? s.minimum * 10 - 1 : -1);
    if (s.exclusiveMinimum !== undefined) out.push(s.exclusiveMinimum);
    if (t === 'integer') out.push(0.5, 1.25, 2 ** 53 + 2);
    out.push(1e308, -1e308);
  }
  if (t === 'string') {
    if (s.maxLength !== undefined && s.maxLength < 300_000) out.push('y'.repeat(s.maxLength + 1));
    if (s.minLength) out.push('y'.repeat(s.minLength - 1));
    if (s.enum?.length) out.push(`${String(s.enum[0])} `, String(s.enum[0]).toUpperCase() + '!', 'not-one-of-them');
    if (s.format === 'uuid') out.push('00000000-0000-0000-0000-00000000000g', `${randomUUID()}x`, 'not-a-uuid');
    if (s.format === 'email') out.push('no-at-sign', 'a@', '@b.test', 'a b@c.test');
    if (s.format === 'date-time' || s.format === 'date' || s.pattern?.includes('\\d{4}')) {
      out.push('2026-02-30', '2026-13-01', '0000-00-00', '31/12/2026', '12/31/2026', '2026-01-05T25:00:00Z', '9999-12-31', '-000001-01-01', '2026-W01', '1e9');
    }
    if (s.pattern) out.push('!!', ' leading space', 'trailing space ', 'x'.repeat(5000));
  }
  if (t === 'array') {
    const item = Array.isArray(s.items) ? s.items[0] : s.items;
    if (s.maxItems !== undefined && s.maxItems <= 25_000) out.push(Array.from({ length: s.maxItems + 1 }, () => (item ? plausible(item, root, MAX_DEPTH) : 1)));
    if (s.minItems) out.push([]);
    out.push([null], [[[]]]);
  }
  if (s.const !== undefined) out.push(typeof s.const === 'string' ? `${s.const}x` : 'other');
  return out.length ? fc.constantFrom(...out) : wrongType(s);
}

/** Marks a spot to be replaced by `depth` levels of nesting when the body is written out (too deep for JSON.stringify). */
const deepMarker = (depth: number, kind: 'array' | 'object') => `\u0001DEEP:${kind}:${depth}\u0001`;
const expandDeep = (wire: string) =>
  wire.replace(/"\\u0001DEEP:(array|object):(\d+)\\u0001"/g, (_m, kind: string, n: string) => {
    const depth = Number(n);
    return kind === 'array' ? `${'['.repeat(depth)}1${']'.repeat(depth)}` : `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`;
  });

const PROTO_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty', '__defineGetter__', 'valueOf'];

/** What express.json (strict) gives the validator for this JSON text, or 'unreadable'. */
function seenByServer(wire: string): unknown {
  // body-parser reads an empty body as {}.
  if (wire === '') return {};
  try {
    const v: unknown = JSON.parse(wire);
    return v !== null && typeof v === 'object' ? v : 'unreadable';
  } catch {
    return 'unreadable';
  }
}

const asJson = (label: string, value: Json): BadBody => {
  const wire = expandDeep(JSON.stringify(value));
  return { label, contentType: 'application/json', wire, seen: seenByServer(wire) };
};

/** Bodies that are not one JSON object at all: the parser or the schema refuses them whatever the route. */
const notAnObject: fc.Arbitrary<BadBody> = fc.oneof(
  fc
    .oneof(fc.constantFrom<Json>([], [{}], null, 0, 'text', true), fc.array(junkValue, { maxLength: 4 }), fc.string({ maxLength: 30 }))
    .map((v) => asJson('not an object', v)),
  fc
    .constantFrom('{"a":', '{a:1}', "{'a':1}", '[1,]', 'NaN', '{"a":NaN}', '{"a":Infinity}', '{"a":1}}', '\u0000', '{"a":"\\x41"}', '\ufeff{}', '{"a":1,}')
    .map((wire) => ({ label: 'malformed JSON', contentType: 'application/json', wire, seen: 'unreadable' as const })),
  fc.constant<BadBody>({ label: 'empty body', contentType: 'application/json', wire: '', seen: {} }),
  fc.integer({ min: 500, max: 5_000 }).map((n) => asJson('deeply nested array body', deepMarker(n, 'array'))),
  fc.integer({ min: 500, max: 5_000 }).map((n) => asJson('deeply nested object body', { a: deepMarker(n, 'object') })),
);

/** Bodies sent as another content type: express.json leaves them unread, so the validator sees {}. */
const otherContentType: fc.Arbitrary<BadBody> = fc
  .tuple(fc.constantFrom('text/plain', 'application/x-www-form-urlencoded', 'application/xml', 'application/octet-stream'), fc.string({ maxLength: 60 }))
  .map(([contentType, text]) => ({ label: `sent as ${contentType}`, contentType, wire: text || 'a=1', seen: {} }));

/**
 * Bodies the schema refuses. A candidate the schema would accept (a broken string in a free-text field, say) is
 * dropped, so a route that writes cannot be handed a valid body by accident.
 */
export function invalidBodies(schema: ZodType): fc.Arbitrary<BadBody> {
  const root = describeSchema(schema);
  const base = plausible(root, root);
  const places = spots(root, root, base);
  const objectPlaces = places.filter((p) => typeOf(p.schema) === 'object');
  const requiredPlaces = objectPlaces.flatMap((p) => (p.schema.required ?? []).map((k) => [...p.path, k]));
  const leafPlaces = places.filter((p) => p.path.length > 0);
  const anyPlace = fc.constantFrom(...places);
  const leaf = leafPlaces.length ? fc.constantFrom(...leafPlaces) : anyPlace;

  const mutations: fc.Arbitrary<(v: Json) => [string, Json]>[] = [
    anyPlace.chain((p) => wrongType(p.schema).map((w) => (v: Json) => [`wrong type at ${p.path.join('.') || 'body'}`, setAt(v, p.path, w)] as [string, Json])),
    leaf.chain((p) => outOfRange(p.schema, root).map((w) => (v: Json) => [`out of range at ${p.path.join('.')}`, setAt(v, p.path, w)] as [string, Json])),
    leaf.chain((p) => fc.constantFrom(...UNICODE_EDGES).map((w) => (v: Json) => [`odd text at ${p.path.join('.')}`, setAt(v, p.path, w)] as [string, Json])),
    leaf.chain((p) => hugeString.map((w) => (v: Json) => [`huge string at ${p.path.join('.')}`, setAt(v, p.path, w)] as [string, Json])),
    leaf.chain((p) =>
      fc.tuple(fc.integer({ min: 50, max: 5_000 }), fc.constantFrom<'array' | 'object'>('array', 'object')).map(
        ([n, kind]) =>
          (v: Json) =>
            [`deep nesting at ${p.path.join('.')}`, setAt(v, p.path, deepMarker(n, kind))] as [string, Json],
      ),
    ),
    (objectPlaces.length ? fc.constantFrom(...objectPlaces) : anyPlace).chain((p) =>
      fc.tuple(fc.oneof(fc.constantFrom(...PROTO_KEYS), fc.string({ minLength: 1, maxLength: 20 })), junkValue).map(
        ([key, w]) =>
          (v: Json) =>
            [`extra key ${JSON.stringify(key)} at ${p.path.join('.') || 'body'}`, setAt(v, [...p.path, key], w)] as [string, Json],
      ),
    ),
    (objectPlaces.length ? fc.constantFrom(...objectPlaces) : anyPlace).map(
      (p) => (v: Json) => [`array where an object belongs at ${p.path.join('.') || 'body'}`, setAt(v, p.path, [getAt(v, p.path)])] as [string, Json],
    ),
  ];
  if (requiredPlaces.length) {
    mutations.push(fc.constantFrom(...requiredPlaces).map((path) => (v: Json) => [`missing ${path.join('.')}`, setAt(v, path, REMOVE)] as [string, Json]));
  }
  const broken = fc.tuple(fc.oneof(...mutations), fc.option(fc.oneof(...mutations), { freq: 2 })).map(([first, second]) => {
    const [l1, v1] = first(base);
    const [l2, v2] = second ? second(v1) : ['', v1];
    return asJson(l2 ? `${l1}; ${l2}` : l1, v2);
  });
  return fc
    .oneof({ arbitrary: broken, weight: 8 }, { arbitrary: notAnObject, weight: 1 }, { arbitrary: otherContentType, weight: 1 })
    .filter((b) => b.seen === 'unreadable' || !schema.safeParse(b.seen).success);
}

function getAt(value: Json, path: (string | number)[]): Json {
  let node: Json = value;
  for (const key of path) node = node !== null && typeof node === 'object' ? ((node as Record<string, Json>)[key as string] ?? null) : null;
  return node;
}

/** Junk for a route without a body schema (its handler reads no body, or checks it itself). */
export const junkBodies: fc.Arbitrary<BadBody> = fc.oneof(
  notAnObject,
  otherContentType,
  fc.dictionary(fc.oneof(fc.constantFrom(...PROTO_KEYS), fc.string({ maxLength: 12 })), junkValue, { maxKeys: 6 }).map((v) => asJson('junk object', v as Json)),
  hugeString.map((s) => asJson('huge string field', { text: s })),
);
