import type { Deps } from '../deps';
import type { NetworkDocument } from '../../shared/engine/network/types';
import { createRng } from '../../shared/engine/random';
import { badRequest } from '../lib/http-error';
import { createNetwork, type Actor } from './networks';

/**
 * Invented demo networks in the invented "Quillmere Valley". Coordinates lie in open water of
 * the North Atlantic (46.9…47.4 N, 31.3…30.2 W) so no depot coincides with a real place, yet
 * they are valid WGS 84 positions and the map projection has something to show.
 */
export interface DemoNetwork {
  key: string;
  name: string;
  description: string;
  document: NetworkDocument;
}

const CORE_NAMES = [
  'Quillmere Cross', 'Harrowfen Yard', 'Ossel Bridge', 'Tarnwyth Hub', 'Vellacombe', 'Brackmoor Sidings',
  'Lintmouth Quay', 'Sorrowby Gate', 'Caddle End', 'Wrenholt', 'Marrowdene', 'Pellow Ford',
];
const PREFIXES = ['Quill', 'Harrow', 'Ossel', 'Tarn', 'Vella', 'Brack', 'Lint', 'Sorrow', 'Caddle', 'Wren', 'Marrow', 'Pellow', 'Dunner', 'Thistle'];
const SUFFIXES = ['mere', 'fen', 'holt', 'combe', 'moor', 'wyth', 'dene', 'by', 'ford', 'stead'];
const KINDS = ['Yard', 'Depot', 'Hub', 'Sidings', 'Quay', 'Store'];

/** Deterministic names, all different: the 12 core names first, then prefix+suffix compounds. */
function depotNames(count: number, seed: number): string[] {
  const rng = createRng(seed);
  const names = CORE_NAMES.slice(0, count);
  const used = new Set(names);
  while (names.length < count) {
    const base = PREFIXES[rng.int(PREFIXES.length)] + SUFFIXES[rng.int(SUFFIXES.length)];
    const name = `${base} ${KINDS[rng.int(KINDS.length)]}`;
    if (!used.has(name) && !used.has(base)) {
      used.add(name);
      used.add(base);
      names.push(name);
    }
  }
  return names;
}

/**
 * A valley network: depots strung along a gently curving valley floor, each joined to its
 * nearest neighbours (plus the next depot down the valley, so it is connected); volumes fall
 * with distance, as freight between nearby depots usually dominates.
 */
function valleyNetwork(name: string, count: number, seed: number, withCoordinates: boolean): NetworkDocument {
  const rng = createRng(seed);
  const names = depotNames(count, seed + 1);
  const pts = Array.from({ length: count }, (_, i) => {
    const t = count === 1 ? 0 : i / (count - 1);
    const lat = 46.95 + 0.4 * t + 0.06 * Math.sin(5 * t) + (rng.next() - 0.5) * 0.12;
    const lon = -31.25 + 1.0 * t + (rng.next() - 0.5) * 0.18;
    return { lat: Math.round(lat * 1e5) / 1e5, lon: Math.round(lon * 1e5) / 1e5 };
  });
  const depots = pts.map((p, i) => ({
    id: `D${String(i + 1).padStart(2, '0')}`,
    name: names[i],
    ...(withCoordinates ? p : {}),
    weight: 1 + rng.int(5),
  }));
  const km = (a: number, b: number) => {
    const dLat = (pts[a].lat - pts[b].lat) * 111.2;
    const dLon = (pts[a].lon - pts[b].lon) * 111.2 * Math.cos((47.15 * Math.PI) / 180);
    return Math.hypot(dLat, dLon);
  };
  const pairs = new Set<string>();
  const lanes: NetworkDocument['lanes'] = [];
  const add = (a: number, b: number) => {
    const key = a < b ? `${a}-${b}` : `${b}-${a}`;
    if (a === b || pairs.has(key)) return;
    pairs.add(key);
    const volume = Math.max(5, Math.round((900 / (4 + km(a, b))) * (0.6 + 0.8 * rng.next())));
    lanes.push({ from: depots[a].id, to: depots[b].id, weight: volume });
  };
  for (let i = 0; i < count; i++) {
    if (i + 1 < count) add(i, i + 1);
    const nearest = Array.from({ length: count }, (_, j) => j).filter((j) => j !== i).sort((x, y) => km(i, x) - km(i, y));
    const extra = 1 + rng.int(2);
    for (const j of nearest.slice(0, extra + 1)) add(i, j);
  }
  return { name, depots, lanes };
}

export const DEMO_NETWORKS: readonly DemoNetwork[] = [
  { key: 'quillmere-core', name: 'Quillmere Valley — core', description: '12 depots around Quillmere Cross, with coordinates', document: valleyNetwork('Quillmere Valley — core', 12, 1207, true) },
  // 20 depots: the largest max-cut whose direct encoding the default QAOA and VQE still take (20 qubits).
  { key: 'quillmere-west', name: 'Quillmere Valley — west', description: '20 depots of the western valley, with coordinates (a 20-qubit circuit)', document: valleyNetwork('Quillmere Valley — west', 20, 2003, true) },
  { key: 'quillmere-full', name: 'Quillmere Valley — full', description: '40 depots along the whole valley, with coordinates', document: valleyNetwork('Quillmere Valley — full', 40, 4011, true) },
  { key: 'ridge-couriers', name: 'Ridge couriers (no map)', description: '24 courier depots without coordinates (drawn by force layout)', document: valleyNetwork('Ridge couriers (no map)', 24, 2417, false) },
];

export function demoByKey(key: string): DemoNetwork | undefined {
  return DEMO_NETWORKS.find((d) => d.key === key);
}

/** Seeds every demo network into the organisation once (safe to call at every start). */
export async function ensureDemoNetworks(deps: Deps, organisationId: number): Promise<number> {
  let created = 0;
  for (const demo of DEMO_NETWORKS) {
    const exists = await deps.models.Network.count({ where: { organisationId, demoKey: demo.key } });
    if (exists > 0) continue;
    await createNetwork(deps, { organisationId, userId: null }, { name: demo.name, depots: demo.document.depots, lanes: demo.document.lanes }, { source: 'demo', note: 'demo network', demoKey: demo.key });
    created++;
  }
  return created;
}

/** "Open demo": a copy of one demo network in the caller's organisation. */
export async function copyDemoNetwork(deps: Deps, actor: Actor, key: string) {
  const demo = demoByKey(key);
  if (!demo) throw badRequest(`There is no demo network "${key}"; choose one of ${DEMO_NETWORKS.map((d) => d.key).join(', ')}.`);
  return createNetwork(deps, actor, { name: demo.name, depots: demo.document.depots, lanes: demo.document.lanes }, { source: 'demo', note: `copy of the demo network "${demo.name}"` });
}
