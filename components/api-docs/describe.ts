/**
 * Turns the server's OpenAPI 3.1 document (GET /api/openapi.json) into the plain shape the API
 * page shows: operations grouped by tag, each with who may call it, its parameters and the
 * fields of its JSON body (nested fields as dotted names, e.g. `problem.kind`).
 */
export type OpenApiDocument = {
  info?: { title?: string; version?: string; description?: string };
  servers?: { url: string }[];
  paths?: Record<string, Record<string, OpenApiOperation>>;
};

type JsonSchema = {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  enum?: unknown[];
  const?: unknown;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  description?: string;
  minimum?: number;
  maximum?: number;
  minLength?: number;
  maxLength?: number;
  default?: unknown;
  additionalProperties?: boolean | JsonSchema;
};

type OpenApiOperation = {
  summary?: string;
  description?: string;
  tags?: string[];
  parameters?: { name: string; in: string; required?: boolean; schema?: JsonSchema }[];
  requestBody?: { content?: Record<string, { schema?: JsonSchema }> };
  security?: unknown[];
};

export interface ApiField {
  name: string; // dotted path inside the body, or the parameter name
  where: 'path' | 'query' | 'body';
  type: string; // "string ≤ 160", "one of: maxcut, bisection", "integer 2…8"
  required: boolean;
}

export interface ApiOperation {
  method: string; // upper case
  path: string; // /api/runs/{id}
  summary: string;
  access: string; // the document's access sentence
  signedIn: boolean;
  roles: string[] | null; // roles that may call it (member routes), from shared/permissions
  fields: ApiField[];
}

export interface ApiGroup {
  tag: string;
  operations: ApiOperation[];
}

import { ROLES, can, type Permission } from '../../shared/permissions';

/** "Members whose role has `runs:start`." → the roles of the one permission table that have it. */
export function rolesFor(access: string): string[] | null {
  const m = /`([a-z-]+:[a-z-]+)`/.exec(access);
  if (!m) return null;
  return ROLES.filter((r) => can(r, m[1] as Permission));
}

const METHOD_ORDER = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'];

/** A short human description of a schema's type and bounds. */
export function typeText(s: JsonSchema | undefined): string {
  if (!s) return 'any';
  if (s.const !== undefined) return JSON.stringify(s.const);
  if (Array.isArray(s.enum)) return `one of: ${s.enum.map((v) => String(v)).join(', ')}`;
  const alts = s.anyOf ?? s.oneOf;
  if (alts) return alts.map(typeText).join(' or ');
  const t = Array.isArray(s.type) ? s.type.join(' or ') : s.type ?? 'any';
  const range = (lo?: number, hi?: number) => (lo !== undefined && hi !== undefined ? ` ${lo}…${hi}` : lo !== undefined ? ` ≥ ${lo}` : hi !== undefined ? ` ≤ ${hi}` : '');
  if (t === 'string') return `text${range(s.minLength, s.maxLength)}`.replace(/ ≥ 1$/, ', not empty');
  if (t === 'integer' || t === 'number') return `${t === 'integer' ? 'whole number' : 'number'}${range(s.minimum, s.maximum !== undefined && s.maximum < 1e15 ? s.maximum : undefined)}`;
  if (t === 'array') return `list of ${typeText(s.items)}`;
  if (t === 'object' && !s.properties) return 'object';
  return t;
}

/** Body fields, flattened: objects contribute their properties as `parent.child`. */
export function bodyFields(schema: JsonSchema | undefined, prefix = '', parentRequired = true, depth = 0): ApiField[] {
  if (!schema?.properties || depth > 3) return [];
  const required = new Set(schema.required ?? []);
  const out: ApiField[] = [];
  for (const [key, child] of Object.entries(schema.properties)) {
    const name = prefix ? `${prefix}.${key}` : key;
    const isRequired = parentRequired && required.has(key);
    out.push({ name, where: 'body', type: typeText(child), required: isRequired });
    const inner = child.type === 'array' ? child.items : child;
    if (inner?.properties) out.push(...bodyFields(inner, child.type === 'array' ? `${name}[]` : name, isRequired, depth + 1));
  }
  return out;
}

export function describeApi(doc: OpenApiDocument): ApiGroup[] {
  const groups = new Map<string, ApiOperation[]>();
  for (const [path, methods] of Object.entries(doc.paths ?? {})) {
    for (const [method, op] of Object.entries(methods)) {
      const fields: ApiField[] = (op.parameters ?? [])
        .filter((p) => p.in === 'path' || p.in === 'query')
        .map((p) => ({ name: p.name, where: p.in as 'path' | 'query', type: typeText(p.schema), required: p.in === 'path' || !!p.required }));
      fields.push(...bodyFields(op.requestBody?.content?.['application/json']?.schema));
      const tag = op.tags?.[0] ?? 'other';
      const list = groups.get(tag) ?? [];
      list.push({ method: method.toUpperCase(), path, summary: op.summary ?? '', access: op.description ?? '', signedIn: (op.security ?? []).length > 0, roles: rolesFor(op.description ?? ''), fields });
      groups.set(tag, list);
    }
  }
  return [...groups.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([tag, operations]) => ({
      tag,
      operations: operations.sort((x, y) => x.path.localeCompare(y.path) || METHOD_ORDER.indexOf(x.method) - METHOD_ORDER.indexOf(y.method)),
    }));
}

/** Operations whose method, path, summary or field names contain every word of the filter. */
export function filterGroups(groups: ApiGroup[], filter: string): ApiGroup[] {
  const words = filter.toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0) return groups;
  return groups
    .map((g) => ({
      tag: g.tag,
      operations: g.operations.filter((o) => {
        const hay = `${g.tag} ${o.method} ${o.path} ${o.summary} ${o.fields.map((f) => f.name).join(' ')}`.toLowerCase();
        return words.every((w) => hay.includes(w));
      }),
    }))
    .filter((g) => g.operations.length > 0);
}
