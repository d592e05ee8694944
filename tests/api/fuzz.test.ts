import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import type { RouteSpec } from '../../server/lib/routes';
import { createOrgWithRoles, createTestApp, signedIn, type OrgWithRoles, type SessionAgent, type TestApp } from './setup/test-app';
import type { FixtureContext, RouteFixtures } from './route-fixtures/types';
import { hostile, jsonSchemaOf, nastyValue, validish } from '../unit/fuzz/schema-arbitrary';

/**
 * Fuzzing the API from its own route table: every route with a JSON body gets valid-ish bodies
 * generated from its zod schema and hostile variants of them (wrong types, huge strings, deep
 * nesting, unicode, negative/non-finite numbers), sent as the owner of a fresh organisation.
 * Properties: no answer is a 5xx of ours (a 502 from the absent payment provider is allowed), and
 * an answer ≥ 400 leaves every organisation-scoped table of that organisation unchanged (no
 * partial writes; a failed checkout attempt's `failed` payments row is the one kept record). Queries, path params and uploads likewise.
 * Seeded and bounded (RUNS per route) so the suite stays short.
 */
const RUNS = 30;
const SEED = 20261201;

let t: TestApp;
let routes: RouteSpec[];
let ctx: FixtureContext;
let org: OrgWithRoles;
const fixtures: RouteFixtures = {};
let scopedTables: string[] = [];

const keyOf = (r: RouteSpec) => `${r.method.toUpperCase()} ${r.path}`;

beforeAll(async () => {
  t = await createTestApp();
  t.deps.mailer.send = async () => {};
  const { apiRoutes } = await import('../../server/routes');
  routes = apiRoutes(t.deps);
  const dir = path.join(__dirname, 'route-fixtures');
  for (const file of fs.readdirSync(dir).filter((f) => f.endsWith('.ts') && f !== 'types.ts').sort()) {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    Object.assign(fixtures, (require(path.join(dir, file)) as { fixtures: RouteFixtures }).fixtures);
  }
  org = await createOrgWithRoles(t.deps, 'Fuzz A');
  ctx = { deps: t.deps, orgA: org, orgB: await createOrgWithRoles(t.deps, 'Fuzz B'), marker: org.tag };
  // Every table with an organisation_id column, found from the schema (new features are covered).
  // audit_events is left out: refused attempts (e.g. failed sign-ins) are audited on purpose.
  const rows = await t.deps.db.query<{ t: string }>(
    "SELECT DISTINCT TABLE_NAME AS t FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND COLUMN_NAME = 'organisation_id' AND TABLE_NAME <> 'audit_events'",
    { type: QueryTypes.SELECT },
  );
  scopedTables = rows.map((r) => r.t).sort();
});
afterAll(async () => {
  await t?.close();
});

/**
 * Row counts of every organisation-scoped table for our organisation, as one string. A checkout
 * the payment provider does not answer (502) keeps its payments row as a `failed` attempt on
 * purpose, so failed payments are counted apart and left out of the comparison for a 502.
 */
async function snapshot(): Promise<string> {
  const parts = scopedTables.map((name) => `SELECT '${name}' AS t, COUNT(*) AS n FROM \`${name}\` WHERE organisation_id = ${org.organisationId}${name === 'payments' ? " AND status <> 'failed'" : ''}`);
  if (scopedTables.includes('payments')) parts.push(`SELECT 'payments(failed)' AS t, COUNT(*) AS n FROM payments WHERE organisation_id = ${org.organisationId} AND status = 'failed'`);
  const rows = await t.deps.db.query<{ t: string; n: number }>(parts.join(' UNION ALL '), { type: QueryTypes.SELECT });
  return rows.map((r) => `${r.t}=${r.n}`).join(' ');
}

/** A refusal by an upstream service (the payment provider is not running in this suite), not by us. */
const upstream = (res: { status: number; body?: { code?: string } }) => res.status === 502 && res.body?.code === 'payments_unavailable';
const withoutFailedPayments = (snap: string) => snap.replace(/ ?payments\(failed\)=\d+/, '');

/** A fixture's path params (fresh rows of our organisation) or a harmless 1. */
async function paramsFor(route: RouteSpec): Promise<Record<string, string | number>> {
  const f = fixtures[keyOf(route)];
  const call = f ? await f(ctx, { userId: org.users.owner.id, role: 'owner', organisationId: org.organisationId, outsider: false }) : {};
  return call.params ?? {};
}

const fill = (p: string, params: Record<string, string | number>) => p.replace(/:(\w+)/g, (_m, n: string) => encodeURIComponent(String(params[n] ?? 1)));

