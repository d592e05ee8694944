import fc from 'fast-check';
import { z, type ZodType } from 'zod';

/**
 * fast-check arbitraries for request bodies, read from a route's zod schema through its JSON
 * Schema (zod's own `toJSONSchema`): `validish` keeps to the declared shape (types, enums, bounds,
 * required keys), `hostile` is the same shape with one spot replaced by something nasty (wrong
 * type, huge or odd unicode string, deep nesting, negative/huge/non-finite numbers, prototype keys).
 */
type Json = Record<string, unknown>;

export const jsonSchemaOf = (schema: ZodType): Json => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Json;

const MAX_DEPTH = 4;

/** Values that break naive handlers; JSON.stringify turns NaN/Infinity into null, as a browser would. */
export const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(null, true, false, 0, -1, -0, 1e308, -1e308, Number.MAX_SAFE_INTEGER + 2, 0.5, NaN, Infinity, '', ' ', '0', '-1', 'NaN', 'null', '[]', '{}'),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }), // lone surrogates, control characters
  fc.constantFrom('\u0000', '\u202e\u0041', '𝔘𝔫𝔦𝔠𝔬𝔡𝔢', 'é'.normalize('NFD'), "'; DROP TABLE networks; --", '<script>alert(1)</script>', '../../etc/passwd', '%00', '${jndi:x}'),
  fc.integer({ min: 100_000, max: 300_000 }).map((n) => 'x'.repeat(n)), // huge string
  fc.integer({ min: 50, max: 400 }).map((d) => { let v: unknown = 1; for (let i = 0; i < d; i++) v = [v]; return v; }), // deep nesting
  fc.integer({ min: 50, max: 400 }).map((d) => { let v: unknown = {}; for (let i = 0; i < d; i++) v = { a: v }; return v; }),
  fc.constant(JSON.parse('{"__proto__": {"polluted": true}, "constructor": {"prototype": {"polluted": true}}}')),
  fc.array(fc.anything({ maxDepth: 2 }), { maxLength: 5 }),
  fc.integer({ min: 10_000, max: 60_000 }).map((n) => Array.from({ length: n }, (_, i) => i)), // long array
);

function resolve(schema: Json, root: Json): Json {
  const ref = schema.$ref as string | undefined;
  if (!ref?.startsWith('#/')) return schema;
  let node: unknown = root;
  for (const part of ref.slice(2).split('/')) node = (node as Json)?.[part];
  return (node as Json) ?? {};
}

/** A value that fits the JSON Schema's declared shape (mostly valid; bounds are aimed at, not proven). */
export function validish(schema: Json, root: Json = schema, depth = 0): fc.Arbitrary<unknown> {
  const s = resolve(schema, root);
  if (depth > MAX_DEPTH) return fc.constant(null);
  if ('const' in s) return fc.constant(s.const);
  if (Array.isArray(s.enum)) return fc.constantFrom(...(s.enum as unknown[]));
  for (const key of ['anyOf', 'oneOf'] as const) {
    if (Array.isArray(s[key])) return fc.oneof(...(s[key] as Json[]).map((x) => validish(x, root, depth + 1)));
  }
  if (Array.isArray(s.allOf)) return validish(Object.assign({}, ...(s.allOf as Json[]).map((x) => resolve(x, root))), root, depth);
  const type = Array.isArray(s.type) ? (s.type as string[])[0] : (s.type as string | undefined);
  switch (type) {
    case 'string': {
      const min = (s.minLength as number) ?? 0;
      const max = Math.min((s.maxLength as number) ?? 60, 200);
      // zod's e-mail rule is stricter than RFC 5322, so build plain ones.
      if (s.format === 'email') return fc.tuple(fc.stringMatching(/^[a-z][a-z0-9.]{0,10}[a-z0-9]$/), fc.stringMatching(/^[a-z]{2,10}$/)).filter(([l]) => !l.includes('..')).map(([l, d]) => `${l}@${d}.example`);
      return fc.string({ minLength: min, maxLength: Math.max(min, max), unit: fc.oneof(fc.constantFrom(...'abcxyz019 -_'), fc.string({ unit: 'grapheme', minLength: 1, maxLength: 1 })) });
    }
    case 'integer': {
      const lo = s.minimum as number | undefined ?? ((s.exclusiveMinimum as number | undefined) !== undefined ? (s.exclusiveMinimum as number) + 1 : -1000);
      const hi = s.maximum as number | undefined ?? ((s.exclusiveMaximum as number | undefined) !== undefined ? (s.exclusiveMaximum as number) - 1 : 1000);
      return fc.integer({ min: Math.max(lo, -2147483648), max: Math.min(hi, 2147483647) });
    }
    case 'number': {
      const lo = (s.minimum ?? s.exclusiveMinimum ?? -1000) as number;
      const hi = (s.maximum ?? s.exclusiveMaximum ?? 1000) as number;
      return fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });
    }
    case 'boolean':
      return fc.boolean();
    case 'null':
      return fc.constant(null);
    case 'array': {
      const items = (s.items as Json | undefined) ?? {};
      const min = (s.minItems as number) ?? 0;
      return fc.array(validish(items, root, depth + 1), { minLength: min, maxLength: Math.max(min, Math.min((s.maxItems as number) ?? 4, 6)) });
    }
    case 'object': {
      const props = (s.properties as Record<string, Json> | undefined) ?? {};
      const required = new Set((s.required as string[] | undefined) ?? []);
      const keys = Object.keys(props);
      if (keys.length === 0 && s.additionalProperties && typeof s.additionalProperties === 'object') {
        return fc.dictionary(fc.string({ minLength: 1, maxLength: 8 }), validish(s.additionalProperties as Json, root, depth + 1), { maxKeys: 3 });
      }
      const shape: Record<string, fc.Arbitrary<unknown>> = {};
      for (const k of keys) shape[k] = validish(props[k], root, depth + 1);
      return fc.record(shape, { requiredKeys: keys.filter((k) => required.has(k)) });
    }
    default:
      return fc.oneof(fc.string({ maxLength: 10 }), fc.integer(), fc.boolean(), fc.constant(null));
  }
}

/** Replace the value at one path of `value` (objects and arrays) by `replacement`. */
export function replaceAt(value: unknown, pick: number, replacement: unknown): unknown {
  const spots: (string | number)[][] = [[]];
  const walk = (v: unknown, at: (string | number)[]) => {
    if (at.length > 6) return;
    if (Array.isArray(v)) v.forEach((x, i) => { spots.push([...at, i]); walk(x, [...at, i]); });
    else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) { spots.push([...at, k]); walk(x, [...at, k]); }
  };
  walk(value, []);
  const path = spots[pick % spots.length];
  if (path.length === 0) return replacement;
  const copy = structuredClone(value) as Record<string | number, unknown>;
  let node = copy;
  for (const p of path.slice(0, -1)) node = node[p] as Record<string | number, unknown>;
  node[path[path.length - 1]] = replacement;
  return copy;
}

/** A valid-ish body with one spot (or the whole body, or an extra key) made hostile. */
export function hostile(base: fc.Arbitrary<unknown>): fc.Arbitrary<unknown> {
  return fc.oneof(
    fc.tuple(base, fc.nat(), nastyValue).map(([v, pick, nasty]) => replaceAt(v, pick, nasty)),
    fc.tuple(base, fc.string({ minLength: 1, maxLength: 12 }), nastyValue).map(([v, key, nasty]) => (v && typeof v === 'object' && !Array.isArray(v) ? { ...v, [key]: nasty } : nasty)),
    nastyValue,
  );
}
