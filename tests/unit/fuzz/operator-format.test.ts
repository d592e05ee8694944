import fc from 'fast-check';
import {
  MAX_OPERATOR_QUBITS, OPERATOR_FORMAT, formatOperatorText, operatorToJson, parseOperator, parseOperatorJson, parseOperatorText,
} from '../../../shared/engine/operators/format';
import { detectFormat, readNetwork } from '../../../shared/formats';
import type { PauliSum } from '../../../shared/engine/operators/types';

/**
 * Property tests for the custom operator format (shared/engine/operators/format.ts) and for the
 * network-file entry point readNetwork/detectFormat: readers never throw on any input and return
 * located issues; written operators read back exactly (round trip). Seeded, bounded runs.
 */
const SEED = 424242;
const opts = { numRuns: 300, seed: SEED };

/** An operator with unique Pauli strings and finite coefficients (−0 is written as 0: the same number, so it is left out). */
const operatorArb: fc.Arbitrary<PauliSum> = fc.integer({ min: 1, max: 8 }).chain((n) =>
  fc.record({
    numQubits: fc.constant(n),
    offset: fc.double({ noNaN: true, noDefaultInfinity: true }).map((v) => v + 0),
    terms: fc.uniqueArray(
      fc.record({
        letters: fc.array(fc.constantFrom('I', 'X', 'Y', 'Z'), { minLength: n, maxLength: n }).map((a) => a.join('')).filter((l) => /[XYZ]/.test(l)),
        coeff: fc.double({ noNaN: true, noDefaultInfinity: true }).map((v) => v + 0),
      }),
      { selector: (t) => t.letters, maxLength: 12 },
    ),
  }),
);

/** Lines that look like the text form, some damaged. */
const lineArb = fc.oneof(
  fc.constantFrom(`${OPERATOR_FORMAT} 1`, `${OPERATOR_FORMAT} 2`, 'qubits 3', 'qubits 0', `qubits ${MAX_OPERATOR_QUBITS + 1}`, 'qubits -1', 'offset 1e400', 'offset NaN', 'offset', '# note', '', '0.5 Z0 Z0', '1 Q1', '1 Z99', '1 z1 x2', '.5', '1e5 Y2 # trailing', '\t-2\tX0'),
  fc.tuple(fc.double(), fc.array(fc.tuple(fc.constantFrom('X', 'Y', 'Z', 'I', 'W', 'x'), fc.integer({ min: -1, max: 40 })), { maxLength: 4 })).map(([c, fs]) => `${c} ${fs.map(([l, q]) => `${l}${q}`).join(' ')}`),
  fc.string({ maxLength: 30 }),
  fc.string({ unit: 'binary', maxLength: 30 }),
);

describe('operator text and JSON readers', () => {
  test('never throw on arbitrary text; failures carry a located message', () => {
    fc.assert(fc.property(fc.oneof(fc.string({ maxLength: 200 }), fc.array(lineArb, { maxLength: 12 }).map((l) => l.join('\n'))), (text) => {
      for (const r of [parseOperatorText(text), parseOperator(text), parseOperatorJson(text)]) {
        if (!r.ok) {
          expect(r.issues.length).toBeGreaterThan(0);
          for (const i of r.issues) expect(i.message).toMatch(i.line !== undefined ? new RegExp(`^line ${i.line}: `) : /^\S.*: /);
        } else {
          expect(Number.isInteger(r.operator.numQubits)).toBe(true);
          expect(r.operator.numQubits).toBeGreaterThanOrEqual(1);
          expect(r.operator.numQubits).toBeLessThanOrEqual(MAX_OPERATOR_QUBITS);
          for (const t of r.operator.terms) expect(t.letters).toHaveLength(r.operator.numQubits);
          expect(Number.isFinite(r.operator.offset)).toBe(true);
        }
      }
    }), opts);
  });

  test('the JSON reader never throws on arbitrary JSON values, including near-valid documents', () => {
    const nearValid = fc.record({
      format: fc.oneof(fc.constant(OPERATOR_FORMAT), fc.anything()),
      version: fc.oneof(fc.constant(1), fc.anything()),
      qubits: fc.oneof(fc.integer({ min: -2, max: 40 }), fc.anything()),
      offset: fc.oneof(fc.double(), fc.anything()),
      terms: fc.oneof(fc.array(fc.record({ coeff: fc.oneof(fc.double(), fc.anything()), ops: fc.oneof(fc.constantFrom('Z0', 'X1 Y2', '', 'Q3', 'Z0 Z0'), fc.anything()) }), { maxLength: 5 }), fc.anything()),
    }, { requiredKeys: [] });
    fc.assert(fc.property(fc.oneof(fc.anything(), nearValid), (value) => {
      const r = parseOperatorJson(value);
      if (!r.ok) for (const i of r.issues) expect(i.path).toBeDefined();
      if (r.ok) for (const t of r.operator.terms) expect(Number.isFinite(t.coeff)).toBe(true);
    }), opts);
  });

  test('text round trip: format then parse gives the same operator (coefficients exactly)', () => {
    fc.assert(fc.property(operatorArb, fc.string({ maxLength: 40 }), (op, comment) => {
      const r = parseOperatorText(formatOperatorText(op, { comment }));
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.operator).toEqual(op);
    }), opts);
  });

  test('JSON round trip through a string and through a parsed value', () => {
    fc.assert(fc.property(operatorArb, (op) => {
      const json = operatorToJson(op);
      for (const r of [parseOperatorJson(JSON.stringify(json)), parseOperatorJson(json), parseOperator(JSON.stringify(json, null, 2))]) {
        expect(r.ok).toBe(true);
        if (r.ok) expect(r.operator).toEqual(op);
      }
    }), { ...opts, examples: [[{ numQubits: 1, offset: 0, terms: [] }]] });
  });
});

describe('network files: detectFormat and readNetwork', () => {
  test('never throw on arbitrary names and contents; every issue has a message', () => {
    const name = fc.oneof(fc.constantFrom('a.csv', 'a.txt', 'a.json', 'a.graphml', 'a.geojson', 'a.xml', 'a', '.csv', 'A.GRAPHML'), fc.string({ maxLength: 20 }));
    const content = fc.oneof(
      fc.string({ maxLength: 300 }),
      fc.string({ unit: 'binary', maxLength: 300 }),
      fc.anything({ maxDepth: 3 }).map((v) => JSON.stringify(v) ?? ''),
      fc.constantFrom('<graphml><graph><node id="a"/><edge source="a" target="b"/></graph></graphml>', '{"type":"FeatureCollection","features":[null]}', '3 2\n1 2 1\n2 3 x\n', 'from,to,weight\n"a,b\n'),
    );
    fc.assert(fc.property(name, content, (fileName, text) => {
      const format = detectFormat(fileName, text);
      expect(format === null || typeof format === 'string').toBe(true);
      const r = readNetwork(fileName, text);
      for (const issue of r.issues) expect(typeof issue.message).toBe('string');
    }), { numRuns: 200, seed: SEED });
  });
});
