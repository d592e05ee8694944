import { LaneVolumeSchema } from '../../shared/schemas/networks';

/**
 * A lane volume typed by a person: the number, or a message saying what to write instead
 * (the shared zod rule decides, so the server answers the same).
 */
export function parseVolume(text: string): number | string {
  const t = text.trim();
  if (/^[+-]?\d+,\d+$/.test(t)) return `"${t}" uses a decimal comma; write ${t.replace(',', '.')}`;
  const v = Number(t);
  if (t === '' || !Number.isFinite(v)) return `"${text}" is not a number; write a volume such as 12.5`;
  const parsed = LaneVolumeSchema.safeParse(v);
  return parsed.success ? parsed.data : parsed.error.issues[0].message;
}
