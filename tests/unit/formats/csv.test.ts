import fc from 'fast-check';
import { buildCompactNetwork } from '../../../shared/engine/network/build';
import { parseCsvNetwork, writeDepotsCsv, writeLanesCsv } from '../../../shared/formats/csv';
import { anyTextArb, fragmentsArb, networkArb } from './arbitraries';

const lanes = (content: string) => ({ name: 'lanes.csv', content });
const depots = (content: string) => ({ name: 'depots.csv', content });

describe('CSV lanes file', () => {
  test('header names are case-insensitive; depots are the ids in first-seen order', () => {
    const { document, issues } = parseCsvNetwork(lanes('From, TO ,Weight\nHub,North,12.5\nNorth,South,3\nSouth,Hub,1\n'));
    expect(issues).toEqual([]);
    expect(document.depots.map((d) => d.id)).toEqual(['Hub', 'North', 'South']);
    expect(document.lanes[0]).toEqual({ from: 'Hub', to: 'North', weight: 12.5 });
    expect(() => buildCompactNetwork(document)).not.toThrow();
  });

  test('extra columns are ignored with one warning naming them', () => {
    const { document, issues } = parseCsvNetwork(lanes('from,to,weight,carrier\nA,B,1,DHL\n'));
    expect(document.lanes).toEqual([{ from: 'A', to: 'B', weight: 1 }]);
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ severity: 'warning', line: 1 });
    expect(issues[0].message).toContain('"carrier"');
  });

  test('a missing header is an error naming the expected header', () => {
    const { issues } = parseCsvNetwork(lanes('A,B,1\nB,C,2\n'));
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ file: 'lanes.csv', line: 1, severity: 'error' });
    expect(issues[0].message).toContain('from,to,weight');
  });

  test('errors give the line the row starts on, even after a quoted multi-line cell', () => {
    const text = 'from,to,weight\n"Depot\nwith newline",B,1\n\nB,C,abc\nC,D,12,5\nD,A,-4\n';
    const { document, issues } = parseCsvNetwork(lanes(text));
    const errors = issues.filter((i) => i.severity === 'error');
    expect(errors.map((e) => e.line)).toEqual([5, 6, 7]);
    expect(errors[0].message).toBe('weight "abc" is not a number; use a number such as 12.5');
    // "C,D,12,5" is four cells: a decimal comma, refused with its fix (not read as volume 12).
    expect(errors[1].message).toContain('write 12.5');
    expect(errors[2].message).toContain('volume -4');
    expect(document.lanes.map((l) => l.weight)).toEqual([1]);
  });

  test('a decimal comma (semicolon-separated files) gets a specific fix', () => {
    const { issues } = parseCsvNetwork(lanes('from;to;weight\nA;B;12,5\n'));
    expect(issues[0].message).toContain('write it with a point, such as 12.5');
  });

  test('non-finite weights and empty ids are refused', () => {
    const { issues } = parseCsvNetwork(lanes('from,to,weight\nA,B,Infinity\n,B,1\nA,B,1e999\n'));
    expect(issues.map((i) => i.line)).toEqual([2, 3, 4]);
    expect(issues.every((i) => i.severity === 'error')).toBe(true);
  });
});

describe('CSV depots file', () => {
  test('depots come from the depots file with coordinates and weights; lanes to unknown ids are errors', () => {
    const { document, issues } = parseCsvNetwork(
      lanes('from,to,weight\nA,B,1\nB,Z,2\n'),
      depots('ID,Name,Lat,Lon,Weight\nA,Antwerp,51.22,4.40,3\nB,Brussels,50.85,4.35,\nC,,,,\nA,Again,0,0,1\n'),
    );
    expect(document.depots).toEqual([
      { id: 'A', name: 'Antwerp', lat: 51.22, lon: 4.4, weight: 3 },
      { id: 'B', name: 'Brussels', lat: 50.85, lon: 4.35 },
      { id: 'C' },
    ]);
    const errors = issues.filter((i) => i.severity === 'error');
    expect(errors).toEqual([
      expect.objectContaining({ file: 'depots.csv', line: 5, message: expect.stringContaining('appears twice') }),
      expect.objectContaining({ file: 'lanes.csv', line: 3, message: expect.stringContaining('unknown depot "Z"') }),
    ]);
  });

  test('the depots header needs only id; latitude outside −90…90 is caught by the shared network check', () => {
    const { issues } = parseCsvNetwork(lanes('from,to,weight\nA,B,1\n'), depots('id,lat,lon\nA,95,0\nB,0,0\n'));
    expect(issues).toHaveLength(2);
    expect(issues[0]).toMatchObject({ file: 'depots.csv', line: 2 });
    expect(issues[0].message).toContain('−90…90');
    // The lane to the dropped depot says why instead of calling the depot unknown.
    expect(issues[1]).toMatchObject({ file: 'lanes.csv', line: 2 });
    expect(issues[1].message).toContain('left out because of its own error');
  });
});

describe('CSV properties (fast-check)', () => {
  test('arbitrary text in either file never throws', () => {
    const arb = fc.oneof(anyTextArb, fragmentsArb(['from,to,weight\n', 'id,name,lat,lon,weight\n', ',', ';', '"', '\n', 'A', 'B', '1', '-2', '1,5', 'NaN', '\r']));
    fc.assert(fc.property(arb, fc.option(arb), (l, d) => {
      const r = parseCsvNetwork(lanes(l), d === null ? undefined : depots(d));
      expect(r.issues.length > 0 || r.document.depots.length > 0).toBe(true);
    }), { numRuns: 300 });
  });

  test('written lanes and depots read back identically', () => {
    fc.assert(fc.property(networkArb(), (doc) => {
      const r = parseCsvNetwork(lanes(writeLanesCsv(doc)), depots(writeDepotsCsv(doc)));
      expect(r.issues).toEqual([]);
      expect(r.document).toEqual({ depots: doc.depots, lanes: doc.lanes });
    }));
  });
});
