import { detectFormat } from '../../../shared/formats/detect';
import { readNetwork, formatIssue, MAX_DEPOTS, MAX_FILE_BYTES, MAX_LANES } from '../../../shared/formats';

describe('detectFormat and readNetwork', () => {
  test('extension decides; .json holding a FeatureCollection is GeoJSON', () => {
    expect(detectFormat('G1.txt', '800 19176 \n')).toBe('edgelist');
    expect(detectFormat('Lanes.CSV', 'from,to,weight\n')).toBe('csv');
    expect(detectFormat('net.json', '{"format":"spinyard-network"}')).toBe('json');
    expect(detectFormat('map.json', '{"type": "FeatureCollection", "features": []}')).toBe('geojson');
    expect(detectFormat('net.graphml', '<graphml/>')).toBe('graphml');
    expect(detectFormat('net.geojson', '{}')).toBe('geojson');
  });

  test('files without a known extension are sniffed (Biq Mac files have none)', () => {
    expect(detectFormat('g05_60.0', '60 885\n1 2 1\n')).toBe('edgelist');
    expect(detectFormat('upload', '<?xml version="1.0"?><graphml/>')).toBe('graphml');
    expect(detectFormat('upload', 'from,to,weight\n')).toBe('csv');
    expect(detectFormat('upload', 'hello')).toBeNull();
    expect(readNetwork('upload', 'hello').issues[0].message).toContain('.graphml');
  });

  test('oversized content is refused before parsing, naming the limit', () => {
    const big = 'x'.repeat(MAX_FILE_BYTES + 1);
    const r = readNetwork('huge.csv', big);
    expect(r.issues).toHaveLength(1);
    expect(r.issues[0].message).toContain('limit is 20.0 MB');
  });

  test('depot and lane counts over the exported limits are errors', () => {
    const r = readNetwork('big.txt', `${MAX_DEPOTS + 1} 0\n`);
    expect(r.issues.map((i) => i.message)).toEqual([expect.stringContaining(`limit is ${MAX_DEPOTS}`)]);
    const lanes = Array.from({ length: MAX_LANES + 1 }, (_, e) => `${(e % 600) + 1} ${601 + Math.floor(e / 600)} 1`);
    const r2 = readNetwork('dense.txt', `1000 ${lanes.length}\n${lanes.join('\n')}\n`);
    expect(r2.issues.map((i) => i.message)).toEqual([expect.stringContaining(`limit is ${MAX_LANES}`)]);
  });

  test('issues print as "file line N: message"', () => {
    const r = readNetwork('lanes.csv', 'from,to,weight\nA,B,1\nB,C,abc\n');
    expect(formatIssue(r.issues[0])).toBe('lanes.csv line 3: weight "abc" is not a number; use a number such as 12.5');
    const j = readNetwork('net.json', JSON.stringify({ format: 'spinyard-network', version: 1, depots: [{ id: 'A' }], lanes: [{ from: 'A', to: 'Q', weight: 1 }] }));
    expect(formatIssue(j.issues[0])).toBe('net.json lane 1: lane ends at unknown depot "Q"; add the depot or fix the id');
  });
});

test('a depots file given with a non-CSV network is reported, not silently dropped', () => {
  const r = readNetwork('g.txt', '2 1\n1 2 1\n', { depots: { name: 'depots.csv', content: 'id\n1\n2\n' } });
  expect(r.document.lanes).toHaveLength(1);
  expect(r.issues).toEqual([expect.objectContaining({ file: 'depots.csv', severity: 'warning' })]);
});
