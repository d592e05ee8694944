import fc from 'fast-check';
import { parseGeojson, writeGeojson } from '../../../shared/formats/geojson';
import { anyTextArb, fragmentsArb, networkArb } from './arbitraries';

const point = (lon: number, lat: number, properties: object, extra: object = {}) => ({ type: 'Feature', geometry: { type: 'Point', coordinates: [lon, lat] }, properties, ...extra });
const line = (coords: number[][], properties: object) => ({ type: 'Feature', geometry: { type: 'LineString', coordinates: coords }, properties });
const collection = (features: unknown[]) => JSON.stringify({ type: 'FeatureCollection', features });

describe('GeoJSON FeatureCollection', () => {
  test('positions are [longitude, latitude] (RFC 7946 §3.1.1, Butler et al. 2016 [memory]); ids from properties or the feature', () => {
    const { document, issues } = parseGeojson(collection([
      point(4.40, 51.22, { id: 'ANR', name: 'Antwerp', weight: 3 }),
      point(4.35, 50.85, {}, { id: 42 }),
      line([[4.40, 51.22], [4.37, 51.0], [4.35, 50.85]], { weight: 12.5 }),
    ]), 'net.geojson');
    expect(issues).toEqual([]);
    expect(document.depots).toEqual([
      { id: 'ANR', name: 'Antwerp', weight: 3, lon: 4.40, lat: 51.22 },
      { id: '42', lon: 4.35, lat: 50.85 },
    ]);
    // Ends matched exactly to the Points; intermediate vertices do not matter.
    expect(document.lanes).toEqual([{ from: 'ANR', to: '42', weight: 12.5 }]);
  });

  test('properties.from/to win over coordinates; lanes may come before their depots', () => {
    const { document, issues } = parseGeojson(collection([
      line([[0, 0], [9, 9]], { from: 'b', to: 'a', weight: 1 }),
      point(1, 1, { id: 'a' }),
      point(2, 2, { id: 'b' }),
    ]));
    expect(issues).toEqual([]);
    expect(document.lanes).toEqual([{ from: 'b', to: 'a', weight: 1 }]);
  });

  test('issues name the feature index: unmatched ends, ambiguous ends, negative volume, missing id', () => {
    const { document, issues } = parseGeojson(collection([
      point(0, 0, { id: 'a' }),
      point(1, 1, { id: 'b' }),
      point(1, 1, { id: 'c' }),
      line([[0, 0], [5, 5]], { weight: 1 }),
      line([[0, 0], [1, 1]], { weight: 1 }),
      line([[0, 0], [1, 1]], { from: 'a', to: 'b', weight: -3 }),
      point(7, 7, { name: 'nameless' }),
      line([[0, 0], [1, 1]], {}),
      { type: 'Feature', geometry: { type: 'Polygon', coordinates: [] }, properties: {} },
    ]), 'net.geojson');
    const errors = issues.filter((i) => i.severity === 'error');
    expect(errors.map((e) => e.feature)).toEqual([3, 4, 5, 6]);
    expect(errors[0].message).toContain('[5, 5] matches no depot');
    expect(errors[1].message).toContain('several depots (b, c)');
    expect(errors[2].message).toContain('volumes must be ≥ 0');
    expect(errors[3].message).toContain('properties.id');
    expect(issues.filter((i) => i.severity === 'warning').map((w) => w.feature)).toEqual([7, 8]);
    expect(document.lanes).toEqual([]);
    expect(document.depots.map((d) => d.id)).toEqual(['a', 'b', 'c']);
  });

  test('anything but a FeatureCollection is one error', () => {
    const r = parseGeojson(JSON.stringify(point(0, 0, { id: 'a' })));
    expect(r.issues).toHaveLength(1);
    expect(r.issues[0].message).toContain('found a Feature');
  });

  test('arbitrary text and arbitrary JSON features never throw', () => {
    const arb = fc.oneof(anyTextArb, fragmentsArb(['{"type":"FeatureCollection","features":[', ']}', '{"type":"Feature","geometry":', '{"type":"Point","coordinates":[0,0]}', 'null', ',"properties":{"id":"a","weight":1}}', ',']));
    fc.assert(fc.property(arb, (text) => {
      const r = parseGeojson(text);
      expect(r.issues.length > 0 || r.document.depots.length > 0).toBe(true);
    }), { numRuns: 300 });
    fc.assert(fc.property(fc.array(fc.record({ type: fc.constant('Feature'), geometry: fc.jsonValue(), properties: fc.jsonValue() })), (features) => {
      const r = parseGeojson(collection(features));
      expect(r.issues.length > 0 || r.document.depots.length > 0).toBe(true);
    }));
  });

  test('written networks read back identically (depots without coordinates use null geometry)', () => {
    fc.assert(fc.property(networkArb(), (doc) => {
      const r = parseGeojson(writeGeojson(doc));
      expect(r.issues).toEqual([]);
      expect(r.document).toEqual(doc);
    }));
  });
});
