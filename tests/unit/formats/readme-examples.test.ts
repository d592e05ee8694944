import fs from 'node:fs';
import path from 'node:path';
import { readNetwork } from '../../../shared/formats';

// The README shows a tiny example of each import format; they must stay readable as shown.
const readme = fs.readFileSync(path.resolve(__dirname, '../../../README.md'), 'utf8');
const section = readme.slice(readme.indexOf('### Import formats'), readme.indexOf('## Solvers and what they guarantee'));
const blocks = [...section.matchAll(/```(csv|json|xml|text)\n([\s\S]*?)```/g)].map(([, lang, body]) => ({ lang, body }));

describe('README import examples', () => {
  test('there is an example for CSV (lanes and depots), GeoJSON, GraphML and the edge list', () => {
    expect(blocks.map((b) => b.lang)).toEqual(['csv', 'csv', 'json', 'xml', 'text']);
  });

  test('the lanes CSV reads with its depots CSV', () => {
    const [lanes, depots] = blocks;
    const r = readNetwork('lanes.csv', lanes.body, { depots: { name: 'depots.csv', content: depots.body } });
    expect(r.issues.filter((i) => i.severity === 'error')).toEqual([]);
    expect(r.document.lanes).toHaveLength(2);
    expect(r.document.depots.find((d) => d.id === 'QCROSS')?.name).toBe('Quillmere Cross');
  });

  test.each([
    ['network.geojson', 2, 2, 1],
    ['network.graphml', 3, 2, 1],
    ['network.txt', 4, 3, 2],
  ])('%s reads without errors', (fileName, index, depots, lanes) => {
    const r = readNetwork(fileName, blocks[index].body);
    expect(r.issues.filter((i) => i.severity === 'error')).toEqual([]);
    expect(r.document.depots).toHaveLength(depots);
    expect(r.document.lanes).toHaveLength(lanes);
  });
});
