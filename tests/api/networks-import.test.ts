import request from 'supertest';
import { startNetworksApi, freshOrg, rowCounts } from './networks-support';
import { MAX_FILE_BYTES } from '../../shared/formats';
import { gsetRow, instanceText } from '../data/load';

/**
 * Parser integration through the API: every format, every kind of malformed file, each giving the
 * message that names the place and the fix — and no write (row counts unchanged).
 * Formats: GeoJSON per RFC 7946 (Butler et al., 2016); GraphML per the GraphML primer
 * (graphml.graphdrawing.org); CSV per RFC 4180; the edge list is the layout of the G-set files
 * (Helmberg & Rendl, SIAM J. Optim. 10(3), 2000; tests/data/gset/SOURCE.md).
 */
let api: Awaited<ReturnType<typeof startNetworksApi>>;
const org = freshOrg();
const as = (role = 'dispatcher') => ({ 'x-test-org': String(org), 'x-test-role': role });

beforeAll(async () => {
  api = await startNetworksApi();
});
afterAll(async () => {
  await api?.stop();
});

const geo = (features: unknown[]) => JSON.stringify({ type: 'FeatureCollection', features });
const pt = (id: string, lon: number, lat: number, extra: object = {}) => ({ type: 'Feature', geometry: { type: 'Point', coordinates: [lon, lat] }, properties: { id, ...extra } });
const ln = (from: string, to: string, weight: unknown) => ({ type: 'Feature', geometry: null, properties: { from, to, weight } });
const graphml = (nodes: string[], edges: [string, string, string][]) => [
  '<?xml version="1.0" encoding="UTF-8"?>',
  '<graphml xmlns="http://graphml.graphdrawing.org/xmlns">',
  '  <key id="w" for="edge" attr.name="weight" attr.type="double"/>',
  '  <graph edgedefault="undirected">',
  ...nodes.map((n) => `    <node id="${n}"/>`),
  ...edges.map(([s, t, w]) => `    <edge source="${s}" target="${t}"><data key="w">${w}</data></edge>`),
  '  </graph>',
  '</graphml>',
].join('\n');
const json = (depots: object[], lanes: object[]) => JSON.stringify({ format: 'spinyard-network', version: 1, depots, lanes });

interface Case {
  label: string;
  file: [string, string];
  depots?: [string, string];
  message: RegExp;
  /** Where the first error must point. */
  at?: { line?: number; feature?: number; row?: number };
  /** The error is in the depots file of a CSV pair. */
  inDepotsFile?: boolean;
}

