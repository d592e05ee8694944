import fc from 'fast-check';
import { parseNetworkJson, writeNetworkJson } from '../../../shared/formats/json';
import { anyTextArb, fragmentsArb, networkArb } from './arbitraries';

const doc = (body: object) => JSON.stringify({ format: 'spinyard-network', version: 1, ...body });

describe('Spinyard JSON network document', () => {
  test('a valid document reads as given; numeric ids become strings; signed lane weights are allowed', () => {
    const { document, issues } = parseNetworkJson(doc({ name: 'Benelux', depots: [{ id: 'A', name: 'Antwerp', lat: 51.2, lon: 4.4, weight: 2 }, { id: 7 }], lanes: [{ from: 'A', to: 7, weight: -1 }] }));
    expect(issues).toEqual([]);
    expect(document).toEqual({ name: 'Benelux', depots: [{ id: 'A', name: 'Antwerp', lat: 51.2, lon: 4.4, weight: 2 }, { id: '7' }], lanes: [{ from: 'A', to: '7', weight: -1 }] });
  });

  test('schema problems become row-numbered messages with a fix; good rows are kept', () => {
    const { document, issues } = parseNetworkJson(doc({ depots: [{ id: 'A' }, { name: 'no id' }, { id: 'B', lat: 'north' }, { id: 'C' }], lanes: [{ from: 'A', to: 'C', weight: '3' }, { from: 'A', to: 'C', weight: 3 }, { from: 'A', to: 'B', weight: 1 }] }), 'net.json');
    const errors = issues.filter((i) => i.severity === 'error');
    expect(errors).toEqual([
      expect.objectContaining({ where: 'depots', row: 2, message: '"id" is missing; add it' }),
      expect.objectContaining({ where: 'depots', row: 3, message: expect.stringContaining('"lat" is "north"; write a JSON number') }),
      expect.objectContaining({ where: 'lanes', row: 1, message: expect.stringContaining('"weight" is "3"') }),
      expect.objectContaining({ where: 'lanes', row: 3, message: expect.stringContaining('unknown depot "B"') }),
    ]);
    expect(errors.every((e) => e.file === 'net.json')).toBe(true);
    expect(document.depots.map((d) => d.id)).toEqual(['A', 'C']);
    expect(document.lanes).toEqual([{ from: 'A', to: 'C', weight: 3 }]);
  });

  test('wrong format tag, newer version and broken JSON are single clear errors', () => {
    expect(parseNetworkJson(JSON.stringify({ depots: [], lanes: [] })).issues[0].message).toContain('"format": "spinyard-network"');
    expect(parseNetworkJson(JSON.stringify({ format: 'spinyard-network', version: 2, depots: [], lanes: [] })).issues[0].message).toContain('newer');
    const broken = parseNetworkJson('{\n "format": "spinyard-network",\n "depots": [1,,]\n}');
    expect(broken.issues).toHaveLength(1);
    expect(broken.issues[0].message).toContain('not valid JSON');
  });

  test('unknown fields are warnings, not errors', () => {
    const { issues } = parseNetworkJson(doc({ depots: [{ id: 'A', colour: 'red' }, { id: 'B' }], lanes: [{ from: 'A', to: 'B', weight: 1 }], owner: 'x' }));
    expect(issues.map((i) => i.severity)).toEqual(['warning', 'warning']);
  });

  test('arbitrary text never throws', () => {
    const arb = fc.oneof(anyTextArb, fragmentsArb(['{', '}', '[', ']', '"format":"spinyard-network",', '"version":1,', '"depots":', '"lanes":', '{"id":"A"}', '{"from":"A","to":"B","weight":1}', ',', 'null', '1e999']));
    fc.assert(fc.property(arb, (text) => {
      const r = parseNetworkJson(text);
      expect(r.issues.length > 0 || r.document.depots.length > 0).toBe(true);
    }), { numRuns: 300 });
  });

  test('arbitrary JSON values never throw', () => {
    fc.assert(fc.property(fc.jsonValue(), fc.jsonValue(), (depots, lanes) => {
      const r = parseNetworkJson(JSON.stringify({ format: 'spinyard-network', version: 1, depots, lanes }));
      expect(r.issues.length > 0 || r.document.depots.length > 0).toBe(true);
    }));
  });

  test('written networks read back identically', () => {
    fc.assert(fc.property(networkArb({ signedWeights: true }), (d) => {
      const r = parseNetworkJson(writeNetworkJson(d));
      expect(r.issues).toEqual([]);
      expect(r.document).toEqual(d);
    }));
  });
});
