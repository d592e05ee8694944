import type { Depot, NetworkDocument } from '../engine/network/types';
import { emptyResult, finishNetwork, sizeIssue, type DraftNetwork } from './finish';
import type { FormatIssue, ParseResult, SourcePosition } from './types';

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => !!v && typeof v === 'object' && !Array.isArray(v);
const isPosition = (v: unknown): v is number[] => Array.isArray(v) && v.length >= 2 && v.every((x) => typeof x === 'number' && Number.isFinite(x));
const idOf = (v: unknown): string | undefined => (typeof v === 'string' ? v : typeof v === 'number' && Number.isFinite(v) ? String(v) : undefined);

/**
 * GeoJSON (RFC 7946) FeatureCollection.
 * - Point features are depots: id from properties.id, else feature.id; properties.name,
 *   properties.weight (demand); coordinates are [lon, lat].
 * - LineString features with a numeric properties.weight are lanes: ends named by
 *   properties.from / properties.to, or else the first and last coordinates matched exactly
 *   against the depots' Points.
 * - Features with a null geometry (allowed by RFC 7946 §3.2) carry depots without coordinates
 *   (properties.id) or lanes between such depots (properties.from/to/weight); the writer uses
 *   them so every network round-trips.
 * Issues carry the feature index (0-based position in `features`). Volumes must be ≥ 0.
 */
export function parseGeojson(content: string, file?: string): ParseResult {
  const big = sizeIssue(content, file);
  if (big) return emptyResult([big]);
  const f = file !== undefined ? { file } : {};
  let data: unknown;
  try {
    data = JSON.parse(content);
  } catch (e) {
    return emptyResult([{ ...f, severity: 'error', message: `the file is not valid JSON (${(e instanceof Error ? e.message : String(e)).slice(0, 120)}); fix the syntax` }]);
  }
  if (!isObject(data) || data.type !== 'FeatureCollection' || !Array.isArray(data.features)) {
    const found = isObject(data) && typeof data.type === 'string' ? `a ${data.type}` : 'something else';
    return emptyResult([{ ...f, severity: 'error', message: `expected a GeoJSON FeatureCollection ({"type": "FeatureCollection", "features": [...]}), found ${found}; wrap the features in a FeatureCollection` }]);
  }
  const issues: FormatIssue[] = [];
  const features = data.features as unknown[];
  const draft: DraftNetwork = { depots: [], depotAt: [], lanes: [], laneAt: [] };
  if (typeof data.name === 'string') draft.name = data.name;
  const at = (k: number): SourcePosition => ({ ...f, feature: k });
  const problem = (k: number, message: string, severity: FormatIssue['severity'] = 'error', where?: 'depots' | 'lanes') =>
    issues.push({ ...at(k), ...(where ? { where } : {}), severity, message });

  // Depots first, so lanes can be matched to Point coordinates whatever the feature order.
  const pointAt = new Map<string, string[]>();
  const laneFeatures: number[] = [];
  let ignored = 0, firstIgnored = -1;
  features.forEach((feat, k) => {
    if (!isObject(feat) || feat.type !== 'Feature') {
      problem(k, 'is not a GeoJSON Feature ({"type": "Feature", "geometry": …, "properties": {…}}); fix or remove it');
      return;
    }
    const props = isObject(feat.properties) ? feat.properties : {};
    const geom = feat.geometry;
    const kind = geom === null ? (props.from !== undefined || props.to !== undefined ? 'lane' : 'depot')
      : isObject(geom) && geom.type === 'Point' ? 'depot'
      : isObject(geom) && geom.type === 'LineString' ? 'lane' : 'other';
    if (kind === 'lane') { laneFeatures.push(k); return; }
    if (kind === 'other') {
      if (ignored++ === 0) firstIgnored = k;
      return;
    }
    const id = idOf(props.id) ?? idOf(feat.id);
    if (id === undefined) {
      problem(k, 'the Point has no id; add properties.id (or a feature id) naming the depot', 'error', 'depots');
      return;
    }
    const depot: Depot = { id };
    if (typeof props.name === 'string' && props.name !== '') depot.name = props.name;
    if (props.weight !== undefined && props.weight !== null) {
      if (typeof props.weight !== 'number') {
        problem(k, `depot "${id}" has weight ${JSON.stringify(props.weight)}; write a JSON number such as 3`, 'error', 'depots');
        return;
      }
      depot.weight = props.weight;
    }
    if (isObject(geom)) {
      if (!isPosition(geom.coordinates)) {
        problem(k, `depot "${id}" has coordinates ${JSON.stringify(geom.coordinates)?.slice(0, 40)}; a Point needs [lon, lat] numbers`, 'error', 'depots');
        return;
      }
      const [lon, lat] = geom.coordinates;
      depot.lon = lon;
      depot.lat = lat;
      const key = `${lon},${lat}`;
      pointAt.set(key, [...(pointAt.get(key) ?? []), id]);
    }
    draft.depots.push(depot);
    draft.depotAt.push(at(k));
  });
  if (ignored > 0) problem(firstIgnored, `${ignored} feature(s) are neither Points nor LineStrings and were ignored (this is the first)`, 'warning');

  let unweighted = 0, firstUnweighted = -1;
  for (const k of laneFeatures) {
    const feat = features[k] as Json;
    const props = isObject(feat.properties) ? feat.properties : {};
    if (props.weight === undefined || props.weight === null) {
      if (unweighted++ === 0) firstUnweighted = k;
      continue;
    }
    if (typeof props.weight !== 'number' || !Number.isFinite(props.weight)) {
      problem(k, `lane weight ${JSON.stringify(props.weight)} is not a number; write properties.weight as a JSON number such as 12.5`, 'error', 'lanes');
      continue;
    }
    let from = idOf(props.from), to = idOf(props.to);
    if (from === undefined || to === undefined) {
      const geom = feat.geometry;
      const coords = isObject(geom) && Array.isArray(geom.coordinates) ? (geom.coordinates as unknown[]) : [];
      if (coords.length < 2 || !isPosition(coords[0]) || !isPosition(coords[coords.length - 1])) {
        problem(k, 'the lane has no properties.from/to and its LineString has fewer than two valid positions; add from/to depot ids', 'error', 'lanes');
        continue;
      }
      const ends = [coords[0], coords[coords.length - 1]] as number[][];
      const matched = ends.map((p) => pointAt.get(`${p[0]},${p[1]}`) ?? []);
      const bad = matched.findIndex((ids) => ids.length !== 1);
      if (bad >= 0) {
        const p = ends[bad];
        problem(k, matched[bad].length === 0
          ? `the lane's ${bad === 0 ? 'first' : 'last'} position [${p[0]}, ${p[1]}] matches no depot Point exactly; add properties.from/to or move the end onto the depot`
          : `the lane's ${bad === 0 ? 'first' : 'last'} position [${p[0]}, ${p[1]}] matches several depots (${matched[bad].join(', ')}); add properties.from/to`, 'error', 'lanes');
        continue;
      }
      from = from ?? matched[0][0];
      to = to ?? matched[1][0];
    }
    draft.lanes.push({ from, to, weight: props.weight });
    draft.laneAt.push(at(k));
  }
  if (unweighted > 0) problem(firstUnweighted, `${unweighted} LineString(s) have no properties.weight and were not read as lanes (this is the first); add a weight to make them lanes`, 'warning');
  return finishNetwork(draft, issues, { rejectNegativeWeights: true, weightWord: 'volume' });
}

