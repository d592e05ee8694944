import request from 'supertest';
import Papa from 'papaparse';
import { startNetworksApi, freshOrg, rowCounts } from './networks-support';
import { parseCsvNetwork, parseGeojson } from '../../shared/formats';

let api: Awaited<ReturnType<typeof startNetworksApi>>;
const org = freshOrg();
const as = (role = 'dispatcher', o = org) => ({ 'x-test-org': String(o), 'x-test-role': role, 'x-test-user': '5' });

beforeAll(async () => {
  api = await startNetworksApi();
});
afterAll(async () => {
  await api?.stop();
});

/** A 4-cycle with a chord: A–B–C–D–A plus A–C. */
const square = {
  name: 'Square with chord',
  depots: [
    { id: 'A', name: 'Alder Yard', lat: 47.1, lon: -31.0, weight: 2 },
    { id: 'B', name: 'Birch Quay', lat: 47.2, lon: -31.0 },
    { id: 'C', lat: 47.2, lon: -30.9 },
    { id: 'D', lat: 47.1, lon: -30.9 },
  ],
  lanes: [
    { from: 'A', to: 'B', weight: 10 },
    { from: 'B', to: 'C', weight: 12.5 },
    { from: 'C', to: 'D', weight: 7 },
    { from: 'D', to: 'A', weight: 3 },
    { from: 'A', to: 'C', weight: 1 },
  ],
};

describe('networks: create, read, list', () => {
  test('POST creates version 1 and GET returns the document with its summary', async () => {
    const res = await request(api.app).post('/api/networks').set(as()).send(square);
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(Number), versionId: expect.any(Number), number: 1 });
    const got = await request(api.app).get(`/api/networks/${res.body.id}`).set(as('viewer'));
    expect(got.status).toBe(200);
    expect(got.body.latest.number).toBe(1);
    expect(got.body.latest.document.depots).toEqual(square.depots);
    expect(got.body.latest.document.lanes).toEqual(square.lanes);
    // Degrees: A, C have 3 neighbours, B, D have 2; one component (textbook, common practice).
    expect(got.body.latest.summary).toEqual({ depots: 4, lanes: 5, totalVolume: 33.5, components: 1, minDegree: 2, maxDegree: 3, hasCoordinates: true });
  });

  test('list: search by name, sort by name, size and updated, each with the latest summary', async () => {
    const o = freshOrg();
    const mk = (name: string, n: number) => ({
      name,
      depots: Array.from({ length: n }, (_, i) => ({ id: `d${i}` })),
      lanes: Array.from({ length: n - 1 }, (_, i) => ({ from: `d${i}`, to: `d${i + 1}`, weight: 1 })),
    });
    for (const [name, n] of [['Harbour east', 3], ['Alpine', 6], ['Harbour west', 9]] as const) {
      expect((await request(api.app).post('/api/networks').set(as('dispatcher', o)).send(mk(name, n))).status).toBe(201);
    }
    const names = async (q: string) => (await request(api.app).get(`/api/networks${q}`).set(as('viewer', o))).body.map((x: { name: string }) => x.name);
    expect(await names('?sort=name')).toEqual(['Alpine', 'Harbour east', 'Harbour west']);
    expect(await names('?sort=name&order=desc')).toEqual(['Harbour west', 'Harbour east', 'Alpine']);
    expect(await names('?sort=size')).toEqual(['Harbour west', 'Alpine', 'Harbour east']);
    expect(await names('?sort=updated')).toEqual(['Harbour west', 'Alpine', 'Harbour east']);
    expect(await names('?search=harbour&sort=name')).toEqual(['Harbour east', 'Harbour west']);
    expect(await names('?search=%25')).toEqual([]); // a literal %, not a wildcard
    const list = (await request(api.app).get('/api/networks?sort=size').set(as('viewer', o))).body;
    expect(list[0].summary).toEqual({ depots: 9, lanes: 8, totalVolume: 8 });
    expect(list[0].latestVersion).toBe(1);
  });

  test('another organisation sees none of it (404, empty list)', async () => {
    const res = await request(api.app).post('/api/networks').set(as()).send(square);
    const other = freshOrg();
    expect((await request(api.app).get(`/api/networks/${res.body.id}`).set(as('owner', other))).status).toBe(404);
    expect((await request(api.app).get(`/api/networks/${res.body.id}/versions`).set(as('owner', other))).status).toBe(404);
    expect((await request(api.app).get('/api/networks').set(as('owner', other))).body).toEqual([]);
  });

  test('access: signed-out 401, viewers may read but not write (shared/permissions.ts)', async () => {
    expect((await request(api.app).get('/api/networks')).status).toBe(401);
    const res = await request(api.app).post('/api/networks').set(as('viewer')).send(square);
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/networks:write/);
  });
});

