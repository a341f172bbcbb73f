/**
 * The API description made readable: operations grouped by the first part of their path, each with who may
 * call it, its parameters, request body, answers and errors. Schemas are JSON Schema as the server sends them.
 */
import type { OpenApiDocument } from '@shared/schemas/openapi';

type Schema = Record<string, unknown>;
type Operation = {
  summary?: string;
  description?: string;
  parameters?: { name: string; in: string; required: boolean; schema?: Schema }[];
  requestBody?: { content?: Record<string, { schema?: Schema }> };
  responses?: Record<string, { description?: string; content?: Record<string, { schema?: Schema }> }>;
};

const METHOD_TONE: Record<string, string> = {
  get: 'bg-tube-100 text-tube-700',
  post: 'bg-ledger-100 text-ledger-700',
  put: 'bg-paper-sunk text-warn',
  patch: 'bg-paper-sunk text-warn',
  delete: 'bg-paper-sunk text-fault',
};

const MAX_DEPTH = 5;

/** A short name of a schema's type: "string (date)", "one of a, b", "array of object", "number or null". */
export function typeName(s: Schema | undefined): string {
  if (!s) return 'any';
  if (Array.isArray(s.enum)) return `one of ${s.enum.map((v) => JSON.stringify(v)).join(', ')}`;
  if ('const' in s) return JSON.stringify(s.const);
  const union = (s.anyOf ?? s.oneOf) as Schema[] | undefined;
  if (Array.isArray(union)) return union.map(typeName).join(' or ');
  if (s.type === 'array') return `array of ${typeName(s.items as Schema | undefined)}`;
  if (typeof s.type === 'string') return s.format ? `${s.type} (${String(s.format)})` : s.type;
  if (Array.isArray(s.type)) return s.type.join(' or ');
  return 'any';
}

/** The object schema to list fields of, looking through arrays and a nullable union. */
function objectPart(s: Schema | undefined): Schema | null {
  if (!s) return null;
  if (s.type === 'object' && s.properties) return s;
  if (s.type === 'array') return objectPart(s.items as Schema | undefined);
  const union = (s.anyOf ?? s.oneOf) as Schema[] | undefined;
  if (Array.isArray(union)) {
    const objects = union.map(objectPart).filter((o): o is Schema => o !== null);
    if (objects.length === 1) return objects[0] ?? null;
  }
  return null;
}

function Fields({ schema, depth = 0 }: { schema: Schema; depth?: number }) {
  const properties = (schema.properties ?? {}) as Record<string, Schema>;
  const required = new Set((schema.required ?? []) as string[]);
  return (
    <ul className={depth ? 'ml-4 border-l border-rule pl-3' : ''}>
      {Object.entries(properties).map(([name, field]) => {
        const inner = depth < MAX_DEPTH ? objectPart(field) : null;
        return (
          <li key={name} className="py-0.5 text-sm">
            <code className="font-medium text-ink">{name}</code>
            {!required.has(name) && <span className="text-ink-soft"> (optional)</span>}
            <span className="text-ink-soft">: {typeName(field)}</span>
            {typeof field.description === 'string' && <span className="text-ink-soft"> — {field.description}</span>}
            {inner && <Fields schema={inner} depth={depth + 1} />}
          </li>
        );
      })}
    </ul>
  );
}

function SchemaBlock({ title, schema }: { title: string; schema: Schema | undefined }) {
  const object = objectPart(schema);
  return (
    <div className="mt-2">
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{title}</p>
      {object ? <Fields schema={object} /> : <p className="text-sm text-ink-soft">{typeName(schema)}</p>}
    </div>
  );
}

function OperationCard({ method, path, op }: { method: string; path: string; op: Operation }) {
  const responses = Object.entries(op.responses ?? {});
  const success = responses.filter(([status]) => status.startsWith('2'));
  const errors = responses.filter(([status]) => !status.startsWith('2'));
  const body = op.requestBody?.content?.['application/json']?.schema;
  return (
    <details className="rounded border border-rule bg-paper-raised" id={`${method}-${path}`}>
      <summary className="flex cursor-pointer flex-wrap items-baseline gap-2 px-3 py-2">
        <span className={`rounded px-1.5 py-0.5 font-mono text-xs font-semibold uppercase ${METHOD_TONE[method] ?? ''}`}>{method}</span>
        <code className="text-sm text-ink">{path}</code>
        <span className="text-sm text-ink-soft">{op.summary}</span>
      </summary>
      <div className="border-t border-rule px-3 py-2">
        {op.description && <p className="text-sm">{op.description}</p>}
        {!!op.parameters?.length && (
          <div className="mt-2">
            <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Parameters</p>
            <ul>
              {op.parameters.map((p) => (
                <li key={`${p.in}-${p.name}`} className="text-sm">
                  <code className="font-medium">{p.name}</code>{' '}
                  <span className="text-ink-soft">
                    ({p.in}
                    {p.required ? ', required' : ''}): {typeName(p.schema)}
                  </span>
                </li>
              ))}
            </ul>
          </div>
        )}
        {body && <SchemaBlock title="Request body (JSON)" schema={body} />}
        {success.map(([status, r]) => {
          const json = r.content?.['application/json']?.schema;
          const files = Object.keys(r.content ?? {}).filter((t) => t !== 'application/json');
          return json ? (
            <SchemaBlock key={status} title={`Answer ${status} (JSON)`} schema={json} />
          ) : (
            <p key={status} className="mt-2 text-sm">
              <span className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Answer {status}</span>{' '}
              {files.length ? `a file: ${files.join(' or ')}` : r.description}
            </p>
          );
        })}
        {!!errors.length && (
          <div className="mt-2">
            <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Errors (JSON: error, details)</p>
            <ul>
              {errors.map(([status, r]) => (
                <li key={status} className="text-sm">
                  <code>{status}</code> <span className="text-ink-soft">{r.description}</span>
                </li>
              ))}
            </ul>
          </div>
        )}
      </div>
    </details>
  );
}

/** Operations grouped by the path's first part after /api (plants, units, imports, …). */
export function ApiOperations({ doc }: { doc: OpenApiDocument }) {
  const groups = new Map<string, { method: string; path: string; op: Operation }[]>();
  for (const [path, methods] of Object.entries(doc.paths)) {
    const group = path.split('/')[2] ?? 'other';
    for (const [method, op] of Object.entries(methods)) {
      const list = groups.get(group) ?? [];
      list.push({ method, path, op: op as Operation });
      groups.set(group, list);
    }
  }
  return (
    <div className="flex flex-col gap-6">
      {[...groups.entries()]
        .sort(([a], [b]) => a.localeCompare(b))
        .map(([group, ops]) => (
          <section key={group} aria-labelledby={`api-${group}`}>
            <h2 id={`api-${group}`} className="mb-2">
              {group}
            </h2>
            <div className="flex flex-col gap-2">
              {ops.map((o) => (
                <OperationCard key={`${o.method} ${o.path}`} {...o} />
              ))}
            </div>
          </section>
        ))}
    </div>
  );
}
