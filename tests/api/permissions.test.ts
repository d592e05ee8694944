import fs from 'node:fs';
import path from 'node:path';
import { ROLES, can, type Role } from '../../shared/permissions';
import type { RouteSpec } from '../../server/lib/routes';
import { createOrgWithRoles, createTestApp, signedIn, type OrgWithRoles, type SessionAgent, type TestApp } from './setup/test-app';
import type { Caller, FixtureContext, OpenRoutes, RouteFixtures } from './route-fixtures/types';

/**
 * The permission table, route by route: walks the real route table (routes added later are
 * covered automatically) and calls every member route as each role of organisation A — roles the
 * table allows must not get 403, the others must get 403 — and as the owner of organisation B,
 * who must get 403/404 for A's rows and never see A's data. Fixtures: tests/api/route-fixtures/.
 */
let t: TestApp;
let ctx: FixtureContext;
const agents = new Map<string, SessionAgent>();
let memberRoutes: RouteSpec[] = [];
let openRouteSpecs: RouteSpec[] = [];
const fixtures: RouteFixtures = {};
const reviewedOpen: OpenRoutes = {};

const keyOf = (r: RouteSpec) => `${r.method.toUpperCase()} ${r.path}`;

function loadFixtures() {
  const dir = path.join(__dirname, 'route-fixtures');
  for (const file of fs.readdirSync(dir).filter((f) => f.endsWith('.ts') && f !== 'types.ts').sort()) {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const mod = require(path.join(dir, file)) as { fixtures?: RouteFixtures; openRoutes?: OpenRoutes };
    Object.assign(fixtures, mod.fixtures ?? {});
    Object.assign(reviewedOpen, mod.openRoutes ?? {});
  }
}

beforeAll(async () => {
  t = await createTestApp();
  // No SMTP server in this suite: routes that e-mail still run end to end, the mail is dropped.
  t.deps.mailer.send = async () => {};
  const { apiRoutes } = await import('../../server/routes');
  const all = apiRoutes(t.deps);
  memberRoutes = all.filter((r) => r.access.kind === 'member');
  openRouteSpecs = all.filter((r) => r.access.kind !== 'member');
  loadFixtures();
  const orgA: OrgWithRoles = await createOrgWithRoles(t.deps, 'Walker A');
  const orgB: OrgWithRoles = await createOrgWithRoles(t.deps, 'Walker B');
  ctx = { deps: t.deps, orgA, orgB, marker: orgA.tag };
  for (const role of ROLES) agents.set(role, await signedIn(t.app, orgA.users[role].email));
  agents.set('outsider', await signedIn(t.app, orgB.users.owner.email));
});
afterAll(async () => {
  await t?.close();
});

async function callAs(route: RouteSpec, who: Role | 'outsider') {
  const outsider = who === 'outsider';
  const role: Role = outsider ? 'owner' : who;
  const org = outsider ? ctx.orgB : ctx.orgA;
  const caller: Caller = { userId: org.users[role].id, role, organisationId: org.organisationId, outsider };
  const call = await fixtureFor(route)!(ctx, caller);
  let url = route.path.replace(/:(\w+)/g, (_m, name: string) => {
    const v = call.params?.[name];
    if (v === undefined) throw new Error(`fixture for ${keyOf(route)} gives no :${name}`);
    return encodeURIComponent(String(v));
  });
  if (call.query) url += `?${new URLSearchParams(Object.entries(call.query).map(([k, v]) => [k, String(v)]))}`;
  const agent = agents.get(who)!;
  const res = route.method === 'get' ? await agent.get(url) : await agent[route.method](url, call.body);
  return res;
}

test('the walker sees the accounts routes (sanity: the table is really read)', () => {
  const keys = memberRoutes.map(keyOf);
  expect(keys).toEqual(expect.arrayContaining(['GET /members', 'PATCH /members/:id', 'POST /invitations', 'GET /audit', 'DELETE /tokens/:id']));
});

/** Routes without path params need no fixture: they are called with an empty body and query. */
const fixtureFor = (route: RouteSpec) => fixtures[keyOf(route)] ?? (/:\w+/.test(route.path) ? undefined : () => ({}));

test('every member route with path params has a fixture (add one in tests/api/route-fixtures/<feature>.ts)', () => {
  const missing = memberRoutes.filter((r) => !fixtureFor(r)).map(keyOf);
  expect(missing).toEqual([]);
});

test('every route that is not member-scoped is on a reviewed list (openRoutes in tests/api/route-fixtures/)', () => {
  const unreviewed = openRouteSpecs.map(keyOf).filter((k) => !reviewedOpen[k]);
  expect(unreviewed).toEqual([]);
});

