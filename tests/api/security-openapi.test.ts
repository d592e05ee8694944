import request from 'supertest';
import { createTestApp, type TestApp } from './setup/test-app';
import type { RouteSpec } from '../../server/lib/routes';
import { jsonSchemaOf } from '../unit/fuzz/schema-arbitrary';
import { describeApi } from '../../components/api-docs/describe';

/**
 * The OpenAPI document integrators read (and the API page renders) must describe every input the
 * route table validates: each path param with its schema, each query field, each body field, and
 * who may call the route. Checked against the live route table (OpenAPI 3.1: OpenAPI Initiative,
 * "OpenAPI Specification 3.1.0", 2021 — parameters, requestBody, securitySchemes).
 */
let t: TestApp;
let routes: RouteSpec[];
let doc: { paths: Record<string, Record<string, { parameters: { name: string; in: string; schema: Record<string, unknown> }[]; requestBody?: { content: Record<string, { schema: Record<string, unknown> }> }; description: string; security: unknown[] }>>; components: { securitySchemes: Record<string, unknown> } };

beforeAll(async () => {
  t = await createTestApp();
  const { apiRoutes } = await import('../../server/routes');
  routes = apiRoutes(t.deps);
  doc = (await request(t.app).get('/api/openapi.json').expect(200)).body;
});
afterAll(async () => {
  await t?.close();
});

const opOf = (r: RouteSpec) => doc.paths[`/api${r.path}`.replace(/:([A-Za-z_]+)/g, '{$1}')]?.[r.method];

test('every path param is documented with the type its params schema accepts', () => {
  const problems: string[] = [];
  for (const r of routes) {
    const op = opOf(r);
    const declared = r.params ? ((jsonSchemaOf(r.params).properties ?? {}) as Record<string, Record<string, unknown>>) : {};
    for (const m of r.path.matchAll(/:([A-Za-z_]+)/g)) {
      const p = op?.parameters.find((x) => x.in === 'path' && x.name === m[1]);
      if (!p) problems.push(`${r.method} ${r.path}: :${m[1]} missing`);
      else if (declared[m[1]] && JSON.stringify(p.schema) !== JSON.stringify(declared[m[1]])) problems.push(`${r.method} ${r.path}: :${m[1]} documented as ${JSON.stringify(p.schema)}`);
    }
  }
  expect(problems).toEqual([]);
});

test('every query field and every top-level body field is documented', () => {
  const problems: string[] = [];
  for (const r of routes) {
    const op = opOf(r);
    if (!op) { problems.push(`${r.method} ${r.path}: not in the document`); continue; }
    for (const name of Object.keys((r.query ? jsonSchemaOf(r.query).properties : {}) ?? {})) {
      if (!op.parameters.some((p) => p.in === 'query' && p.name === name)) problems.push(`${r.method} ${r.path}: query ${name} missing`);
    }
    if (r.body) {
      const documented = op.requestBody?.content['application/json']?.schema as { properties?: Record<string, unknown> } | undefined;
      if (!documented) problems.push(`${r.method} ${r.path}: no request body`);
      for (const name of Object.keys((jsonSchemaOf(r.body).properties as Record<string, unknown>) ?? {})) {
        if (!documented?.properties?.[name]) problems.push(`${r.method} ${r.path}: body field ${name} missing`);
      }
    }
  }
  expect(problems).toEqual([]);
});

test('who may call each route is stated, and signed-in routes name both ways to authenticate', () => {
  expect(Object.keys(doc.components.securitySchemes).sort()).toEqual(['bearer', 'session']);
  const problems: string[] = [];
  for (const r of routes) {
    const op = opOf(r)!;
    if (r.access.kind === 'member' && !op.description.includes(r.access.permission)) problems.push(`${r.method} ${r.path}: permission not named`);
    if (r.access.kind !== 'public' && op.security.length !== 2) problems.push(`${r.method} ${r.path}: security not stated`);
    if (r.access.kind === 'public' && op.security.length !== 0) problems.push(`${r.method} ${r.path}: public route marked as secured`);
  }
  expect(problems).toEqual([]);
});

test('the API page model (components/api-docs/describe.ts) lists every route exactly once, with its fields', () => {
  const groups = describeApi(doc as never);
  const listed = groups.flatMap((g) => g.operations.map((o) => `${o.method} ${o.path}`));
  const expected = routes.map((r) => `${r.method.toUpperCase()} ${`/api${r.path}`.replace(/:([A-Za-z_]+)/g, '{$1}')}`);
  expect([...listed].sort()).toEqual([...expected].sort());
  const createRun = groups.flatMap((g) => g.operations).find((o) => o.method === 'POST' && o.path === '/api/runs')!;
  expect(createRun.fields.map((f) => f.name)).toEqual(expect.arrayContaining(['versionId', 'problem', 'problem.kind', 'solvers', 'solvers[].solver']));
  expect(createRun.fields.find((f) => f.name === 'problem.kind')).toMatchObject({ required: true, type: 'one of: maxcut, bisection, kway' });
});