const cases: Case[] = [
  // CSV (lanes file from,to,weight; depots file id,name,lat,lon,weight)
  { label: 'csv: missing header', file: ['lanes.csv', 'A,B,3\nB,C,4\n'], message: /header row is missing "from", "to", "weight"/, at: { line: 1 } },
  { label: 'csv: unknown depot', file: ['lanes.csv', 'from,to,weight\nA,B,3\nA,Z,4\n'], depots: ['depots.csv', 'id\nA\nB\n'], message: /unknown depot "Z"/, at: { line: 3 } },
  { label: 'csv: negative volume', file: ['lanes.csv', 'from,to,weight\nA,B,3\nB,C,-4\n'], message: /volume -4; freight volumes must be ≥ 0/, at: { line: 3 } },
  { label: 'csv: non-numeric volume', file: ['lanes.csv', 'from,to,weight\nA,B,ten\n'], message: /"ten" is not a number/, at: { line: 2 } },
  { label: 'csv: decimal comma', file: ['lanes.csv', 'from;to;weight\nA;B;3,5\n'], message: /decimal comma; write it with a point, such as 3\.5/, at: { line: 2 } },
  { label: 'csv: duplicate depot id', file: ['lanes.csv', 'from,to,weight\nA,B,3\n'], depots: ['depots.csv', 'id,name\nA,Alder\nB,Birch\nA,Again\n'], message: /"A" appears twice/, at: { line: 4 }, inDepotsFile: true },
  { label: 'csv: self-loop', file: ['lanes.csv', 'from,to,weight\nA,B,3\nB,B,4\n'], message: /joins depot "B" to itself/, at: { line: 3 } },
  // Edge list ("n m", then "i j w")
  { label: 'edgelist: missing header', file: ['g.txt', 'a b 1\n'], message: /first line must give the depot and lane counts/, at: { line: 1 } },
  { label: 'edgelist: unknown depot', file: ['g.txt', '3 2\n1 2 1\n2 7 1\n'], message: /depot number 7 is outside 1…3/, at: { line: 3 } },
  { label: 'edgelist: non-numeric weight', file: ['g.txt', '3 2\n1 2 1\n2 3 x\n'], message: /"x" is not a number/, at: { line: 3 } },
  { label: 'edgelist: self-loop', file: ['g.txt', '3 2\n1 2 1\n3 3 1\n'], message: /joins depot "3" to itself/, at: { line: 3 } },
  { label: 'edgelist: too many depots', file: ['g.txt', '20001 1\n1 2 1\n'], message: /20001 depots; the limit is 20000/ },
  // GeoJSON (RFC 7946 FeatureCollection; Points are depots, lanes carry from/to/weight)
  { label: 'geojson: not a FeatureCollection', file: ['n.geojson', JSON.stringify({ type: 'Feature', geometry: null, properties: {} })], message: /expected a GeoJSON FeatureCollection/ },
  { label: 'geojson: unknown depot', file: ['n.geojson', geo([pt('A', 1, 2), pt('B', 1, 3), ln('A', 'Z', 2)])], message: /unknown depot "Z"/, at: { feature: 2 } },
  { label: 'geojson: negative volume', file: ['n.geojson', geo([pt('A', 1, 2), pt('B', 1, 3), ln('A', 'B', -2)])], message: /freight volumes must be ≥ 0/, at: { feature: 2 } },
  { label: 'geojson: non-numeric volume', file: ['n.geojson', geo([pt('A', 1, 2), pt('B', 1, 3), ln('A', 'B', 'ten')])], message: /lane weight "ten" is not a number/, at: { feature: 2 } },
  { label: 'geojson: duplicate depot id', file: ['n.geojson', geo([pt('A', 1, 2), pt('A', 1, 3)])], message: /"A" appears twice/, at: { feature: 1 } },
  { label: 'geojson: self-loop', file: ['n.geojson', geo([pt('A', 1, 2), pt('B', 1, 3), ln('A', 'A', 2)])], message: /joins depot "A" to itself/, at: { feature: 2 } },
  // GraphML
  { label: 'graphml: no graphml root', file: ['n.graphml', '<?xml version="1.0"?><network><node id="a"/></network>'], message: /no <graphml> root element/ },
  { label: 'graphml: unknown depot', file: ['n.graphml', graphml(['a', 'b'], [['a', 'z', '2']])], message: /unknown depot "z"/, at: { line: 7 } },
  { label: 'graphml: negative volume', file: ['n.graphml', graphml(['a', 'b'], [['a', 'b', '-2']])], message: /freight volumes must be ≥ 0/, at: { line: 7 } },
  { label: 'graphml: non-numeric volume', file: ['n.graphml', graphml(['a', 'b'], [['a', 'b', 'lots']])], message: /"lots" is not a number/, at: { line: 7 } },
  { label: 'graphml: duplicate node id', file: ['n.graphml', graphml(['a', 'b', 'a'], [['a', 'b', '2']])], message: /"a" appears twice/, at: { line: 7 } },
  { label: 'graphml: self-loop', file: ['n.graphml', graphml(['a', 'b'], [['b', 'b', '2']])], message: /joins depot "b" to itself/, at: { line: 7 } },
  // Spinyard JSON document
  { label: 'json: missing format header', file: ['n.json', JSON.stringify({ depots: [], lanes: [] })], message: /no "format" field/ },
  { label: 'json: unknown depot', file: ['n.json', json([{ id: 'A' }, { id: 'B' }], [{ from: 'A', to: 'Q', weight: 1 }])], message: /unknown depot "Q"/, at: { row: 1 } },
  { label: 'json: non-numeric weight', file: ['n.json', json([{ id: 'A' }, { id: 'B' }], [{ from: 'A', to: 'B', weight: 'ten' }])], message: /"weight" is "ten"; write a JSON number/, at: { row: 1 } },
  { label: 'json: duplicate depot id', file: ['n.json', json([{ id: 'A' }, { id: 'A' }], [])], message: /"A" appears twice/, at: { row: 2 } },
  { label: 'json: self-loop', file: ['n.json', json([{ id: 'A' }, { id: 'B' }], [{ from: 'A', to: 'A', weight: 1 }])], message: /to itself/, at: { row: 1 } },
];

