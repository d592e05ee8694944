import type { NetworkDocument } from '../engine/network/types';
import type { NetworkSummary } from '../schemas/networks';

/**
 * Figures for a network document: counts, total volume, connected components (union–find)
 * and the range of distinct-neighbour counts. Lanes to unknown depots are skipped (documents
 * are checked before they are stored; previews may still hold such rows).
 */
export function summariseNetwork(doc: NetworkDocument): NetworkSummary {
  const n = doc.depots.length;
  const index = new Map<string, number>();
  doc.depots.forEach((d, i) => index.set(d.id, i));
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]];
      i = parent[i];
    }
    return i;
  };
  const neighbours: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
  let totalVolume = 0;
  let components = n;
  for (const l of doc.lanes) {
    totalVolume += l.weight;
    const a = index.get(l.from), b = index.get(l.to);
    if (a === undefined || b === undefined || a === b) continue;
    neighbours[a].add(b);
    neighbours[b].add(a);
    const ra = find(a), rb = find(b);
    if (ra !== rb) {
      parent[ra] = rb;
      components--;
    }
  }
  let minDegree = n > 0 ? Infinity : 0, maxDegree = 0;
  for (const s of neighbours) {
    if (s.size < minDegree) minDegree = s.size;
    if (s.size > maxDegree) maxDegree = s.size;
  }
  const hasCoordinates = n > 0 && doc.depots.every((d) => Number.isFinite(d.lat) && Number.isFinite(d.lon));
  // Round away float noise from summing decimals (12.1 + 7.2 …) so lists show clean figures.
  // Only where ×1e9 stays exact: beyond 1e6 there is no such noise to remove, and ×1e9 of a
  // very large total would overflow to Infinity (a lane of 1e300 did, and the save failed).
  if (Math.abs(totalVolume) < 1e6) totalVolume = Math.round(totalVolume * 1e9) / 1e9;
  return { depots: n, lanes: doc.lanes.length, totalVolume, components, minDegree, maxDegree, hasCoordinates };
}