/**
 * Writes a FeatureCollection: a Point per depot with coordinates (null geometry otherwise) and
 * a LineString per lane between located depots (null geometry otherwise); lanes always carry
 * from/to so they do not depend on coordinate matching.
 */
export function writeGeojson(doc: NetworkDocument): string {
  const byId = new Map(doc.depots.map((d) => [d.id, d]));
  const located = (d: Depot | undefined): d is Depot & { lat: number; lon: number } => d !== undefined && d.lat !== undefined && d.lon !== undefined;
  const features: unknown[] = [];
  for (const d of doc.depots) {
    const properties: Json = { id: d.id };
    if (d.name !== undefined) properties.name = d.name;
    if (d.weight !== undefined) properties.weight = d.weight;
    features.push({ type: 'Feature', geometry: located(d) ? { type: 'Point', coordinates: [d.lon, d.lat] } : null, properties });
  }
  for (const l of doc.lanes) {
    const a = byId.get(l.from), b = byId.get(l.to);
    const geometry = located(a) && located(b) ? { type: 'LineString', coordinates: [[a.lon, a.lat], [b.lon, b.lat]] } : null;
    features.push({ type: 'Feature', geometry, properties: { from: l.from, to: l.to, weight: l.weight } });
  }
  return `{"type":"FeatureCollection",${doc.name !== undefined ? `"name":${JSON.stringify(doc.name)},` : ''}"features":[\n${features.map((x) => JSON.stringify(x)).join(',\n')}\n]}\n`;
}
