import type { NetworkDocument } from '../engine/network/types';

/** What changed between two network documents (depots by id, lanes by unordered depot pair). */
export interface NetworkDifference {
  addedDepots: string[];
  removedDepots: string[];
  changedDepots: { id: string; fields: string[] }[];
  addedLanes: { from: string; to: string; weight: number }[];
  removedLanes: { from: string; to: string; weight: number }[];
  weightChanges: { from: string; to: string; before: number; after: number }[];
}

/** Lanes keyed by unordered pair, parallel lanes summed (the solvers' merging rule, build.ts). */
function laneMap(doc: NetworkDocument): Map<string, { from: string; to: string; weight: number }> {
  const out = new Map<string, { from: string; to: string; weight: number }>();
  for (const l of doc.lanes) {
    const [a, b] = l.from < l.to ? [l.from, l.to] : [l.to, l.from];
    const key = `${a}\u0000${b}`;
    const prev = out.get(key);
    if (prev) prev.weight += l.weight;
    else out.set(key, { from: l.from, to: l.to, weight: l.weight });
  }
  return out;
}

const DEPOT_FIELDS = ['name', 'lat', 'lon', 'weight'] as const;

export function compareNetworks(before: NetworkDocument, after: NetworkDocument): NetworkDifference {
  const oldDepots = new Map(before.depots.map((d) => [d.id, d]));
  const newDepots = new Map(after.depots.map((d) => [d.id, d]));
  const addedDepots = after.depots.filter((d) => !oldDepots.has(d.id)).map((d) => d.id);
  const removedDepots = before.depots.filter((d) => !newDepots.has(d.id)).map((d) => d.id);
  const changedDepots: NetworkDifference['changedDepots'] = [];
  for (const d of after.depots) {
    const o = oldDepots.get(d.id);
    if (!o) continue;
    const fields = DEPOT_FIELDS.filter((k) => o[k] !== d[k]);
    if (fields.length > 0) changedDepots.push({ id: d.id, fields: [...fields] });
  }
  const oldLanes = laneMap(before), newLanes = laneMap(after);
  const addedLanes: NetworkDifference['addedLanes'] = [];
  const weightChanges: NetworkDifference['weightChanges'] = [];
  for (const [key, l] of newLanes) {
    const o = oldLanes.get(key);
    if (!o) addedLanes.push(l);
    else if (Math.abs(o.weight - l.weight) > 1e-12 * Math.max(1, Math.abs(o.weight))) weightChanges.push({ from: o.from, to: o.to, before: o.weight, after: l.weight });
  }
  const removedLanes = [...oldLanes].filter(([key]) => !newLanes.has(key)).map(([, l]) => l);
  return { addedDepots, removedDepots, changedDepots, addedLanes, removedLanes, weightChanges };
}
