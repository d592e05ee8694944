/**
 * Networks inside the published limits (20 MB per file, 20,000 depots, 200,000 lanes) are saved
 * or refused with a 4xx that names the problem — never a 500 — and network CSV exports read back
 * as the same network. Each case below ended in a 500 before (database packet limit, a summary
 * that overflowed to Infinity, a version note longer than its column).
 */
import Papa from 'papaparse';
import request from 'supertest';
import { startNetworksApi, freshOrg } from './networks-support';
import { MAX_DEPOTS, MAX_LANES, MAX_FILE_BYTES } from '../../shared/formats';
import { VERSION_NOTE_MAX } from '../../shared/schemas/networks';

let api: Awaited<ReturnType<typeof startNetworksApi>>;
const org = freshOrg();
const as = (role = 'dispatcher') => ({ 'x-test-org': String(org), 'x-test-role': role });

beforeAll(async () => {
  api = await startNetworksApi();
});
afterAll(async () => {
  await api?.stop();
});

/** 20,000 depots with 26-character ids and 200,000 distinct lanes (offsets 1…10 around a ring). */
function largest() {
  const id = (i: number) => `QUILLMERE-DEPOT-${String(i).padStart(10, '0')}`;
  const depots = Array.from({ length: MAX_DEPOTS }, (_, i) => ({ id: id(i) }));
  const lanes = Array.from({ length: MAX_LANES }, (_, e) => {
    const a = e % MAX_DEPOTS, k = 1 + Math.floor(e / MAX_DEPOTS);
    return { from: id(a), to: id((a + k) % MAX_DEPOTS), weight: 1 + (e % 250) };
  });
  return { depots, lanes };
}

const importFile = (name: string, content: string, depots?: [string, string]) => {
  let r = request(api.app).post('/api/networks/import').set(as()).attach('file', Buffer.from(content), name);
  if (depots) r = r.attach('depots', Buffer.from(depots[1]), depots[0]);
  return r;
};
const version = async (id: number, versionId: number) => (await request(api.app).get(`/api/networks/${id}/versions/${versionId}`).set(as('viewer')).expect(200)).body;

describe('the largest networks inside the limits', () => {
  const big = largest();

  test('200,000 lanes with 26-character ids as CSV (11.5 MB) are saved', async () => {
    const csv = `from,to,weight\n${big.lanes.map((l) => `${l.from},${l.to},${l.weight}`).join('\n')}\n`;
    expect(csv.length).toBeGreaterThan(11_400_000);
    expect(csv.length).toBeLessThan(MAX_FILE_BYTES);
    const res = await importFile('valley-lanes.csv', csv);
    expect({ status: res.status, error: res.body.error }).toEqual({ status: 201, error: undefined });
    expect(res.body.counts).toEqual({ depots: MAX_DEPOTS, lanes: MAX_LANES });
    const v = await version(res.body.id, res.body.versionId);
    expect(v.document.lanes).toHaveLength(MAX_LANES);
    expect(v.document.lanes[MAX_LANES - 1]).toEqual(big.lanes[MAX_LANES - 1]);
  });

  test('the same network as JSON through POST /api/networks is saved', async () => {
    const body = JSON.stringify({ name: 'Quillmere Valley — every lane', ...big });
    expect(body.length).toBeLessThan(MAX_FILE_BYTES);
    // Large bodies are parsed only for callers with a credential (server/app.ts); any header will do here.
    const res = await request(api.app).post('/api/networks').set(as()).set('Authorization', 'Bearer stand-in').set('Content-Type', 'application/json').send(body);
    expect({ status: res.status, error: res.body.error }).toEqual({ status: 201, error: undefined });
    expect((await version(res.body.id, res.body.versionId)).summary).toMatchObject({ depots: MAX_DEPOTS, lanes: MAX_LANES });
  });
});

describe('a JSON body over the request limit', () => {
  test('413 naming the limit (files up to 20 MB go through the import)', async () => {
    const depots = Array.from({ length: 2000 }, (_, i) => ({ id: `D${i}`, name: 'Quillmere '.repeat(1400) }));
    const body = JSON.stringify({ name: 'Too long', depots, lanes: [] });
    expect(body.length).toBeGreaterThan(26 * 1024 * 1024);
    const res = await request(api.app).post('/api/networks').set(as()).set('Authorization', 'Bearer stand-in').set('Content-Type', 'application/json').send(body);
    expect(res.status).toBe(413);
    expect(res.body).toEqual({ error: 'The request body is larger than the 25 MB this request accepts.', code: 'body_too_large' });
  });
});

