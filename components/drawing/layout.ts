import { forceCenter, forceLink, forceManyBody, forceSimulation, forceX, forceY, type SimulationNodeDatum } from 'd3-force';
import type { Depot } from '../../shared/engine/network/types';

/** Positions of depots in world units: xy[2i], xy[2i+1] for depot i. */
export type Positions = Float64Array;

/** World units between neighbouring depots in a force layout (screen px at zoom 1). */
export const LANE_LENGTH = 70;

/** A plain equirectangular projection around the network's centre (x east, y south). */
export interface Projection {
  lat0: number;
  lon0: number;
  /** World units per degree of latitude. */
  scale: number;
}

export const hasAllCoordinates = (depots: readonly Depot[]) => depots.length > 0 && depots.every((d) => Number.isFinite(d.lat) && Number.isFinite(d.lon));

/**
 * Projection that spreads the depots over about `span` world units, shrinking longitude by
 * cos(lat0) so distances look right at the network's latitude.
 */
export function fitProjection(depots: readonly Depot[], span = 600): Projection {
  let minLat = Infinity, maxLat = -Infinity, minLon = Infinity, maxLon = -Infinity;
  for (const d of depots) {
    minLat = Math.min(minLat, d.lat!); maxLat = Math.max(maxLat, d.lat!);
    minLon = Math.min(minLon, d.lon!); maxLon = Math.max(maxLon, d.lon!);
  }
  const lat0 = (minLat + maxLat) / 2, lon0 = (minLon + maxLon) / 2;
  const c = Math.cos((lat0 * Math.PI) / 180);
  const extent = Math.max(maxLat - minLat, (maxLon - minLon) * c, 1e-6);
  return { lat0, lon0, scale: span / extent };
}

export function project(p: Projection, lat: number, lon: number): [number, number] {
  const c = Math.cos((p.lat0 * Math.PI) / 180);
  return [(lon - p.lon0) * c * p.scale, -(lat - p.lat0) * p.scale];
}

export function unproject(p: Projection, x: number, y: number): { lat: number; lon: number } {
  const c = Math.cos((p.lat0 * Math.PI) / 180);
  const round = (v: number) => Math.round(v * 1e6) / 1e6; // ~0.1 m, plenty for a depot
  return { lat: round(p.lat0 - y / p.scale), lon: round(p.lon0 + x / (c * p.scale)) };
}

interface Node extends SimulationNodeDatum {
  index: number;
}

/**
 * Depot positions: the lat/lon projection when every depot has coordinates, otherwise a d3-force
 * layout run to rest synchronously once (the simulation is stopped and ticked, never animated,
 * so a 500-depot network costs one short computation instead of 300 renders). The start is
 * deterministic, so the layout is the same every time.
 */
export function layoutNetwork(depots: readonly Depot[], lanes: readonly { from: string; to: string }[]): { xy: Positions; projection: Projection | null } {
  const n = depots.length;
  const xy = new Float64Array(2 * n);
  if (n === 0) return { xy, projection: null };
  if (hasAllCoordinates(depots)) {
    const projection = fitProjection(depots);
    depots.forEach((d, i) => {
      const [x, y] = project(projection, d.lat!, d.lon!);
      xy[2 * i] = x;
      xy[2 * i + 1] = y;
    });
    return { xy, projection };
  }
  const index = new Map(depots.map((d, i) => [d.id, i]));
  // Small networks start on a circle in document order: drawn rings and chains then come out
  // untangled. Larger ones keep d3's phyllotaxis start, which spreads them more evenly.
  const radius = (LANE_LENGTH * n) / (2 * Math.PI);
  const nodes: Node[] = depots.map((_, i) =>
    n <= 100 ? { index: i, x: radius * Math.cos((2 * Math.PI * i) / n - Math.PI / 2), y: radius * Math.sin((2 * Math.PI * i) / n - Math.PI / 2) } : { index: i },
  );
  const links = lanes
    .map((l) => ({ source: index.get(l.from)!, target: index.get(l.to)! }))
    .filter((l) => l.source !== undefined && l.target !== undefined && l.source !== l.target);
  const simulation = forceSimulation(nodes)
    .force('link', forceLink(links).distance(LANE_LENGTH).strength(0.7))
    .force('charge', forceManyBody().strength(-250))
    .force('x', forceX(0).strength(0.015)) // keeps separate components from drifting apart
    .force('y', forceY(0).strength(0.015))
    .force('center', forceCenter(0, 0));
  simulation.stop();
  simulation.tick(300);
  nodes.forEach((nd, i) => {
    xy[2 * i] = nd.x ?? 0;
    xy[2 * i + 1] = nd.y ?? 0;
  });
  return { xy, projection: null };
}
