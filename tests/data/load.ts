/**
 * The one reader for the open benchmark data kept in this folder (tests and benchmarks ask it;
 * the engine never reads files). Layout and provenance: tests/data/README.md and each folder's
 * SOURCE.md.
 *
 *   gset/G<k>.txt, gset/best-known.csv    — G-set (Helmberg & Rendl 2000), best-known cuts
 *                                           (Benlic & Hao 2013) and certified SDP bounds
 *   biqmac/<name>, biqmac/OPTIMA.csv      — Biq Mac rudy instances (Wiegele 2007), optima
 *
 * Instance files: first line "n m", then m lines "i j w" with 1-based depot ids.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import Papa from 'papaparse';

export type DataSet = 'gset' | 'biqmac';
/** 0-based endpoints and the lane weight. */
export type Edge = [number, number, number];

export const DATA_DIR = __dirname;

export interface GsetRow {
  instance: string; n: number; m: number; best_known: number; weights: string; type: string;
  status: string; source: string; sdp_upper_bound: number;
}
export interface BiqmacRow {
  instance: string; n: number; m: number; weights: string; optimum: number;
  /** proven (completed branch-and-bound), cited (quoted from the library), from-memory (a lead only). */
  status: 'proven' | 'cited' | 'from-memory'; evidence: string;
}

/** Absolute path of an instance file (`G11`, `G11.txt` and `g05_60.0` all work). */
export function instancePath(set: DataSet, name: string): string {
  const file = set === 'gset' && !name.endsWith('.txt') ? `${name}.txt` : name;
  const full = path.join(DATA_DIR, set, file);
  if (path.dirname(full) !== path.join(DATA_DIR, set)) throw new Error(`not an instance name: ${name}`);
  return full;
}

export const instanceText = (set: DataSet, name: string): string => fs.readFileSync(instancePath(set, name), 'utf8');

/** Parses an instance and checks its header against the lanes found. */
export function readInstance(set: DataSet, name: string): { n: number; edges: Edge[] } {
  const lines = instanceText(set, name).trim().split(/\r?\n/);
  const [n, m] = lines[0].trim().split(/\s+/).map(Number);
  const edges: Edge[] = [];
  for (const line of lines.slice(1)) {
    const t = line.trim();
    if (!t) continue;
    const [i, j, w] = t.split(/\s+/).map(Number);
    edges.push([i - 1, j - 1, w]);
  }
  if (edges.length !== m) throw new Error(`${set}/${name}: header says ${m} lanes, found ${edges.length}`);
  return { n, edges };
}

function table(set: DataSet, file: string): Array<Record<string, string>> {
  const text = fs.readFileSync(path.join(DATA_DIR, set, file), 'utf8');
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
  if (parsed.errors.length) throw new Error(`${set}/${file}: ${parsed.errors[0].message}`);
  return parsed.data;
}

const NUMERIC = new Set(['n', 'm', 'best_known', 'sdp_upper_bound', 'optimum']);
const typed = <T>(rows: Array<Record<string, string>>): T[] =>
  rows.map((r) => Object.fromEntries(Object.entries(r).map(([k, v]) => [k, NUMERIC.has(k) ? Number(v) : v])) as T);

export const gsetTable = (): GsetRow[] => typed<GsetRow>(table('gset', 'best-known.csv'));
export const biqmacTable = (): BiqmacRow[] => typed<BiqmacRow>(table('biqmac', 'OPTIMA.csv'));

export function gsetRow(instance: string): GsetRow {
  const row = gsetTable().find((r) => r.instance === instance);
  if (!row) throw new Error(`G-set table has no ${instance}`);
  return row;
}
export function biqmacRow(instance: string): BiqmacRow {
  const row = biqmacTable().find((r) => r.instance === instance);
  if (!row) throw new Error(`Biq Mac table has no ${instance}`);
  return row;
}

/** Instance files present in a folder (the tables may list more than we keep). */
export function instanceNames(set: DataSet): string[] {
  const files = fs.readdirSync(path.join(DATA_DIR, set));
  return set === 'gset'
    ? files.filter((f) => /^G\d+\.txt$/.test(f)).map((f) => f.slice(0, -4)).sort((a, b) => Number(a.slice(1)) - Number(b.slice(1)))
    : files.filter((f) => /^[a-z0-9]+_\d+\.\d+$/.test(f)).sort();
}
