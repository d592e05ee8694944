import type { Depot, Lane, NetworkDocument } from '../../shared/engine/network/types';
import { fitProjection, hasAllCoordinates, layoutNetwork, unproject, type Positions, type Projection } from './layout';

/**
 * The network being edited: the document rows plus where each depot sits on the canvas.
 * Every edit returns a new draft (arrays are copied, never mutated) so undo can keep snapshots.
 */
export interface Draft {
  depots: Depot[];
  lanes: Lane[];
  /** xy[2i], xy[2i+1]: world position of depots[i]. */
  xy: Positions;
}

/** Indices into depots (never ids: the drawing and tables address rows by position). */
export interface Selection {
  depots: ReadonlySet<number>;
  lanes: ReadonlySet<number>;
}

export const emptySelection: Selection = { depots: new Set(), lanes: new Set() };

/**
 * A draft for a document. `knownXy` (positions from an earlier drawing of the same version, e.g.
 * the one just saved) is used when it fits, so saving never rearranges what the user drew.
 */
export function draftFromDocument(doc: Pick<NetworkDocument, 'depots' | 'lanes'>, knownXy?: Positions | null): { draft: Draft; projection: Projection | null } {
  if (knownXy && knownXy.length === 2 * doc.depots.length) {
    const projection = hasAllCoordinates(doc.depots) ? fitProjection(doc.depots) : null;
    // With coordinates the projection decides positions; the known ones are only for layouts.
    if (!projection) return { draft: { depots: doc.depots, lanes: doc.lanes, xy: knownXy }, projection };
  }
  const { xy, projection } = layoutNetwork(doc.depots, doc.lanes);
  return { draft: { depots: doc.depots, lanes: doc.lanes, xy }, projection };
}

export function toDocument(d: Draft, name?: string): NetworkDocument {
  return { ...(name !== undefined ? { name } : {}), depots: d.depots, lanes: d.lanes };
}

/** Lane ends as depot indices (−1 for an unknown id), ends[2e], ends[2e+1]. */
export function laneEnds(d: Pick<Draft, 'depots' | 'lanes'>): Int32Array {
  const index = new Map(d.depots.map((x, i) => [x.id, i]));
  const ends = new Int32Array(2 * d.lanes.length);
  d.lanes.forEach((l, e) => {
    ends[2 * e] = index.get(l.from) ?? -1;
    ends[2 * e + 1] = index.get(l.to) ?? -1;
  });
  return ends;
}

/** The first free id of the form D1, D2, … (short, and stable when depots are renamed). */
export function nextDepotId(d: Pick<Draft, 'depots'>): string {
  const taken = new Set(d.depots.map((x) => x.id));
  for (let k = d.depots.length + 1; ; k++) if (!taken.has(`D${k}`)) return `D${k}`;
}

export function addDepot(d: Draft, depot: { id: string; name?: string }, x: number, y: number, projection: Projection | null): Draft {
  const row: Depot = { id: depot.id, ...(depot.name ? { name: depot.name } : {}), ...(projection ? unproject(projection, x, y) : {}) };
  const xy = new Float64Array(d.xy.length + 2);
  xy.set(d.xy);
  xy[d.xy.length] = x;
  xy[d.xy.length + 1] = y;
  return { depots: [...d.depots, row], lanes: d.lanes, xy };
}

/** Adds lane a–b, or says why not (the rules of checkNetwork: no self-loops; one lane per pair here). */
export function addLane(d: Draft, a: number, b: number, weight: number): Draft | { problem: string } {
  if (a === b) return { problem: 'a lane needs two different depots' };
  const from = d.depots[a].id, to = d.depots[b].id;
  const existing = d.lanes.findIndex((l) => (l.from === from && l.to === to) || (l.from === to && l.to === from));
  if (existing >= 0) return { problem: `${from} and ${to} are already joined; tap that lane to change its volume` };
  return { depots: d.depots, lanes: [...d.lanes, { from, to, weight }], xy: d.xy };
}

export function moveDepot(d: Draft, i: number, x: number, y: number, projection: Projection | null): Draft {
  const xy = d.xy.slice();
  xy[2 * i] = x;
  xy[2 * i + 1] = y;
  if (!projection) return { ...d, xy };
  const depots = d.depots.slice();
  depots[i] = { ...depots[i], ...unproject(projection, x, y) };
  return { depots, lanes: d.lanes, xy };
}

export function setLaneWeight(d: Draft, e: number, weight: number): Draft {
  const lanes = d.lanes.slice();
  lanes[e] = { ...lanes[e], weight };
  return { ...d, lanes };
}

export function renameDepot(d: Draft, i: number, name: string): Draft {
  const depots = d.depots.slice();
  const { name: _old, ...rest } = depots[i];
  depots[i] = name.trim() ? { ...rest, name: name.trim() } : rest;
  return { ...d, depots };
}

/** Removes the selected depots (with their lanes) and the selected lanes. */
export function removeSelected(d: Draft, sel: Selection): Draft {
  if (sel.depots.size === 0 && sel.lanes.size === 0) return d;
  const goneIds = new Set([...sel.depots].map((i) => d.depots[i]?.id));
  const keep = d.depots.map((_, i) => i).filter((i) => !sel.depots.has(i));
  const xy = new Float64Array(2 * keep.length);
  keep.forEach((i, k) => {
    xy[2 * k] = d.xy[2 * i];
    xy[2 * k + 1] = d.xy[2 * i + 1];
  });
  return {
    depots: keep.map((i) => d.depots[i]),
    lanes: d.lanes.filter((l, e) => !sel.lanes.has(e) && !goneIds.has(l.from) && !goneIds.has(l.to)),
    xy,
  };
}