const send = (route: 'import/preview' | 'import', c: Pick<Case, 'file' | 'depots'>, fields: Record<string, string> = {}) => {
  let r = request(api.app).post(`/api/networks/${route}`).set(as()).attach('file', Buffer.from(c.file[1]), c.file[0]);
  if (c.depots) r = r.attach('depots', Buffer.from(c.depots[1]), c.depots[0]);
  for (const [k, v] of Object.entries(fields)) r = r.field(k, v);
  return r;
};

describe.each(cases)('$label', (c) => {
  test('preview names the file, the place and the fix; import refuses; nothing is written', async () => {
    const before = await rowCounts(api.deps, org);
    const preview = await send('import/preview', c);
    expect(preview.status).toBe(200);
    const errors = preview.body.issues.filter((i: { severity: string }) => i.severity === 'error');
    expect(preview.body.errorCount).toBeGreaterThan(0);
    const hit = errors.find((i: { message: string }) => c.message.test(i.message));
    expect(hit).toBeDefined();
    const file = c.inDepotsFile ? c.depots![0] : c.file[0];
    expect(hit.file).toBe(file);
    expect(hit.text.startsWith(file)).toBe(true);
    if (c.at) expect(hit).toMatchObject(c.at);
    // Every message says what to do, not only what is wrong.
    expect(hit.message).toMatch(/;|:/);

    const imported = await send('import', c);
    expect(imported.status).toBe(400);
    expect(imported.body.code).toBe('import_errors');
    expect(imported.body.error).toMatch(/nothing was saved/);
    expect(await rowCounts(api.deps, org)).toEqual(before);
  });
});

describe('huge files are refused before parsing, for every format, with the limit stated', () => {
  const big = Buffer.alloc(MAX_FILE_BYTES + 1024, 0x20);
  test.each(['lanes.csv', 'g.txt', 'n.geojson', 'n.graphml', 'n.json'])('%s', async (name) => {
    const before = await rowCounts(api.deps, org);
    for (const route of ['import/preview', 'import']) {
      const res = await request(api.app).post(`/api/networks/${route}`).set(as()).attach('file', big, name);
      expect(res.status).toBe(413);
      expect(res.body.error).toMatch(/larger than the 20 MB limit; split the network/);
    }
    expect(await rowCounts(api.deps, org)).toEqual(before);
  });
});

