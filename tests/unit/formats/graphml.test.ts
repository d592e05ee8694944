import fc from 'fast-check';
import { parseGraphml, writeGraphml } from '../../../shared/formats/graphml';
import { anyTextArb, fragmentsArb, networkArb } from './arbitraries';

// GraphML structure (graphml, key with for/attr.name and default, graph with edgedefault,
// node/edge/data) as specified by the GraphML primer (graphml.graphdrawing.org) [memory].
const SAMPLE = `<?xml version="1.0" encoding="UTF-8"?>
<graphml xmlns="http://graphml.graphdrawing.org/xmlns">
  <key id="d0" for="node" attr.name="Label" attr.type="string"/>
  <key id="d1" for="node" attr.name="latitude" attr.type="double"/>
  <key id="d2" for="node" attr.name="lng" attr.type="double"/>
  <key id="d3" for="node" attr.name="demand" attr.type="double"><default>1</default></key>
  <key id="d4" for="edge" attr.name="volume" attr.type="double"><default>2</default></key>
  <graph id="G" edgedefault="undirected">
    <!-- <node id="commented-out"/> -->
    <node id="a"><data key="d0">Antwerp</data><data key="d1">51.2</data><data key="d2">4.4</data></node>
    <node id="b"><data key="d3">5</data></node>
    <node id="c"/>
    <edge source="a" target="b"><data key="d4">7.5</data></edge>
    <edge source="b" target="c"/>
    <edge source="c" target="a" directed="true"><data key="d4">1</data></edge>
  </graph>
</graphml>`;

describe('GraphML', () => {
  test('keys are found by attr.name (label, latitude, lng, demand, volume) and key defaults apply', () => {
    const { document, issues } = parseGraphml(SAMPLE, 'net.graphml');
    expect(document.depots).toEqual([
      { id: 'a', name: 'Antwerp', lat: 51.2, lon: 4.4, weight: 1 },
      { id: 'b', weight: 5 },
      { id: 'c', weight: 1 },
    ]);
    expect(document.lanes).toEqual([
      { from: 'a', to: 'b', weight: 7.5 },
      { from: 'b', to: 'c', weight: 2 },
      { from: 'c', to: 'a', weight: 1 },
    ]);
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ severity: 'warning' });
    expect(issues[0].message).toContain('directed');
  });

  test('an explicit mapping overrides the name search, by key id or attr.name', () => {
    const { document } = parseGraphml(SAMPLE, 'net.graphml', { depotWeight: 'latitude', laneWeight: 'd4', depotName: 'd0' });
    expect(document.depots[0]).toMatchObject({ name: 'Antwerp', weight: 51.2 });
    const wrong = parseGraphml(SAMPLE, 'net.graphml', { laneWeight: 'tonnes' });
    expect(wrong.issues[0].severity).toBe('error');
    expect(wrong.issues[0].message).toContain('d4 (volume)');
  });

  test('directed graphs are read as undirected with one warning', () => {
    const { document, issues } = parseGraphml('<graphml><key id="w" for="edge" attr.name="weight"/><graph edgedefault="directed"><node id="x"/><node id="y"/><edge source="x" target="y"><data key="w">3</data></edge><edge source="y" target="x"><data key="w">4</data></edge></graph></graphml>');
    expect(document.lanes).toHaveLength(2);
    expect(issues.map((i) => i.severity)).toEqual(['warning', 'warning']); // directed + repeated pair summed
  });

  test('bad values, negative volumes and unknown nodes name their line; malformed XML names its line', () => {
    const text = '<graphml>\n<key id="w" for="edge" attr.name="weight"/>\n<graph edgedefault="undirected">\n<node id="x"/>\n<node id="y"/>\n<edge source="x" target="y"><data key="w">heavy</data></edge>\n<edge source="x" target="y"><data key="w">-2</data></edge>\n<edge source="x" target="z"><data key="w">1</data></edge>\n</graph></graphml>';
    const { issues } = parseGraphml(text, 'g.graphml');
    expect(issues.map((i) => [i.line, i.severity])).toEqual([[6, 'error'], [7, 'error'], [8, 'error']]);
    expect(issues[1].message).toContain('volumes must be ≥ 0');
    const broken = parseGraphml('<graphml>\n<graph>\n<node id="x">\n</graph>', 'g.graphml');
    expect(broken.issues).toEqual([expect.objectContaining({ line: 4, severity: 'error' })]);
  });

  test('arbitrary text never throws', () => {
    const arb = fc.oneof(anyTextArb, fragmentsArb(['<graphml>', '</graphml>', '<graph>', '</graph>', '<node id="a"/>', '<node id="b">', '</node>', '<edge source="a" target="b"/>', '<data key="w">', '</data>', '<key id="w" for="edge" attr.name="weight"/>', '<!--', '-->', '&amp;', '&#0;']));
    fc.assert(fc.property(arb, (text) => {
      const r = parseGraphml(text);
      expect(r.issues.length > 0 || r.document.depots.length > 0).toBe(true);
    }), { numRuns: 300 });
  });

  test('written networks read back identically', () => {
    fc.assert(fc.property(networkArb(), (doc) => {
      const r = parseGraphml(writeGraphml(doc));
      expect(r.issues).toEqual([]);
      expect(r.document).toEqual({ depots: doc.depots, lanes: doc.lanes });
    }));
  });
});

test('GraphML with entity declarations is refused before expansion (billion laughs)', () => {
  const bomb = '<?xml version="1.0"?><!DOCTYPE g [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">]><graphml><graph><node id="&b;"/></graph></graphml>';
  const r = parseGraphml(bomb);
  expect(r.issues).toEqual([expect.objectContaining({ severity: 'error', message: expect.stringContaining('<!ENTITY') })]);
});