/** Ownership transfer and closing can only run last: they change who may call the rest. */
const LAST = new Set(['POST /organisation/transfer', 'DELETE /organisation']);
// Sign-in is left out: its failure limit per IP would lock this suite's own sign-ins (auth.test.ts
// covers its refusals); the imports take multipart uploads (fuzzed below).
const SKIP = new Set(['POST /auth/sign-in', 'POST /networks/import', 'POST /networks/import/preview']);
const bodyRoutes = () => routes.filter((r) => r.body && !SKIP.has(keyOf(r))).sort((a, b) => Number(LAST.has(keyOf(a))) - Number(LAST.has(keyOf(b))));

test('the table is really read: dozens of body routes, organisation-scoped tables found', () => {
  expect(bodyRoutes().length).toBeGreaterThan(15);
  expect(scopedTables).toEqual(expect.arrayContaining(['networks', 'network_versions', 'runs', 'run_jobs', 'memberships', 'api_tokens', 'invitations']));
});

test('JSON bodies from each route schema: no 500, and refused bodies write nothing', async () => {
  const problems: string[] = [];
  let sent = 0;
  let accepted = 0;
  for (const route of bodyRoutes()) {
    const agent: SessionAgent = await signedIn(t.app, org.users.owner.email);
    const token = (await agent.get('/auth/csrf')).body.csrfToken as string;
    const schema = jsonSchemaOf(route.body!);
    const bodies = fc.sample(fc.oneof({ weight: 1, arbitrary: validish(schema) }, { weight: 2, arbitrary: hostile(validish(schema)) }), { numRuns: RUNS, seed: SEED });
    const params = /:\w+/.test(route.path) ? await paramsFor(route) : {};
    for (const body of bodies) {
      const before = await snapshot();
      // Serialised here: superagent refuses bare primitives, and the server must see them anyway.
      const res = await agent.agent[route.method](`/api${fill(route.path, params)}`).set('x-csrf-token', token).set('content-type', 'application/json').send(JSON.stringify(body) ?? 'null');
      sent++;
      const shown = JSON.stringify(body)?.slice(0, 160);
      if (res.status >= 500 && !upstream(res)) problems.push(`${keyOf(route)} ${res.status} for ${shown}`);
      if (res.status >= 400) {
        const after = await snapshot();
        const same = upstream(res) ? withoutFailedPayments(after) === withoutFailedPayments(before) : after === before;
        if (!same) problems.push(`${keyOf(route)} ${res.status} but rows changed (${before} → ${after}) for ${shown}`);
      } else accepted++;
    }
  }
  expect(problems).toEqual([]);
  expect(sent).toBeGreaterThan(15 * RUNS);
  expect(accepted).toBeGreaterThan(0); // valid-ish bodies do get through somewhere: the generator is not only noise
});

test('malformed JSON text and wrong content types: 400/415-class answers, never 500', async () => {
  const agent = await signedIn(t.app, org.users.owner.email);
  const token = (await agent.get('/auth/csrf')).body.csrfToken as string;
  const texts = fc.sample(fc.oneof(fc.string({ maxLength: 60 }), fc.constantFrom('{', '{"a":NaN}', '{"a":Infinity}', '[', '{"a":1,}', '\u0000', '{"a":"\ud800"}', '{"__proto__":{"x":1}}', `${'['.repeat(5000)}${']'.repeat(5000)}`)), { numRuns: RUNS, seed: SEED });
  const problems: string[] = [];
  const before = await snapshot();
  for (const route of bodyRoutes().filter((r) => !LAST.has(keyOf(r)) && !/:\w+/.test(r.path))) {
    for (const [i, text] of texts.entries()) {
      const type = i % 3 === 0 ? 'text/plain' : 'application/json';
      const res = await agent.agent[route.method](`/api${route.path}`).set('x-csrf-token', token).set('content-type', type).send(text);
      if (res.status >= 500) problems.push(`${keyOf(route)} ${res.status} for ${type} ${JSON.stringify(text).slice(0, 80)}`);
    }
  }
  expect(problems).toEqual([]);
  expect(await snapshot()).toBe(before);
});

test('query strings and path params of every GET route: never 500', async () => {
  const agent = await signedIn(t.app, org.users.owner.email);
  const problems: string[] = [];
  const gets = routes.filter((r) => r.method === 'get' && !r.path.endsWith('/events'));
  const junk = fc.oneof(fc.string({ maxLength: 30 }), fc.constantFrom('-1', '0', '1e309', 'NaN', '9'.repeat(40), '%', '[]', '../', '1;DROP TABLE runs'));
  for (const route of gets) {
    const schema = route.query ? jsonSchemaOf(route.query) : { type: 'object', properties: {} };
    const keys = Object.keys((schema.properties as Record<string, unknown>) ?? {});
    const queries = fc.sample(fc.dictionary(keys.length ? fc.oneof(fc.constantFrom(...keys), fc.string({ maxLength: 6 })) : fc.string({ maxLength: 6 }), junk, { maxKeys: 4 }), { numRuns: 10, seed: SEED });
    const params = /:\w+/.test(route.path) ? await paramsFor(route) : {};
    const ids = /:\w+/.test(route.path) ? fc.sample(junk, { numRuns: 10, seed: SEED + 1 }) : [];
    for (const q of queries) {
      const res = await agent.get(`${fill(route.path, params)}?${new URLSearchParams(q)}`);
      if (res.status >= 500) problems.push(`${keyOf(route)} ${res.status} for ?${new URLSearchParams(q)}`);
    }
    for (const id of ids) {
      const res = await agent.get(route.path.replace(/:\w+/g, encodeURIComponent(id) || '%20'));
      if (res.status >= 500) problems.push(`${keyOf(route)} ${res.status} for id ${JSON.stringify(id)}`);
    }
  }
  expect(problems).toEqual([]);
});

