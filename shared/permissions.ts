/**
 * Roles and what each may do — the one permission table. The API guards and the UI both read it
 * (the UI hides any control whose permission the current role lacks).
 */
export const ROLES = ['owner', 'admin', 'analyst', 'dispatcher', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const PERMISSIONS = [
  'networks:read',
  'networks:write',
  'runs:read',
  'runs:start',
  'runs:cancel',
  'runs:advanced', // solver settings beyond the defaults, custom operators
  'runs:compare',
  'members:read',
  'members:manage', // invite, revoke, change roles, seats
  'audit:read',
  'billing:read',
  'billing:manage',
  'organisation:transfer',
  'organisation:close',
  'tokens:own', // personal API tokens
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const viewer: Permission[] = ['networks:read', 'runs:read', 'members:read', 'tokens:own'];
const dispatcher: Permission[] = [...viewer, 'networks:write', 'runs:start', 'runs:cancel'];
const analyst: Permission[] = [...dispatcher, 'runs:advanced', 'runs:compare'];
const admin: Permission[] = [...analyst, 'members:manage', 'audit:read', 'billing:read', 'billing:manage'];
const owner: Permission[] = [...admin, 'organisation:transfer', 'organisation:close'];

export const ROLE_PERMISSIONS: Record<Role, ReadonlySet<Permission>> = {
  owner: new Set(owner),
  admin: new Set(admin),
  analyst: new Set(analyst),
  dispatcher: new Set(dispatcher),
  viewer: new Set(viewer),
};

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  admin: 'Admin',
  analyst: 'Analyst',
  dispatcher: 'Dispatcher',
  viewer: 'Viewer',
};

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return !!role && ROLE_PERMISSIONS[role].has(permission);
}

/**
 * Run fields reserved for `runs:advanced` (analysts and up), besides non-default solver settings:
 * a fixed seed and a time limit other than the default. The API answers 403 when another role
 * sets them; the app shows them only to roles that may.
 */
export const ADVANCED_RUN_FIELDS = ['seed', 'timeLimitSeconds'] as const;

/** The advanced run fields a request body sets. */
export function advancedRunFields(body: Partial<Record<(typeof ADVANCED_RUN_FIELDS)[number], unknown>>): string[] {
  return ADVANCED_RUN_FIELDS.filter((f) => body[f] !== undefined);
}
