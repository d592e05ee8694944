import { z } from 'zod';
import type { Depot, Lane, NetworkDocument } from '../engine/network/types';
import { emptyResult, finishNetwork, sizeIssue, type DraftNetwork } from './finish';
import type { FormatIssue, ParseResult } from './types';

/**
 * Spinyard's own network document:
 *   { "format": "spinyard-network", "version": 1, "name": "…",
 *     "depots": [{ "id": "A", "name": "…", "lat": 51.5, "lon": -0.1, "weight": 2 }, …],
 *     "lanes":  [{ "from": "A", "to": "B", "weight": 12.5 }, …] }
 * Ids are strings (numbers are accepted and turned into strings). Lane weights may be negative
 * (benchmark instances); depot weights must be ≥ 0.
 */
export const NETWORK_FORMAT_TAG = 'spinyard-network';
export const NETWORK_FORMAT_VERSION = 1;

const id = z.union([z.string(), z.number().int()]).transform((v) => String(v));
export const depotSchema = z.object({
  id,
  name: z.string().optional(),
  lat: z.number().optional(),
  lon: z.number().optional(),
  weight: z.number().optional(),
});
export const laneSchema = z.object({ from: id, to: id, weight: z.number() });

const DEPOT_KEYS = new Set(Object.keys(depotSchema.shape));
const LANE_KEYS = new Set(Object.keys(laneSchema.shape));

/** Words for a zod issue on one row, with the fix. */
function describeZodIssue(issue: z.core.$ZodIssue, row: unknown): string {
  const field = issue.path.length > 0 ? `"${issue.path.join('.')}"` : 'the entry';
  const value = issue.path.length > 0 && row && typeof row === 'object' ? (row as Record<string, unknown>)[String(issue.path[0])] : row;
  const shown = value === undefined ? 'nothing' : JSON.stringify(value)?.slice(0, 40) ?? String(value);
  if (issue.code === 'invalid_type' || issue.code === 'invalid_union') {
    if (value === undefined) return `${field} is missing; add it`;
    const expected = issue.code === 'invalid_type' ? issue.expected : 'string';
    const example = expected === 'number' ? 'a JSON number such as 12.5' : expected === 'object' ? 'an object such as {"id": "A"}' : 'a string such as "A"';
    return `${field} is ${shown}; write ${example}`;
  }
  return `${field}: ${issue.message}`;
}