/** Network files near the accepted formats, then damaged: cut, spliced with junk, or wrong extension. */
const fileText: fc.Arbitrary<[string, string]> = fc.oneof(
  fc.tuple(fc.constant('lanes.csv'), fc.array(fc.tuple(fc.string({ maxLength: 6 }), fc.string({ maxLength: 6 }), fc.oneof(fc.double(), fc.string({ maxLength: 5 }))), { maxLength: 8 }).map((rows) => `from,to,weight\n${rows.map((r) => r.join(',')).join('\n')}\n`)),
  fc.tuple(fc.constant('n.geojson'), fc.anything({ maxDepth: 3 }).map((v) => JSON.stringify({ type: 'FeatureCollection', features: [{ type: 'Feature', geometry: { type: 'Point', coordinates: v }, properties: { id: v } }] }) ?? '')),
  fc.tuple(fc.constant('n.graphml'), fc.array(fc.string({ maxLength: 8 }), { maxLength: 5 }).map((ids) => `<?xml version="1.0"?><graphml><graph edgedefault="undirected">${ids.map((id) => `<node id="${id}"/>`).join('')}<edge source="${ids[0] ?? ''}" target="${ids[1] ?? ''}"/></graph></graphml>`)),
  fc.tuple(fc.constant('n.graphml'), fc.constantFrom('<!DOCTYPE x [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;"><!ENTITY c "&b;&b;&b;&b;&b;&b;&b;&b;&b;&b;">]><graphml><graph><node id="&c;"/></graph></graphml>', '<graphml><graph><node id="a"/><node', '<graphml>'.repeat(2000))),
  fc.tuple(fc.constant('n.txt'), fc.array(fc.tuple(fc.integer({ min: -3, max: 30 }), fc.integer({ min: -3, max: 30 }), fc.double()), { maxLength: 10 }).map((rows) => rows.map((r) => r.join(' ')).join('\n'))),
  fc.tuple(fc.constantFrom('n.json', 'n.csv', 'n.bin', 'n'), fc.string({ unit: 'binary', maxLength: 300 })),
);

test('uploads to import and import preview: no 500; refused imports write nothing', async () => {
  const agent = await signedIn(t.app, org.users.owner.email);
  const files = fc.sample(fc.tuple(fileText, fc.nat(4), fc.string({ maxLength: 20 })), { numRuns: 40, seed: SEED }); // 4 = the file as generated
  const problems: string[] = [];
  let accepted = 0;
  for (const target of ['/api/networks/import/preview', '/api/networks/import']) {
    for (const [[name, text], cut, junk] of files) {
      const token = (await agent.get('/auth/csrf')).body.csrfToken as string;
      const content = cut === 0 ? text.slice(0, Math.floor(text.length / 2)) : cut === 1 ? text + junk : text;
      const before = await snapshot();
      const req = agent.agent.post(target).set('x-csrf-token', token).attach('file', Buffer.from(content), name);
      if (cut === 2) req.field('name', junk).field('format', junk);
      if (cut === 3) req.field('mapping', name.endsWith('.graphml') ? JSON.stringify({ depotName: junk, laneWeight: 'nope' }) : `{${junk}`).field('dropBadRows', junk).field('networkId', junk);
      const res = await req;
      if (res.status >= 500) problems.push(`${target} ${res.status} for ${name} ${JSON.stringify(content).slice(0, 120)}`);
      if (res.status >= 400 || target.endsWith('preview')) {
        const after = await snapshot();
        if (after !== before) problems.push(`${target} ${res.status} but rows changed for ${name}`);
      } else accepted++;
    }
  }
  expect(problems).toEqual([]);
  expect(accepted).toBeGreaterThan(0);
});

test('the nasty values really are nasty (sanity of the generator)', () => {
  const sample = fc.sample(nastyValue, { numRuns: 300, seed: SEED });
  expect(sample.some((v) => typeof v === 'string' && v.length >= 100_000)).toBe(true);
  expect(sample.some((v) => Array.isArray(v) && Array.isArray(v[0]))).toBe(true);
  expect(sample.some((v) => typeof v === 'number' && !Number.isFinite(v))).toBe(true);
});
