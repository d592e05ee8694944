import { XMLParser, XMLValidator } from 'fast-xml-parser';
import type { Depot, NetworkDocument } from '../engine/network/types';
import { emptyResult, finishNetwork, readNumber, sizeIssue, type DraftNetwork } from './finish';
import type { FormatIssue, ParseResult, SourcePosition } from './types';

/**
 * Which GraphML `<key>` feeds which field: each entry is a key id or an attr.name. Fields not
 * given are found by the attr.name candidates below (case-insensitive).
 */
export interface GraphmlMapping {
  depotName?: string;
  depotLat?: string;
  depotLon?: string;
  depotWeight?: string;
  laneWeight?: string;
}

export const GRAPHML_NAME_CANDIDATES = {
  depotName: ['name', 'label'],
  depotLat: ['lat', 'latitude'],
  depotLon: ['lon', 'longitude', 'lng'],
  depotWeight: ['weight', 'demand'],
  laneWeight: ['weight', 'volume'],
} as const;

interface GraphmlKey {
  id: string;
  for: string;
  name: string;
  default?: string;
}

type XmlNode = Record<string, unknown>;

const asArray = (v: unknown): XmlNode[] => (Array.isArray(v) ? v : v === undefined ? [] : [v]) as XmlNode[];
const text = (v: unknown): string => {
  if (v === undefined || v === null) return '';
  if (typeof v === 'object') return String((v as XmlNode)['#text'] ?? '');
  return String(v);
};

/**
 * Lines of the n-th `<node` and `<edge` start tags, found in the raw text with comments and
 * CDATA blanked out (fast-xml-parser does not report positions). Only trusted when the counts
 * match the parsed elements.
 */
function tagLines(content: string, tag: string): number[] {
  const blanked = content.replace(/<!--[\s\S]*?-->|<!\[CDATA\[[\s\S]*?\]\]>/g, (m) => m.replace(/[^\n]/g, ' '));
  const re = new RegExp(`<${tag}[\\s/>]`, 'g');
  const lines: number[] = [];
  let line = 1, last = 0;
  for (let m = re.exec(blanked); m; m = re.exec(blanked)) {
    for (let i = last; i < m.index; i++) if (blanked.charCodeAt(i) === 10) line++;
    last = m.index;
    lines.push(line);
  }
  return lines;
}

/**
 * GraphML (graphml.graphdrawing.org): `<node>` elements are depots, `<edge>` elements lanes.
 * Data keys are mapped explicitly (see GraphmlMapping). Directed graphs are read as undirected
 * with a warning, since a split does not depend on lane direction. Volumes must be ≥ 0.
 * Lanes without a weight key take the key's `<default>` or 1.
 */
