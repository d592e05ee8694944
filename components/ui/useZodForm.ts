import { useState } from 'react';
import type { ZodType } from 'zod';
import { ApiError } from '../api/client';

/**
 * Form state validated by a shared zod schema: field errors from the client-side check and
 * from the server's 400 answer land in the same place, beside their fields.
 */
export function useZodForm<T extends Record<string, string>>(schema: ZodType, initial: T) {
  const [values, setValues] = useState<T>(initial);
  const [errors, setErrors] = useState<Partial<Record<keyof T | '_', string>>>({});
  const set = (key: keyof T) => (text: string) => {
    setValues((v) => ({ ...v, [key]: text }));
    setErrors((e) => ({ ...e, [key]: undefined, _: undefined }));
  };
  const validate = (): unknown | null => {
    const parsed = schema.safeParse(values);
    if (parsed.success) return parsed.data;
    const next: Partial<Record<string, string>> = {};
    for (const issue of parsed.error.issues) next[String(issue.path[0] ?? '_')] ??= issue.message;
    setErrors(next as typeof errors);
    return null;
  };
  const fromServer = (err: unknown) => {
    if (err instanceof ApiError) {
      const next: Partial<Record<string, string>> = { _: err.message };
      for (const [k, msgs] of Object.entries(err.fields ?? {})) next[k] = msgs[0];
      setErrors(next as typeof errors);
    } else setErrors({ _: 'Something went wrong. Try again.' } as typeof errors);
  };
  return { values, errors, set, validate, fromServer, setValues };
}