describe('saving imports', () => {
  test('CSV with one bad row: refused, then saved without it when the user drops bad rows', async () => {
    const file: [string, string] = ['yard-lanes.csv', 'from,to,weight\nA,B,3\nB,C,-1\nC,D,5\n'];
    const before = await rowCounts(api.deps, org);
    expect((await send('import', { file })).status).toBe(400);
    expect(await rowCounts(api.deps, org)).toEqual(before);
    const res = await send('import', { file }, { dropBadRows: 'true', name: 'Yard' });
    expect(res.status).toBe(201);
    expect(res.body.dropped).toBe(1);
    const net = (await request(api.app).get(`/api/networks/${res.body.id}`).set(as())).body;
    expect(net.name).toBe('Yard');
    expect(net.latest.document.lanes).toEqual([{ from: 'A', to: 'B', weight: 3 }, { from: 'C', to: 'D', weight: 5 }]);
    expect(net.latest.source).toBe('import');
    expect(net.latest.note).toMatch(/imported yard-lanes\.csv \(1 bad row dropped\)/);
  });

  test('a file-level error cannot be dropped around (missing header)', async () => {
    const before = await rowCounts(api.deps, org);
    const res = await send('import', { file: ['lanes.csv', 'a,b,c\n1,2,3\n'] }, { dropBadRows: 'true' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/cannot be dropped/);
    expect(await rowCounts(api.deps, org)).toEqual(before);
  });

  test('the two CSV files may be picked in either order', async () => {
    const res = await send('import/preview', { file: ['depots.csv', 'id,name,lat,lon\nA,Alder,47.1,-31\nB,Birch,47.2,-31\n'], depots: ['lanes.csv', 'from,to,weight\nA,B,3\n'] });
    expect(res.body.errorCount).toBe(0);
    expect(res.body.fileName).toBe('lanes.csv');
    expect(res.body.summary).toMatchObject({ depots: 2, lanes: 1, hasCoordinates: true });
  });

  test('G-set file G1 (800 depots, 19176 lanes per its header): preview counts match; signed-weight formats import', async () => {
    const text = instanceText('gset', 'G1');
    const res = await request(api.app).post('/api/networks/import/preview').set(as()).attach('file', Buffer.from(text), 'G1.txt');
    expect(res.body.format).toBe('edgelist');
    expect(res.body.counts).toEqual({ depots: 800, lanes: 19176 });
    expect(gsetRow('G1')).toMatchObject({ n: 800, m: 19176 }); // published size (Helmberg & Rendl 2000)
    expect(res.body.errorCount).toBe(0);
    // G11 has ±1 weights (SOURCE.md): benchmark formats keep signed weights.
    const g11 = instanceText('gset', 'G11');
    const saved = await request(api.app).post('/api/networks/import').set(as()).attach('file', Buffer.from(g11), 'G11.txt');
    expect(saved.status).toBe(201);
    expect(saved.body.counts).toEqual({ depots: 800, lanes: 1600 });
  });

  test('GraphML: keys are listed and an explicit mapping feeds the lane volume', async () => {
    const content = [
      '<graphml xmlns="http://graphml.graphdrawing.org/xmlns">',
      '  <key id="t" for="edge" attr.name="tonnes" attr.type="double"/>',
      '  <key id="lbl" for="node" attr.name="label" attr.type="string"/>',
      '  <graph edgedefault="undirected">',
      '    <node id="a"><data key="lbl">Alder</data></node><node id="b"/>',
      '    <edge source="a" target="b"><data key="t">42</data></edge>',
      '  </graph>',
      '</graphml>',
    ].join('\n');
    const plain = await send('import/preview', { file: ['n.graphml', content] });
    expect(plain.body.graphml.keys).toEqual([{ id: 't', for: 'edge', name: 'tonnes' }, { id: 'lbl', for: 'node', name: 'label' }]);
    expect(plain.body.graphml.mapping).toMatchObject({ laneWeight: null, depotName: 'lbl' });
    expect(plain.body.firstLanes[0].weight).toBe(1);
    expect(plain.body.issues.map((i: { message: string }) => i.message).join(' ')).toMatch(/every lane weighs 1/);
    const mapped = await send('import/preview', { file: ['n.graphml', content] }, { mapping: JSON.stringify({ laneWeight: 't' }) });
    expect(mapped.body.graphml.mapping.laneWeight).toBe('t');
    expect(mapped.body.firstLanes[0].weight).toBe(42);
    expect(mapped.body.firstDepots[0]).toEqual({ id: 'a', name: 'Alder' });
    const wrong = await send('import/preview', { file: ['n.graphml', content] }, { mapping: JSON.stringify({ laneWeight: 'nope' }) });
    expect(wrong.body.issues[0].message).toMatch(/no <key for="edge"> has that id/);
  });

  test('import as a new version of an existing network', async () => {
    const first = await send('import', { file: ['a.csv', 'from,to,weight\nA,B,3\n'] });
    const second = await send('import', { file: ['b.csv', 'from,to,weight\nA,B,4\nB,C,1\n'] }, { networkId: String(first.body.id) });
    expect(second.status).toBe(201);
    expect(second.body).toMatchObject({ id: first.body.id, number: 2 });
  });

  test('viewers cannot preview or import (networks:write)', async () => {
    const res = await request(api.app).post('/api/networks/import/preview').set(as('viewer')).attach('file', Buffer.from('from,to,weight\nA,B,1\n'), 'l.csv');
    expect(res.status).toBe(403);
  });
});