describe('networks: validation (zod schema and checkNetwork rules)', () => {
  const post = (body: unknown) => request(api.app).post('/api/networks').set(as()).send(body as object);

  test.each([
    ['negative volume', { ...square, lanes: [...square.lanes.slice(0, 7), { from: 'A', to: 'D', weight: -4 }] }, 'lanes.5.weight', /≥ 0.*freight volumes cannot be negative/],
    ['non-numeric volume', { ...square, lanes: [{ from: 'A', to: 'B', weight: 'ten' }] }, 'lanes.0.weight', /number/],
    ['unknown depot', { ...square, lanes: [...square.lanes, { from: 'A', to: 'Z', weight: 1 }] }, 'lanes.5.to', /unknown depot "Z"/],
    ['self-loop', { ...square, lanes: [{ from: 'B', to: 'B', weight: 1 }] }, 'lanes.0.to', /itself/],
    ['duplicate depot id', { ...square, depots: [...square.depots, { id: 'B' }] }, 'depots.4.id', /appears twice/],
    ['latitude out of range', { ...square, depots: [{ id: 'A', lat: 95, lon: 0 }, ...square.depots.slice(1)] }, 'depots.0.lat', /−90…90/],
    ['empty name', { ...square, name: '  ' }, 'name', /name/],
  ])('%s → 400 with the field and a fix, nothing written', async (_label, body, field, message) => {
    const before = await rowCounts(api.deps, org);
    const res = await post(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields)).toContain(field);
    expect(res.body.fields[field].join(' ')).toMatch(message);
    expect(await rowCounts(api.deps, org)).toEqual(before);
  });

  test('the message names 1-based rows (what a person counts in a table)', async () => {
    const res = await post({ ...square, lanes: [...square.lanes, { from: 'A', to: 'Q', weight: 2 }] });
    expect(res.body.error).toMatch(/lane row 6: lane ends at unknown depot "Q"/);
  });
});