describe('numbers and names at the edges', () => {
  test('a lane volume of 1e300 is saved with its total', async () => {
    const res = await request(api.app).post('/api/networks').set(as()).send({ name: 'Heavy lane', depots: [{ id: 'A' }, { id: 'B' }, { id: 'C' }], lanes: [{ from: 'A', to: 'B', weight: 1e300 }, { from: 'B', to: 'C', weight: 2 }] });
    expect({ status: res.status, error: res.body.error }).toEqual({ status: 201, error: undefined });
    expect((await version(res.body.id, res.body.versionId)).summary.totalVolume).toBe(1e300);
  });

  test('volumes whose total no number can hold are refused with the row', async () => {
    const res = await request(api.app).post('/api/networks').set(as()).send({ name: 'Too heavy', depots: [{ id: 'A' }, { id: 'B' }, { id: 'C' }], lanes: [{ from: 'A', to: 'B', weight: 1.5e308 }, { from: 'B', to: 'C', weight: 1.5e308 }] });
    expect(res.status).toBe(400);
    expect(res.body.error).toContain('lane row 2: the lane weights up to this lane add up to more than 1.8e+308');
    expect(res.body.fields).toHaveProperty(['lanes.1.weight']);
    const imported = await importFile('heavy.csv', 'from,to,weight\nA,B,1.5e308\nB,C,1.5e308\n');
    expect(imported.status).toBe(400);
    expect(imported.body.issues[0]).toMatchObject({ file: 'heavy.csv', line: 3, severity: 'error' });
  });

  test('an upload whose file name has 299 characters is saved, its note shortened to the column', async () => {
    const name = `${'quillmere-valley-'.repeat(17)}lanes.csv`.padStart(299, 'x');
    expect(name).toHaveLength(299);
    const res = await importFile(name, 'from,to,weight\nA,B,1\nB,C,2\n');
    expect({ status: res.status, error: res.body.error }).toEqual({ status: 201, error: undefined });
    const v = await version(res.body.id, res.body.versionId);
    expect(Array.from(v.note as string).length).toBeLessThanOrEqual(VERSION_NOTE_MAX);
    expect(v.note).toMatch(/^imported x+quillmere-valley-/);
  });

  test('a decimal comma (CV06,CV07,1,5) is refused with its fix, nothing saved as volume 1', async () => {
    const res = await importFile('lanes.csv', 'from,to,weight\nCV05,CV06,2\nCV06,CV07,1,5\n');
    expect(res.status).toBe(400);
    expect(res.body.issues).toEqual([expect.objectContaining({ line: 3, severity: 'error', text: expect.stringContaining('write 1.5') })]);
  });
});

describe('CSV exports', () => {
  const doc = {
    name: 'Formula yard',
    depots: [
      { id: '=HYPERLINK("http://example.invalid")', name: '@Quillmere Cross', lat: 47.1, lon: -31.25, weight: 2 },
      { id: '+North', name: '-Sorrowby' },
      { id: "'=quoted", name: 'Tarnwyth' },
      { id: 'Plain' },
    ],
    lanes: [{ from: '=HYPERLINK("http://example.invalid")', to: '+North', weight: 5 }, { from: "'=quoted", to: 'Plain', weight: 0.5 }, { from: 'Plain', to: '+North', weight: 12 }],
  };

  test('text cells never start a formula, and importing the two exports gives the same network', async () => {
    const saved = await request(api.app).post('/api/networks').set(as()).send(doc).expect(201);
    const base = `/api/networks/${saved.body.id}/versions/${saved.body.versionId}/export.csv`;
    const lanesCsv = (await request(api.app).get(base).set(as('viewer')).expect(200)).text;
    const depotsCsv = (await request(api.app).get(`${base}?part=depots`).set(as('viewer')).expect(200)).text;
    const textCells = [
      ...Papa.parse<string[]>(lanesCsv, { skipEmptyLines: true }).data.slice(1).flatMap((r) => r.slice(0, 2)),
      ...Papa.parse<string[]>(depotsCsv, { skipEmptyLines: true }).data.slice(1).flatMap((r) => r.slice(0, 2)),
    ];
    expect(textCells.length).toBe(14);
    expect(textCells.filter((c) => /^[=+\-@\t\r]/.test(c))).toEqual([]);

    const again = await importFile('lanes.csv', lanesCsv, ['depots.csv', depotsCsv]);
    expect({ status: again.status, error: again.body.error }).toEqual({ status: 201, error: undefined });
    const back = await version(again.body.id, again.body.versionId);
    expect({ depots: back.document.depots, lanes: back.document.lanes }).toEqual({ depots: doc.depots, lanes: doc.lanes });
  });
});
