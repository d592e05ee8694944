/**
 * Solver settings as zod schemas (one per solver, shared by the API, the app and the CLI):
 * small field builders that keep our messages ("must lie in 1…10 (got 12)"), and the one parse
 * that turns zod issues into a SettingsError with one message per field.
 */
import { z } from 'zod';
import { SettingsError } from '../classical/settings';

export { SettingsError };

const got = (input: unknown) => JSON.stringify(input);

/** A number in [min, max] with a default; whole numbers only when `integer`. */
export function numberField(def: number, min: number, max: number, integer = false) {
  let field = z.number({ error: (i) => `must be a number (got ${got(i.input)})` });
  if (integer) field = field.int({ error: (i) => `must be a whole number (got ${got(i.input)})` });
  const range = (i: { input?: unknown }) => `must lie in ${min}…${max} (got ${got(i.input)})`;
  return field.min(min, { error: range }).max(max, { error: range }).default(def);
}

export const intField = (def: number, min: number, max: number) => numberField(def, min, max, true);

/** One of the given words. */
export function choiceField<const T extends readonly [string, ...string[]]>(choices: T, def: T[number]) {
  return z.enum(choices, { error: (i) => `must be one of ${choices.join(', ')} (got ${got(i.input)})` }).default(def as never);
}

export const booleanField = (def: boolean) => z.boolean({ error: (i) => `must be true or false (got ${got(i.input)})` }).default(def);

/** The settings object: unknown fields are refused so a typo ("tenur") never falls back to a default. */
export const settingsObject = <S extends z.ZodRawShape>(shape: S) => z.strictObject(shape);

/** The field names of a settings schema (an object, or an object piped into a transform). */
export function settingNames(schema: z.ZodType): string[] {
  if (schema instanceof z.ZodObject) return Object.keys(schema.shape);
  if (schema instanceof z.ZodPipe) return settingNames(schema.in as z.ZodType);
  return [];
}

/** Parse `input` (undefined or null = all defaults) against a settings schema; SettingsError on bad fields. */
export function parseSettingsWith<T>(schema: z.ZodType<T>, input: unknown): T {
  const r = schema.safeParse(input ?? {});
  if (r.success) return r.data;
  const fields: Record<string, string> = {};
  for (const issue of r.error.issues) {
    if (issue.code === 'unrecognized_keys') {
      const allowed = settingNames(schema).join(', ') || 'none';
      for (const key of issue.keys) fields[key] = `unknown setting; allowed: ${allowed}`;
    } else if (issue.path.length === 0) fields.settings = 'give the settings as an object of named fields';
    else fields[String(issue.path[0])] ??= issue.message;
  }
  throw new SettingsError(fields);
}