describe('versions', () => {
  let id: number;
  let v1: number;
  beforeAll(async () => {
    const res = await request(api.app).post('/api/networks').set(as()).send(square);
    id = res.body.id;
    v1 = res.body.versionId;
  });

  test('numbering 1, 2, 3 and immutability: saving never changes an earlier version', async () => {
    const before = (await request(api.app).get(`/api/networks/${id}/versions/${v1}`).set(as())).body;
    const changed = { depots: square.depots, lanes: square.lanes.map((l) => (l.from === 'A' && l.to === 'B' ? { ...l, weight: 99 } : l)) };
    const r2 = await request(api.app).post(`/api/networks/${id}/versions`).set(as()).send(changed);
    expect(r2.status).toBe(201);
    expect(r2.body.number).toBe(2);
    const r3 = await request(api.app).post(`/api/networks/${id}/versions`).set(as()).send({ ...changed, name: 'Renamed square', note: 'third' });
    expect(r3.body.number).toBe(3);
    const after = (await request(api.app).get(`/api/networks/${id}/versions/${v1}`).set(as())).body;
    expect(after).toEqual(before);
    const list = (await request(api.app).get(`/api/networks/${id}/versions`).set(as())).body;
    expect(list.map((v: { number: number }) => v.number)).toEqual([3, 2, 1]);
    expect(list[0].note).toBe('third');
    expect(list[0]).not.toHaveProperty('document');
    const detail = (await request(api.app).get(`/api/networks/${id}`).set(as())).body;
    expect(detail.name).toBe('Renamed square');
    expect(detail.latest.number).toBe(3);
    expect(detail.versionCount).toBe(3);
  });

  test('the model refuses updates and deletes of a version, and no route can change one', async () => {
    const row = await api.deps.models.NetworkVersion.findByPk(v1);
    await expect(row!.update({ note: 'tampered' })).rejects.toThrow(/immutable/);
    await expect(row!.destroy()).rejects.toThrow(/immutable/);
    await expect(api.deps.models.NetworkVersion.update({ note: 'x' }, { where: { id: v1 } })).rejects.toThrow(/immutable/);
    for (const method of ['put', 'patch', 'delete'] as const) {
      const res = await request(api.app)[method](`/api/networks/${id}/versions/${v1}`).set(as('owner')).send({ note: 'x' });
      expect(res.status).toBe(404);
    }
  });

  test('concurrent saves get distinct consecutive numbers', async () => {
    const o = freshOrg();
    const made = await request(api.app).post('/api/networks').set(as('dispatcher', o)).send(square);
    const saves = await Promise.all(Array.from({ length: 5 }, () => request(api.app).post(`/api/networks/${made.body.id}/versions`).set(as('dispatcher', o)).send(square)));
    expect(saves.map((s) => s.status)).toEqual([201, 201, 201, 201, 201]);
    expect(saves.map((s) => s.body.number).sort()).toEqual([2, 3, 4, 5, 6]);
  });

  test('duplicate saves an older version again as the newest', async () => {
    const res = await request(api.app).post(`/api/networks/${id}/versions/${v1}/duplicate`).set(as());
    expect(res.status).toBe(201);
    const dup = (await request(api.app).get(`/api/networks/${id}/versions/${res.body.versionId}`).set(as())).body;
    const orig = (await request(api.app).get(`/api/networks/${id}/versions/${v1}`).set(as())).body;
    expect(dup.document).toEqual(orig.document);
    expect(dup.source).toBe('duplicate');
    expect(dup.note).toBe('copy of version 1');
  });

  test('compare: added and removed depots and lanes, weight changes, changed depot fields', async () => {
    const next = {
      depots: [...square.depots.filter((d) => d.id !== 'D'), { id: 'E', name: 'Elm Store' }].map((d) => (d.id === 'B' ? { ...d, name: 'Birch Quay North' } : d)),
      lanes: [
        { from: 'B', to: 'A', weight: 11 }, // same pair written the other way round: a weight change, not add+remove
        { from: 'B', to: 'C', weight: 12.5 },
        { from: 'A', to: 'C', weight: 1 },
        { from: 'C', to: 'E', weight: 4 },
      ],
    };
    const r = await request(api.app).post(`/api/networks/${id}/versions`).set(as()).send(next);
    const cmp = await request(api.app).get(`/api/networks/${id}/compare?from=${v1}&to=${r.body.versionId}`).set(as('viewer'));
    expect(cmp.status).toBe(200);
    expect(cmp.body.addedDepots).toEqual(['E']);
    expect(cmp.body.removedDepots).toEqual(['D']);
    expect(cmp.body.changedDepots).toEqual([{ id: 'B', fields: ['name'] }]);
    expect(cmp.body.addedLanes).toEqual([{ from: 'C', to: 'E', weight: 4 }]);
    expect(cmp.body.removedLanes).toEqual([{ from: 'C', to: 'D', weight: 7 }, { from: 'D', to: 'A', weight: 3 }]);
    expect(cmp.body.weightChanges).toEqual([{ from: 'A', to: 'B', before: 10, after: 11 }]);
    const bad = await request(api.app).get(`/api/networks/${id}/compare?from=x&to=1`).set(as());
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toHaveProperty('from');
  });

  test('export round trip: CSV lanes + depots and GeoJSON (RFC 7946 FeatureCollection) read back to the same document', async () => {
    const lanes = await request(api.app).get(`/api/networks/${id}/versions/${v1}/export.csv`).set(as('viewer'));
    expect(lanes.status).toBe(200);
    expect(lanes.headers['content-type']).toMatch(/^text\/csv/);
    expect(lanes.headers['content-disposition']).toMatch(/attachment; filename="Square-with-chord-v1-lanes\.csv"/);
    const depots = await request(api.app).get(`/api/networks/${id}/versions/${v1}/export.csv?part=depots`).set(as('viewer'));
    // An independent CSV reader (papaparse) sees the header the importer documents.
    expect(Papa.parse<string[]>(lanes.text.trim()).data[0]).toEqual(['from', 'to', 'weight']);
    expect(Papa.parse<string[]>(depots.text.trim()).data[0]).toEqual(['id', 'name', 'lat', 'lon', 'weight']);
    const fromCsv = parseCsvNetwork({ name: 'lanes.csv', content: lanes.text }, { name: 'depots.csv', content: depots.text });
    expect(fromCsv.issues.filter((i) => i.severity === 'error')).toEqual([]);
    expect(fromCsv.document.depots).toEqual(square.depots);
    expect(fromCsv.document.lanes).toEqual(square.lanes);

    const geo = await request(api.app).get(`/api/networks/${id}/versions/${v1}/export.geojson`).set(as('viewer'));
    expect(geo.status).toBe(200);
    expect(geo.headers['content-type']).toMatch(/^application\/geo\+json/); // RFC 7946 §12 media type
    const fc = JSON.parse(geo.text);
    expect(fc.type).toBe('FeatureCollection');
    // RFC 7946 §3.1.1: positions are [longitude, latitude].
    expect(fc.features[0].geometry).toEqual({ type: 'Point', coordinates: [-31.0, 47.1] });
    const fromGeo = parseGeojson(geo.text, 'x.geojson');
    expect(fromGeo.document.depots).toEqual(square.depots);
    expect(fromGeo.document.lanes).toEqual(square.lanes);

    // The export also comes back through the import endpoint unchanged.
    const imp = await request(api.app).post('/api/networks/import').set(as()).attach('file', Buffer.from(lanes.text), 'lanes.csv').attach('depots', Buffer.from(depots.text), 'depots.csv');
    expect(imp.status).toBe(201);
    const back = (await request(api.app).get(`/api/networks/${imp.body.id}`).set(as())).body;
    expect(back.latest.document.depots).toEqual(square.depots);
    expect(back.latest.document.lanes).toEqual(square.lanes);
  });

  test('rename and delete; a deleted network keeps its versions for runs (getVersionDocument)', async () => {
    const made = await request(api.app).post('/api/networks').set(as()).send(square);
    expect((await request(api.app).patch(`/api/networks/${made.body.id}`).set(as()).send({ name: 'Renamed' })).body.name).toBe('Renamed');
    expect((await request(api.app).delete(`/api/networks/${made.body.id}`).set(as())).status).toBe(204);
    expect((await request(api.app).get(`/api/networks/${made.body.id}`).set(as())).status).toBe(404);
    const { getVersionDocument } = await import('../../server/services/networks');
    const doc = await getVersionDocument(api.deps, org, made.body.versionId);
    expect(doc.lanes).toEqual(square.lanes);
    await expect(getVersionDocument(api.deps, org + 1, made.body.versionId)).rejects.toThrow(/not found/);
  });
});

