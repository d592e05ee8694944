import type { Deps } from '../../../server/deps';
import type { Role } from '../../../shared/permissions';
import type { OrgWithRoles } from '../setup/test-app';

/**
 * Per-route fixtures for the permission walker (tests/api/permissions.test.ts). Each feature adds
 * a file in this folder exporting `fixtures: RouteFixtures`, keyed "METHOD /path" exactly as in the
 * route table (e.g. "PATCH /members/:id"). A fixture is called before EVERY call, so a route that
 * deletes or changes something gets a fresh row each time. Rows must belong to organisation A
 * (`ctx.orgA`), and names should contain `ctx.marker` so leaks into other answers are detectable.
 */
export interface FixtureContext {
  deps: Deps;
  orgA: OrgWithRoles;
  orgB: OrgWithRoles;
  /** A string that appears in organisation A's data and must never appear in answers to organisation B. */
  marker: string;
}

/** Who is about to call: a role of organisation A, or the owner of organisation B ("outsider"). */
export interface Caller {
  userId: number;
  role: Role;
  organisationId: number;
  outsider: boolean;
}

export interface RouteCall {
  params?: Record<string, string | number>;
  query?: Record<string, string | number>;
  body?: unknown;
}

export type RouteFixture = (ctx: FixtureContext, caller: Caller) => Promise<RouteCall> | RouteCall;
export type RouteFixtures = Record<string, RouteFixture>;

/**
 * Routes that are NOT member-scoped (access public or user), reviewed on purpose: a fixture file
 * may export `openRoutes: OpenRoutes` ("METHOD /path" → why it is open). The walker fails on any
 * open route nobody listed, so a route cannot become public by accident.
 */
export type OpenRoutes = Record<string, string>;
