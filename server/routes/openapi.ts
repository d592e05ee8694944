import { z, type ZodType } from 'zod';
import type { RouteSpec } from '../lib/routes';
import { APP_VERSION } from '../version';

/** JSON Schema (OpenAPI 3.1 dialect) of a zod schema, as the client would send it. */
function schemaOf(schema: ZodType, io: 'input' | 'output' = 'input'): Record<string, unknown> {
  const json = z.toJSONSchema(schema, { io, unrepresentable: 'any' }) as Record<string, unknown>;
  delete json.$schema;
  return json;
}

/** Express-style `/runs/:id` → OpenAPI `/runs/{id}`. */
const toOpenApiPath = (p: string) => p.replace(/:([A-Za-z_]+)/g, '{$1}');

const accessText = (r: RouteSpec) =>
  r.access.kind === 'public' ? 'No sign-in needed.' : r.access.kind === 'user' ? 'Any signed-in user.' : `Members whose role has \`${r.access.permission}\`.`;

/** The OpenAPI 3.1 document, generated from the route table and its zod schemas. */
export function buildOpenApi(routes: RouteSpec[], serverUrl: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of routes) {
    const path = toOpenApiPath(`/api${r.path}`);
    const parameters: unknown[] = [];
    // Path params carry their zod schema's type (ids are integers), not just "string".
    const p = r.params ? (schemaOf(r.params) as { properties?: Record<string, unknown> }) : {};
    for (const m of r.path.matchAll(/:([A-Za-z_]+)/g)) parameters.push({ name: m[1], in: 'path', required: true, schema: p.properties?.[m[1]] ?? { type: 'string' } });
    if (r.query) {
      const q = schemaOf(r.query) as { properties?: Record<string, unknown>; required?: string[] };
      for (const [name, schema] of Object.entries(q.properties ?? {})) parameters.push({ name, in: 'query', required: q.required?.includes(name) ?? false, schema });
    }
    const op: Record<string, unknown> = {
      summary: r.summary,
      description: accessText(r),
      operationId: `${r.method}${path.replace(/[^A-Za-z0-9]+(.)?/g, (_, c: string | undefined) => (c ? c.toUpperCase() : ''))}`,
      tags: [r.path.split('/')[1] ?? 'api'],
      parameters,
      responses: {
        [String(r.status ?? 200)]: r.response
          ? { description: 'Success', content: { 'application/json': { schema: schemaOf(r.response, 'output') } } }
          : r.produces ? { description: 'Success (a file)', content: { [r.produces]: { schema: { type: 'string' } } } } : { description: 'Success' },
        '400': { description: 'Invalid input: `{error, fields}`' },
        ...(r.access.kind !== 'public' ? { '401': { description: 'Not signed in' }, '403': { description: 'Not allowed for this role, or CSRF token missing' } } : {}),
      },
      security: r.access.kind === 'public' ? [] : [{ session: [] }, { bearer: [] }],
    };
    if (r.body) op.requestBody = { required: true, content: { 'application/json': { schema: schemaOf(r.body) } } };
    (paths[path] ??= {})[r.method] = op;
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Spinyard API',
      version: APP_VERSION,
      description:
        'Split distribution networks: networks and versions, runs of exact, bounding, heuristic and variational solvers, team and billing. Session clients send the token from GET /api/auth/csrf as X-CSRF-Token on every state-changing request; integrations use a personal API token as `Authorization: Bearer …` (no CSRF token needed). Results are decision support.',
    },
    servers: [{ url: serverUrl }],
    components: {
      securitySchemes: {
        session: { type: 'apiKey', in: 'cookie', name: 'spinyard.sid' },
        bearer: { type: 'http', scheme: 'bearer', description: 'A personal API token (Account → API tokens).' },
      },
    },
    paths,
  };
}

export function openApiRoutes(getRoutes: () => RouteSpec[], serverUrl: string): RouteSpec[] {
  let cached: unknown = null;
  return [
    {
      method: 'get',
      path: '/openapi.json',
      summary: 'This OpenAPI 3.1 document, generated from the route table',
      access: { kind: 'public' },
      handler: () => (cached ??= buildOpenApi(getRoutes(), serverUrl)),
    },
  ];
}