describe('demo networks', () => {
  test('ensureDemoNetworks seeds each demo once; "open demo" copies one into an empty organisation', async () => {
    const { ensureDemoNetworks, DEMO_NETWORKS } = await import('../../server/services/demo-networks');
    const o = freshOrg();
    expect(await ensureDemoNetworks(api.deps, o)).toBe(DEMO_NETWORKS.length);
    expect(await ensureDemoNetworks(api.deps, o)).toBe(0);
    const list = (await request(api.app).get('/api/networks?sort=size').set(as('viewer', o))).body;
    // Largest first: one list entry per demo, sized as its document.
    const sizes = DEMO_NETWORKS.map((d) => d.document.depots.length).sort((a, b) => b - a);
    expect(sizes.length).toBeGreaterThanOrEqual(3);
    expect(list.map((n: { summary: { depots: number } }) => n.summary.depots)).toEqual(sizes);

    const empty = freshOrg();
    const demos = (await request(api.app).get('/api/networks/demos').set(as('viewer', empty))).body;
    expect(demos.map((d: { key: string }) => d.key)).toEqual(DEMO_NETWORKS.map((d) => d.key));
    const copy = await request(api.app).post('/api/networks/demos').set(as('dispatcher', empty)).send({ key: 'quillmere-core' });
    expect(copy.status).toBe(201);
    const detail = (await request(api.app).get(`/api/networks/${copy.body.id}`).set(as('viewer', empty))).body;
    expect(detail.latest.summary).toMatchObject({ depots: 12, components: 1, hasCoordinates: true });
    expect((await request(api.app).post('/api/networks/demos').set(as('dispatcher', empty)).send({ key: 'nope' })).status).toBe(400);
  });
});