describe('each member route, each role', () => {
  test('allowed roles pass the guard, the others get 403, organisation B cannot reach A', async () => {
    const problems: string[] = [];
    for (const route of memberRoutes) {
      if (!fixtureFor(route)) continue; // reported by the test above
      const started = Date.now();
      const permission = (route.access as { permission: Parameters<typeof can>[1] }).permission;
      for (const role of ROLES) {
        const res = await callAs(route, role);
        const allowed = can(role, permission);
        if (allowed && res.status === 403) problems.push(`${keyOf(route)} as ${role}: 403 but ${permission} allows it (${res.body?.error})`);
        if (!allowed && res.status !== 403) problems.push(`${keyOf(route)} as ${role}: ${res.status}, expected 403 (lacks ${permission})`);
        if (!allowed && res.status === 403 && !String(res.body?.error).includes(permission)) problems.push(`${keyOf(route)} as ${role}: 403 without naming the permission`);
      }
      const res = await callAs(route, 'outsider');
      const touchesRow = /:\w+/.test(route.path);
      if (touchesRow && res.status !== 403 && res.status !== 404) problems.push(`${keyOf(route)} from organisation B on A's row: ${res.status}, expected 403/404`);
      const text = JSON.stringify(res.body ?? '') + (res.text ?? '');
      if (text.includes(ctx.marker) || text.includes(ctx.orgA.name)) problems.push(`${keyOf(route)} from organisation B: the answer contains organisation A's data`);
      if (process.env.WALKER_TIMES) console.log(keyOf(route), Date.now() - started, 'ms');
    }
    expect(problems).toEqual([]);
  });
});

test('signed-out callers get 401 on every member and signed-in route', async () => {
  const { default: request } = await import('supertest');
  const problems: string[] = [];
  for (const route of [...memberRoutes, ...openRouteSpecs.filter((r) => r.access.kind === 'user')]) {
    const url = route.path.replace(/:(\w+)/g, '1');
    const res = await request(t.app)[route.method](`/api${url}`);
    // State-changing requests without a session meet the CSRF check first (403 csrf); both refuse.
    const ok = res.status === 401 || (route.method !== 'get' && res.status === 403 && res.body.code === 'csrf');
    if (!ok) problems.push(`${keyOf(route)}: ${res.status}`);
  }
  expect(problems).toEqual([]);
});

/**
 * Ids, not only names: after the walk above organisation A holds networks, runs, members,
 * invitations, tokens and audit events. Each list route called by organisation B must return
 * none of A's row ids (every `id` anywhere in the answer is checked against the table the route
 * lists); called by A's owner it must return some, so the check can fail. (Added by hardening.)
 */
test("organisation B's list answers contain none of organisation A's row ids", async () => {
  const tables: Record<string, { model: keyof TestApp['deps']['models']; where?: Record<string, unknown> }> = {
    'GET /networks': { model: 'Network' },
    'GET /runs': { model: 'Run' },
    'GET /members': { model: 'Membership' },
    'GET /invitations': { model: 'Invitation' },
    'GET /tokens': { model: 'ApiToken' },
    'GET /audit': { model: 'AuditEvent' },
  };
  const idsIn = (v: unknown, out = new Set<number>()): Set<number> => {
    if (Array.isArray(v)) v.forEach((x) => idsIn(x, out));
    else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) { if (k === 'id' && typeof x === 'number') out.add(x); else idsIn(x, out); }
    return out;
  };
  const problems: string[] = [];
  for (const [key, { model }] of Object.entries(tables)) {
    const route = memberRoutes.find((r) => keyOf(r) === key);
    if (!route) { problems.push(`${key} is no longer in the route table`); continue; }
    // eslint-disable-next-line @typescript-eslint/no-explicit-any
    const rows = await (t.deps.models[model] as any).findAll({ where: { organisationId: ctx.orgA.organisationId }, attributes: ['id'] });
    const aIds = new Set<number>(rows.map((r: { get: (k: string) => number }) => r.get('id')));
    const query = key === 'GET /audit' ? '?page=1&pageSize=100' : '';
    const mine = idsIn((await agents.get('owner')!.get(`${route.path}${query}`)).body);
    const theirs = idsIn((await agents.get('outsider')!.get(`${route.path}${query}`)).body);
    if (![...mine].some((id) => aIds.has(id))) problems.push(`${key}: A's owner sees none of A's ${String(model)} ids (the check could not fail)`);
    const leaked = [...theirs].filter((id) => aIds.has(id));
    if (leaked.length) problems.push(`${key}: organisation B sees A's ${String(model)} ids ${leaked.join(', ')}`);
  }
  expect(problems).toEqual([]);
});
