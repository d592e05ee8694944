import fc from 'fast-check';
import { parseEdgeList, writeEdgeList } from '../../../shared/formats/edgelist';
import { anyTextArb, fragmentsArb, networkArb } from './arbitraries';
import { biqmacTable, gsetTable, instanceNames, instanceText } from '../../data/load';


describe('edge list: the benchmark libraries read exactly as published', () => {
  // Sizes and weight sets from the data folders' tables: G-set (Helmberg & Rendl 2000, values
  // listed by Benlic & Hao 2013, tests/data/gset/best-known.csv) and Biq Mac (Wiegele 2007,
  // tests/data/biqmac/OPTIMA.csv). SOURCE.md: no duplicates or self-loops, 1-based ids, trailing space.
  const kept = new Set(instanceNames('gset'));
  const cases = [
    ...gsetTable().filter((r) => kept.has(r.instance)).map((r) => ({ set: 'gset' as const, name: r.instance, n: r.n, m: r.m, weights: r.weights })),
    ...biqmacTable().map((r) => ({ set: 'biqmac' as const, name: r.instance, n: r.n, m: r.m, weights: r.weights })),
  ];

  test('the tables list every instance file we keep (30 G-set, 47 Biq Mac)', () => {
    const listed = new Set(cases.map((c) => c.name));
    expect([...instanceNames('gset'), ...instanceNames('biqmac')].filter((f) => !listed.has(f))).toEqual([]);
    expect(instanceNames('gset')).toHaveLength(30);
    expect(instanceNames('biqmac')).toHaveLength(47);
  });

  test.each(cases)('$set/$name has n, m and weights as its table says', ({ set, name, n, m, weights }) => {
    const { document, issues } = parseEdgeList(instanceText(set, name), name);
    expect(issues).toEqual([]);
    expect(document.depots).toHaveLength(n);
    expect(document.depots[n - 1].id).toBe(String(n));
    expect(document.lanes).toHaveLength(m);
    const seen = new Set(document.lanes.map((l) => l.weight));
    if (weights === '+1' || weights === '1') expect([...seen]).toEqual([1]);
    else if (weights === '+-1') expect([...seen].sort()).toEqual([-1, 1]);
    else {
      const [lo, hi] = /\[(-?\d+)\.\.(-?\d+)\]/.exec(weights)!.slice(1).map(Number);
      for (const w of seen) { expect(Number.isInteger(w)).toBe(true); expect(w).toBeGreaterThanOrEqual(lo); expect(w).toBeLessThanOrEqual(hi); }
    }
  });
});

describe('edge list: tolerated layout and reported mistakes', () => {
  test('blank lines, # comments, trailing spaces and CRLF are tolerated', () => {
    const { document, issues } = parseEdgeList('# triangle\r\n3 3 \r\n\r\n1 2 1 \r\n2 3 -1   # signed lane\r\n1 3 2.5\r\n', 'tri.txt');
    expect(issues).toEqual([]);
    expect(document.lanes).toEqual([
      { from: '1', to: '2', weight: 1 },
      { from: '2', to: '3', weight: -1 },
      { from: '1', to: '3', weight: 2.5 },
    ]);
  });

  test('a lane count that disagrees with the header is an error on the header line', () => {
    const { document, issues } = parseEdgeList('\n4 3\n1 2 1\n2 3 1\n', 'short.txt');
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ file: 'short.txt', line: 2, severity: 'error' });
    expect(issues[0].message).toContain('declares 3 lanes but the file has 2');
    expect(document.lanes).toHaveLength(2); // the good rows are still offered
  });

  test('ids outside 1…n, bad weights and self-loops name their line; good rows survive', () => {
    const { document, issues } = parseEdgeList('3 4\n1 2 1\n1 4 1\n2 3 x\n3 3 1\n', 'bad.txt');
    const byLine = Object.fromEntries(issues.map((i) => [i.line, i.message]));
    expect(byLine[3]).toContain('outside 1…3');
    expect(byLine[4]).toContain('weight "x" is not a number');
    expect(byLine[5]).toContain('itself');
    expect(issues.every((i) => i.severity === 'error' && i.file === 'bad.txt')).toBe(true);
    expect(document.lanes).toEqual([{ from: '1', to: '2', weight: 1 }]);
  });

  test('a missing header and an empty file are errors, never exceptions', () => {
    expect(parseEdgeList('from to w\n1 2 3\n', 'x.txt').issues[0].message).toContain('"n m"');
    expect(parseEdgeList('', 'x.txt').issues[0].message).toContain('empty');
  });

  test('two-column lines are weight 1 with one warning', () => {
    const { document, issues } = parseEdgeList('2 1\n1 2\n');
    expect(document.lanes).toEqual([{ from: '1', to: '2', weight: 1 }]);
    expect(issues).toHaveLength(1);
    expect(issues[0].severity).toBe('warning');
  });
});

describe('edge list: properties (fast-check)', () => {
  test('arbitrary text never throws and yields issues or a document', () => {
    const arb = fc.oneof(anyTextArb, fragmentsArb(['3 2', '\n', ' ', '1', '2', '3', '-1', '#', '1e9', 'x', '0', '\r\n']));
    fc.assert(fc.property(arb, (text) => {
      const r = parseEdgeList(text, 'f.txt');
      expect(Array.isArray(r.document.depots) && Array.isArray(r.issues)).toBe(true);
      expect(r.issues.length > 0 || r.document.depots.length > 0).toBe(true);
    }), { numRuns: 300 });
  });

  test('written networks read back identically (signed weights kept exactly)', () => {
    fc.assert(fc.property(networkArb({ numbered: true, signedWeights: true }), (doc) => {
      const r = parseEdgeList(writeEdgeList(doc));
      expect(r.issues).toEqual([]);
      expect(r.document).toEqual(doc);
    }));
  });
});