function lineOfPosition(text: string, position: number): number {
  let line = 1;
  for (let i = 0; i < position && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

/** Reads a Spinyard network document; every row problem names the depot or lane row. */
export function parseNetworkJson(content: string, file?: string): ParseResult {
  const big = sizeIssue(content, file);
  if (big) return emptyResult([big]);
  const f = file !== undefined ? { file } : {};
  const issues: FormatIssue[] = [];
  let data: unknown;
  try {
    data = JSON.parse(content);
  } catch (e) {
    const msg = e instanceof Error ? e.message : String(e);
    const m = /position (\d+)/.exec(msg);
    const line = m ? lineOfPosition(content, Number(m[1])) : undefined;
    return emptyResult([{ ...f, ...(line ? { line } : {}), severity: 'error', message: `the file is not valid JSON (${msg.replace(/\s+/g, ' ').slice(0, 120)}); fix the syntax, e.g. with a JSON validator` }]);
  }
  if (!data || typeof data !== 'object' || Array.isArray(data)) {
    return emptyResult([{ ...f, severity: 'error', message: `the file must hold one JSON object {"format": "${NETWORK_FORMAT_TAG}", "version": 1, "depots": [...], "lanes": [...]}` }]);
  }
  const top = data as Record<string, unknown>;
  if (top.format !== NETWORK_FORMAT_TAG) {
    issues.push({ ...f, severity: 'error', message: top.format === undefined ? `the document has no "format" field; add "format": "${NETWORK_FORMAT_TAG}"` : `"format" is ${JSON.stringify(top.format)}; a Spinyard network document has "format": "${NETWORK_FORMAT_TAG}"` });
    return emptyResult(issues);
  }
  if (top.version !== NETWORK_FORMAT_VERSION) {
    const newer = typeof top.version === 'number' && top.version > NETWORK_FORMAT_VERSION;
    issues.push({ ...f, severity: 'error', message: newer ? `the document has version ${top.version}, newer than this Spinyard reads (${NETWORK_FORMAT_VERSION}); update Spinyard` : `"version" must be ${NETWORK_FORMAT_VERSION}; found ${JSON.stringify(top.version)}` });
    return emptyResult(issues);
  }
  for (const key of ['depots', 'lanes'] as const) {
    if (!Array.isArray(top[key])) {
      issues.push({ ...f, severity: 'error', message: `"${key}" must be an array (found ${top[key] === undefined ? 'nothing' : typeof top[key]}); write "${key}": [ … ]` });
    }
  }
  if (issues.length > 0) return emptyResult(issues);
  const draft: DraftNetwork = { depots: [], depotAt: [], lanes: [], laneAt: [] };
  if (top.name !== undefined) {
    if (typeof top.name === 'string') draft.name = top.name;
    else issues.push({ ...f, severity: 'warning', message: `"name" should be a string; it was ignored` });
  }
  const unknownKeys = new Set<string>();
  const readRows = <T>(rows: unknown[], schema: z.ZodType<T>, where: 'depots' | 'lanes', keys: Set<string>, push: (v: T, row: number) => void) => {
    rows.forEach((raw, i) => {
      const row = i + 1;
      const parsed = schema.safeParse(raw);
      if (!parsed.success) {
        for (const zi of parsed.error.issues.slice(0, 3)) {
          issues.push({ ...f, where, row, severity: 'error', message: describeZodIssue(zi, raw) });
        }
        return;
      }
      if (raw && typeof raw === 'object') for (const k of Object.keys(raw)) if (!keys.has(k)) unknownKeys.add(`${where}.${k}`);
      push(parsed.data, row);
    });
  };
  readRows(top.depots as unknown[], depotSchema, 'depots', DEPOT_KEYS, (d, row) => {
    const depot: Depot = { id: d.id };
    for (const k of ['name', 'lat', 'lon', 'weight'] as const) if (d[k] !== undefined) (depot as unknown as Record<string, unknown>)[k] = d[k];
    draft.depots.push(depot);
    draft.depotAt.push({ ...f, row });
  });
  readRows(top.lanes as unknown[], laneSchema, 'lanes', LANE_KEYS, (l, row) => {
    const lane: Lane = { from: l.from, to: l.to, weight: l.weight };
    draft.lanes.push(lane);
    draft.laneAt.push({ ...f, row });
  });
  if (unknownKeys.size > 0) issues.push({ ...f, severity: 'warning', message: `field(s) ${[...unknownKeys].slice(0, 8).join(', ')} are not part of the format and were ignored` });
  const known = new Set(['format', 'version', 'name', 'depots', 'lanes']);
  const extraTop = Object.keys(top).filter((k) => !known.has(k));
  if (extraTop.length > 0) issues.push({ ...f, severity: 'warning', message: `top-level field(s) ${extraTop.slice(0, 8).join(', ')} are not part of the format and were ignored` });
  return finishNetwork(draft, issues, { rejectNegativeWeights: false });
}

/** Writes a network document in Spinyard's JSON format (one depot or lane per line). */
export function writeNetworkJson(doc: NetworkDocument): string {
  const head: Record<string, unknown> = { format: NETWORK_FORMAT_TAG, version: NETWORK_FORMAT_VERSION };
  if (doc.name !== undefined) head.name = doc.name;
  const rows = (items: object[]) => (items.length === 0 ? '[]' : `[\n    ${items.map((x) => JSON.stringify(x)).join(',\n    ')}\n  ]`);
  const headText = Object.entries(head).map(([k, v]) => `  ${JSON.stringify(k)}: ${JSON.stringify(v)}`).join(',\n');
  const depots = doc.depots.map((d) => {
    const out: Record<string, unknown> = { id: d.id };
    for (const k of ['name', 'lat', 'lon', 'weight'] as const) if (d[k] !== undefined) out[k] = d[k];
    return out;
  });
  const lanes = doc.lanes.map((l) => ({ from: l.from, to: l.to, weight: l.weight }));
  return `{\n${headText},\n  "depots": ${rows(depots)},\n  "lanes": ${rows(lanes)}\n}\n`;
}
