import { DEPOT_ID_MAX, DEPOT_NAME_MAX } from './limits';
import type { CompactNetwork, NetworkDocument, NetworkIssue } from './types';

/** Thrown when a network document cannot be used; every issue names its row. */
export class NetworkError extends Error {
  constructor(public readonly issues: NetworkIssue[]) {
    super(issues.map((i) => `${i.where} row ${i.row}: ${i.message}`).join('; '));
    this.name = 'NetworkError';
  }
}

/**
 * Totals must stay finite: cut values, balance limits and stored summaries add weights up, and a
 * sum past the largest double (about 1.8e308) becomes Infinity, which neither the solvers nor the
 * database can use. Reported at the row where the running sum of magnitudes overflows.
 */
function totalsIssues(doc: NetworkDocument): NetworkIssue[] {
  const out: NetworkIssue[] = [];
  let lanes = 0, depots = 0;
  for (let i = 0; i < doc.lanes.length; i++) {
    const w = doc.lanes[i].weight;
    if (typeof w !== 'number' || !Number.isFinite(w)) continue;
    lanes += Math.abs(w);
    if (!Number.isFinite(lanes)) {
      out.push({ where: 'lanes', row: i + 1, message: `the lane weights up to this lane add up to more than ${Number.MAX_VALUE.toPrecision(2)}, the largest number that can be stored; use a larger unit (thousands of tonnes instead of tonnes, say)` });
      break;
    }
  }
  for (let i = 0; i < doc.depots.length; i++) {
    const w = doc.depots[i].weight;
    if (typeof w !== 'number' || !Number.isFinite(w)) continue;
    depots += Math.abs(w);
    if (!Number.isFinite(depots)) {
      out.push({ where: 'depots', row: i + 1, message: `the depot weights up to this depot add up to more than ${Number.MAX_VALUE.toPrecision(2)}, the largest number that can be stored; use a larger unit` });
      break;
    }
  }
  return out;
}

/** Problems in a document without throwing (previews show them all at once). */
export function checkNetwork(doc: NetworkDocument): NetworkIssue[] {
  const issues: NetworkIssue[] = [];
  const seen = new Set<string>();
  doc.depots.forEach((d, i) => {
    const row = i + 1;
    if (typeof d.id !== 'string' || d.id.trim() === '') {
      issues.push({ where: 'depots', row, message: 'depot id is empty; give every depot an id' });
      return;
    }
    if (d.id.trim().length > DEPOT_ID_MAX) issues.push({ where: 'depots', row, message: `depot id "${d.id.slice(0, 40)}…" has ${d.id.trim().length} characters; keep depot ids to ${DEPOT_ID_MAX} characters` });
    if (typeof d.name === 'string' && d.name.trim().length > DEPOT_NAME_MAX) issues.push({ where: 'depots', row, message: `depot "${d.id.slice(0, 40)}" has a ${d.name.trim().length}-character name; keep depot names to ${DEPOT_NAME_MAX} characters` });
    if (seen.has(d.id)) issues.push({ where: 'depots', row, message: `depot id "${d.id}" appears twice; ids must be unique` });
    seen.add(d.id);
    if (d.weight !== undefined && (!Number.isFinite(d.weight) || d.weight < 0)) {
      issues.push({ where: 'depots', row, message: `depot "${d.id}" has weight ${d.weight}; use a finite number ≥ 0` });
    }
    for (const key of ['lat', 'lon'] as const) {
      const v = d[key];
      if (v !== undefined && !Number.isFinite(v)) issues.push({ where: 'depots', row, message: `depot "${d.id}" has ${key} ${v}; use a number or leave it out` });
    }
    if (d.lat !== undefined && Number.isFinite(d.lat) && Math.abs(d.lat) > 90) issues.push({ where: 'depots', row, message: `depot "${d.id}" has latitude ${d.lat}; it must lie in −90…90` });
    if (d.lon !== undefined && Number.isFinite(d.lon) && Math.abs(d.lon) > 180) issues.push({ where: 'depots', row, message: `depot "${d.id}" has longitude ${d.lon}; it must lie in −180…180` });
  });
  doc.lanes.forEach((l, i) => {
    const row = i + 1;
    if (!seen.has(l.from)) issues.push({ where: 'lanes', row, message: `lane starts at unknown depot "${l.from}"; add the depot or fix the id` });
    if (!seen.has(l.to)) issues.push({ where: 'lanes', row, message: `lane ends at unknown depot "${l.to}"; add the depot or fix the id` });
    if (l.from === l.to) issues.push({ where: 'lanes', row, message: `lane joins depot "${l.from}" to itself; self-loops carry no split information, remove it` });
    if (typeof l.weight !== 'number' || !Number.isFinite(l.weight)) issues.push({ where: 'lanes', row, message: `lane ${l.from}–${l.to} has weight ${String(l.weight)}; use a finite number` });
  });
  issues.push(...totalsIssues(doc));
  return issues;
}