export function parseGraphml(content: string, file?: string, mapping: GraphmlMapping = {}): ParseResult {
  const big = sizeIssue(content, file);
  if (big) return emptyResult([big]);
  const f = file !== undefined ? { file } : {};
  const issues: FormatIssue[] = [];
  // Entity declarations can expand without bound ("billion laughs"); GraphML never needs them.
  if (/<!ENTITY/i.test(content)) {
    return emptyResult([{ ...f, severity: 'error', message: 'the file declares XML entities (<!ENTITY …>); GraphML does not need them — remove the DOCTYPE block' }]);
  }
  const valid = XMLValidator.validate(content);
  if (valid !== true) {
    return emptyResult([{ ...f, line: valid.err.line, severity: 'error', message: `the file is not well-formed XML (${valid.err.msg}); fix the markup at that line` }]);
  }
  let root: XmlNode;
  try {
    const parser = new XMLParser({
      ignoreAttributes: false,
      attributeNamePrefix: '@_',
      parseTagValue: false,
      parseAttributeValue: false,
      processEntities: true,
      htmlEntities: false,
      isArray: (name) => ['graph', 'node', 'edge', 'key', 'data', 'hyperedge'].includes(name),
    });
    root = parser.parse(content) as XmlNode;
  } catch (e) {
    return emptyResult([{ ...f, severity: 'error', message: `the XML could not be read (${e instanceof Error ? e.message : String(e)}); check the file is GraphML` }]);
  }
  const graphml = root.graphml as XmlNode | undefined;
  if (!graphml || typeof graphml !== 'object') {
    return emptyResult([{ ...f, severity: 'error', message: 'no <graphml> root element; the file must be GraphML (<graphml><graph>…</graph></graphml>)' }]);
  }
  const graphs = asArray(graphml.graph);
  if (graphs.length === 0) return emptyResult([{ ...f, severity: 'error', message: 'the file has no <graph> element; put the nodes and edges inside <graph edgedefault="undirected">' }]);
  if (graphs.length > 1) issues.push({ ...f, severity: 'warning', message: `the file has ${graphs.length} graphs; only the first is read` });
  const graph = graphs[0];

  const keys: GraphmlKey[] = asArray(graphml.key).map((k) => ({
    id: String(k['@_id'] ?? ''),
    for: String(k['@_for'] ?? 'all'),
    name: String(k['@_attr.name'] ?? ''),
    ...(k.default !== undefined ? { default: text(k.default) } : {}),
  }));
  const pick = (field: keyof GraphmlMapping, domain: 'node' | 'edge'): GraphmlKey | undefined => {
    const usable = keys.filter((k) => k.for === domain || k.for === 'all');
    const chosen = mapping[field];
    if (chosen !== undefined) {
      const hit = usable.find((k) => k.id === chosen) ?? usable.find((k) => k.name.toLowerCase() === chosen.toLowerCase());
      if (!hit) issues.push({ ...f, severity: 'error', message: `the mapping names key "${chosen}" for ${field}, but no <key for="${domain}"> has that id or attr.name; the keys are ${usable.map((k) => `${k.id} (${k.name})`).join(', ') || 'none'}` });
      return hit;
    }
    for (const candidate of GRAPHML_NAME_CANDIDATES[field]) {
      const hit = usable.find((k) => k.name.toLowerCase() === candidate);
      if (hit) return hit;
    }
    return undefined;
  };
  const nodeKeys = { name: pick('depotName', 'node'), lat: pick('depotLat', 'node'), lon: pick('depotLon', 'node'), weight: pick('depotWeight', 'node') };
  const laneKey = pick('laneWeight', 'edge');
  if (issues.some((i) => i.severity === 'error')) return emptyResult(issues);

  const dataOf = (el: XmlNode, key: GraphmlKey | undefined): string | undefined => {
    if (!key) return undefined;
    const d = asArray(el.data).find((x) => String(x['@_key']) === key.id);
    return d !== undefined ? text(d).trim() : key.default?.trim();
  };

  const nodes = asArray(graph.node);
  const edges = asArray(graph.edge);
  const nodeLines = tagLines(content, 'node');
  const edgeLines = tagLines(content, 'edge');
  const at = (lines: number[], count: number, i: number): SourcePosition => (lines.length === count ? { ...f, line: lines[i] } : { ...f, row: i + 1 });
  if (nodes.some((nd) => nd.graph !== undefined)) issues.push({ ...f, severity: 'warning', message: 'nested graphs inside nodes are ignored; flatten the file to read their nodes' });
  if (asArray(graph.hyperedge).length > 0) issues.push({ ...f, severity: 'warning', message: 'hyperedges are ignored; a lane joins exactly two depots' });

  const draft: DraftNetwork = { depots: [], depotAt: [], lanes: [], laneAt: [] };
  nodes.forEach((nd, i) => {
    const here = at(nodeLines, nodes.length, i);
    const depot: Depot = { id: String(nd['@_id'] ?? '') };
    const name = dataOf(nd, nodeKeys.name);
    if (name) depot.name = name;
    let ok = true;
    for (const [field, label, example] of [['lat', 'latitude', '51.5'], ['lon', 'longitude', '-0.12'], ['weight', 'depot weight', '3']] as const) {
      const raw = dataOf(nd, nodeKeys[field]);
      if (raw === undefined || raw === '') continue;
      const v = readNumber(raw, label, example);
      if (typeof v === 'number') depot[field] = v;
      else { issues.push({ ...here, where: 'depots', severity: 'error', message: `node "${depot.id}": ${v.problem}` }); ok = false; }
    }
    if (!ok) return;
    draft.depots.push(depot);
    draft.depotAt.push(here);
  });

  const directedDefault = String(graph['@_edgedefault'] ?? 'directed') === 'directed';
  let directed = 0;
  edges.forEach((ed, i) => {
    const here = at(edgeLines, edges.length, i);
    const dir = ed['@_directed'];
    if (dir === 'true' || (dir === undefined && directedDefault)) directed++;
    let weight = 1;
    const raw = dataOf(ed, laneKey);
    if (raw !== undefined) {
      const v = readNumber(raw, 'lane volume');
      if (typeof v !== 'number') {
        issues.push({ ...here, where: 'lanes', severity: 'error', message: `edge ${String(ed['@_source'] ?? '?')}–${String(ed['@_target'] ?? '?')}: ${v.problem}` });
        return;
      }
      weight = v;
    }
    draft.lanes.push({ from: String(ed['@_source'] ?? ''), to: String(ed['@_target'] ?? ''), weight });
    draft.laneAt.push(here);
  });
  if (directed > 0) issues.push({ ...f, severity: 'warning', message: `${directed} edge(s) are directed; lanes are read as undirected (A→B and B→A are the same lane and their volumes add up)` });
  if (!laneKey && edges.length > 0) issues.push({ ...f, severity: 'warning', message: 'no edge key named weight or volume was found; every lane weighs 1 (declare <key for="edge" attr.name="weight"> or pass a mapping)' });
  return finishNetwork(draft, issues, { rejectNegativeWeights: true, weightWord: 'volume' });
}

const xmlEscape = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** Writes GraphML with keys name, lat, lon, weight (nodes) and weight (edges), undirected. */
export function writeGraphml(doc: NetworkDocument): string {
  const out = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    '<graphml xmlns="http://graphml.graphdrawing.org/xmlns">',
    '  <key id="name" for="node" attr.name="name" attr.type="string"/>',
    '  <key id="lat" for="node" attr.name="lat" attr.type="double"/>',
    '  <key id="lon" for="node" attr.name="lon" attr.type="double"/>',
    '  <key id="demand" for="node" attr.name="weight" attr.type="double"/>',
    '  <key id="volume" for="edge" attr.name="weight" attr.type="double"/>',
    `  <graph id="${xmlEscape(doc.name ?? 'network')}" edgedefault="undirected">`,
  ];
  for (const d of doc.depots) {
    const data: string[] = [];
    if (d.name !== undefined) data.push(`<data key="name">${xmlEscape(d.name)}</data>`);
    if (d.lat !== undefined) data.push(`<data key="lat">${d.lat}</data>`);
    if (d.lon !== undefined) data.push(`<data key="lon">${d.lon}</data>`);
    if (d.weight !== undefined) data.push(`<data key="demand">${d.weight}</data>`);
    out.push(data.length === 0 ? `    <node id="${xmlEscape(d.id)}"/>` : `    <node id="${xmlEscape(d.id)}">${data.join('')}</node>`);
  }
  for (const l of doc.lanes) out.push(`    <edge source="${xmlEscape(l.from)}" target="${xmlEscape(l.to)}"><data key="volume">${l.weight}</data></edge>`);
  out.push('  </graph>', '</graphml>');
  return out.join('\n') + '\n';
}
