import fc from 'fast-check';
import { z } from 'zod';
import { jsonSchemaOf, validish, hostile, replaceAt } from './schema-arbitrary';
import { ChangeRoleSchema, InviteSchema, AuditQuerySchema, CreateTokenSchema } from '../../../shared/schemas/auth';
import { RenameBodySchema } from '../../../shared/schemas/networks';

/**
 * The body generator of the API fuzz suite (tests/api/fuzz.test.ts) must really aim at the
 * declared shape, or the fuzzing would only ever exercise the 400 path. Checked against the
 * schemas themselves: most `validish` values parse, `hostile` ones mostly do not.
 */
const schemas = { ChangeRoleSchema, InviteSchema, AuditQuerySchema, CreateTokenSchema, RenameBodySchema, Nested: z.object({ a: z.array(z.object({ n: z.number().int().min(1).max(9), s: z.enum(['x', 'y']) })).min(1), b: z.boolean().optional() }) };

describe.each(Object.entries(schemas))('%s', (_name, schema) => {
  test('validish values mostly parse; hostile ones mostly do not', () => {
    const json = jsonSchemaOf(schema);
    const good = fc.sample(validish(json), { numRuns: 200, seed: 7 });
    const passed = good.filter((v) => schema.safeParse(v).success).length;
    expect(passed / good.length).toBeGreaterThan(0.8);
    const bad = fc.sample(hostile(validish(json)), { numRuns: 200, seed: 8 });
    const refused = bad.filter((v) => !schema.safeParse(v).success).length;
    expect(refused / bad.length).toBeGreaterThan(0.5);
  });
});

test('replaceAt replaces exactly one spot and leaves the input alone', () => {
  const v = { a: [1, { b: 2 }], c: 'x' };
  expect(replaceAt(v, 0, 'root')).toBe('root');
  const spots = [1, 2, 3, 4, 5].map((i) => replaceAt(v, i, '!'));
  expect(spots).toContainEqual({ a: '!', c: 'x' });
  expect(spots).toContainEqual({ a: [1, { b: '!' }], c: 'x' });
  expect(spots).toContainEqual({ a: [1, { b: 2 }], c: '!' });
  expect(v).toEqual({ a: [1, { b: 2 }], c: 'x' });
});