/**
 * Compact form for solvers. Parallel lanes (either direction) are merged by summing their
 * weights; lanes whose merged weight is exactly 0 are kept (they change nothing but the count).
 */
export function buildCompactNetwork(doc: NetworkDocument): CompactNetwork {
  const issues = checkNetwork(doc);
  if (issues.length > 0) throw new NetworkError(issues);
  const n = doc.depots.length;
  const depotIds = doc.depots.map((d) => d.id);
  const index = new Map<string, number>();
  depotIds.forEach((id, i) => index.set(id, i));
  const merged = new Map<number, number>();
  const order: number[] = [];
  for (const l of doc.lanes) {
    let a = index.get(l.from)!;
    let b = index.get(l.to)!;
    if (a > b) [a, b] = [b, a];
    const key = a * n + b;
    const prev = merged.get(key);
    if (prev === undefined) {
      merged.set(key, l.weight);
      order.push(key);
    } else merged.set(key, prev + l.weight);
  }
  const m = order.length;
  const laneFrom = new Int32Array(m);
  const laneTo = new Int32Array(m);
  const laneWeight = new Float64Array(m);
  order.forEach((key, e) => {
    laneFrom[e] = Math.floor(key / n);
    laneTo[e] = key % n;
    laneWeight[e] = merged.get(key)!;
  });
  const depotWeight = new Float64Array(n);
  doc.depots.forEach((d, i) => (depotWeight[i] = d.weight ?? 1));
  return { n, depotIds, m, laneFrom, laneTo, laneWeight, depotWeight, ...buildAdjacency(n, laneFrom, laneTo, laneWeight) };
}

/** CSR adjacency from lane arrays (each lane appears once at each end). */
export function buildAdjacency(n: number, laneFrom: Int32Array, laneTo: Int32Array, laneWeight: Float64Array) {
  const m = laneFrom.length;
  const adjStart = new Int32Array(n + 1);
  for (let e = 0; e < m; e++) {
    adjStart[laneFrom[e] + 1]++;
    adjStart[laneTo[e] + 1]++;
  }
  for (let i = 0; i < n; i++) adjStart[i + 1] += adjStart[i];
  const fill = adjStart.slice(0, n);
  const adjIndex = new Int32Array(2 * m);
  const adjWeight = new Float64Array(2 * m);
  for (let e = 0; e < m; e++) {
    const a = laneFrom[e], b = laneTo[e], w = laneWeight[e];
    adjIndex[fill[a]] = b; adjWeight[fill[a]++] = w;
    adjIndex[fill[b]] = a; adjWeight[fill[b]++] = w;
  }
  return { adjStart, adjIndex, adjWeight };
}

/** Build a compact network straight from 0-based edge triples (tests, G-set files). */
export function compactFromEdges(n: number, edges: ReadonlyArray<readonly [number, number, number]>): CompactNetwork {
  return buildCompactNetwork({
    depots: Array.from({ length: n }, (_, i) => ({ id: String(i + 1) })),
    lanes: edges.map(([a, b, w]) => ({ from: String(a + 1), to: String(b + 1), weight: w })),
  });
}
