/**
 * Settings parsing for the classical solvers: plain objects in, defaulted plain objects out,
 * one message per bad field (the UI shows them beside the fields).
 */

/** Thrown by parseSettings; `fields` maps each bad field to what is wrong and what to give. */
export class SettingsError extends Error {
  constructor(public readonly fields: Record<string, string>) {
    super(Object.entries(fields).map(([k, v]) => `${k}: ${v}`).join('; '));
    this.name = 'SettingsError';
  }
}

/** One numeric field: default, inclusive range, whole numbers only when `integer`. */
export interface NumberField {
  default: number;
  min: number;
  max: number;
  integer?: boolean;
}

export type NumberSchema = Record<string, NumberField>;

/**
 * Read `input` against a schema of numeric fields. Unknown fields are refused so that
 * typos ("tenur") do not silently fall back to defaults.
 */
export function parseNumberSettings<S extends NumberSchema>(input: unknown, schema: S): { [K in keyof S]: number } {
  const errors: Record<string, string> = {};
  const out: Record<string, number> = {};
  if (input !== undefined && input !== null && (typeof input !== 'object' || Array.isArray(input))) {
    throw new SettingsError({ settings: 'give the settings as an object of named fields' });
  }
  const given = (input ?? {}) as Record<string, unknown>;
  for (const key of Object.keys(given)) {
    if (!(key in schema)) errors[key] = `unknown setting; allowed: ${Object.keys(schema).join(', ') || 'none'}`;
  }
  for (const [key, field] of Object.entries(schema)) {
    const raw = given[key];
    if (raw === undefined) {
      out[key] = field.default;
      continue;
    }
    if (typeof raw !== 'number' || !Number.isFinite(raw)) {
      errors[key] = `must be a number (got ${JSON.stringify(raw)})`;
      continue;
    }
    if (field.integer && !Number.isInteger(raw)) {
      errors[key] = `must be a whole number (got ${raw})`;
      continue;
    }
    if (raw < field.min || raw > field.max) {
      errors[key] = `must lie in ${field.min}…${field.max} (got ${raw})`;
      continue;
    }
    out[key] = raw;
  }
  if (Object.keys(errors).length > 0) throw new SettingsError(errors);
  return out as { [K in keyof S]: number };
}
