/**
 * Spinyard's custom-operator format (our own design, see shared/engine/operators/format.ts):
 * round trips through text and JSON, and line-numbered messages for malformed files.
 */
import { createRng } from '../../../shared/engine/random';
import {
  formatOperatorText, operatorToJson, parseOperator, parseOperatorJson, parseOperatorText,
} from '../../../shared/engine/operators/format';
import { simplifyPauliSum } from '../../../shared/engine/operators/pauli';
import { randomPauliSum } from './helpers';

const messages = (text: string): string[] => {
  const r = parseOperatorText(text);
  expect(r.ok).toBe(false);
  return r.issues.map((i) => i.message);
};

describe('custom operator format', () => {
  test('reads the documented example', () => {
    const r = parseOperatorText(
      ['# a spin model', 'spinyard-operator 1', 'qubits 8', 'offset -1.5', '0.5   Z0 Z3 X5   # trailing comment', '-2 y1', '', '0.25'].join('\n'),
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.operator).toEqual({
      numQubits: 8,
      offset: -1.25,
      terms: [{ letters: 'ZIIZIXII', coeff: 0.5 }, { letters: 'IYIIIIII', coeff: -2 }],
    });
  });

  test('text and JSON round trips are exact on random operators', () => {
    const rng = createRng(31);
    for (let trial = 0; trial < 20; trial++) {
      const p = simplifyPauliSum(randomPauliSum(1 + rng.int(12), 1 + rng.int(15), rng));
      const text = formatOperatorText(p, { comment: `trial ${trial}` });
      const back = parseOperatorText(text);
      expect(back).toEqual({ ok: true, operator: p, issues: [] });
      const json = JSON.stringify(operatorToJson(p));
      expect(parseOperatorJson(json)).toEqual({ ok: true, operator: p, issues: [] });
      expect(parseOperator(json)).toEqual(parseOperator(text));
    }
  });

  test('bad header', () => {
    expect(messages('qubits 3\n1 Z0\n')).toEqual(['line 1: expected the header "spinyard-operator 1" as the first line, found "qubits 3"']);
    expect(messages('\n# c\nspinyard-operator 2\nqubits 3\n')[0]).toMatch(/^line 3: unsupported version "2"/);
    expect(messages('')[0]).toMatch(/^line 1: empty operator/);
  });

  test('unknown letter', () => {
    expect(messages('spinyard-operator 1\nqubits 4\n1 Z0\n0.5 Z1 W2\n')).toEqual([
      'line 4: unknown Pauli letter "W" in "W2"; use X, Y or Z (identity factors need no letter)',
    ]);
  });

  test('qubit out of range', () => {
    expect(messages('spinyard-operator 1\nqubits 8\noffset 0\n1.5 X9 Z0\n')).toEqual([
      'line 4: qubit 9 is outside 0…7; raise "qubits" or fix the index',
    ]);
  });

  test('non-numeric coefficient', () => {
    expect(messages('spinyard-operator 1\nqubits 2\nabc Z0\n')).toEqual([
      'line 3: coefficient "abc" is not a number; start each term with a number like 0.5, -2 or 1e-3',
    ]);
    expect(messages('spinyard-operator 1\nqubits 2\n1.2.3 Z0\n')[0]).toMatch(/^line 3: coefficient "1\.2\.3"/);
  });

  test('duplicate qubit in one term', () => {
    expect(messages('spinyard-operator 1\nqubits 3\n\n2 Z1 X0 X1\n')).toEqual([
      'line 4: qubit 1 appears twice in one term ("Z1" and "X1"); give each qubit at most one letter per term',
    ]);
  });

  test('several problems are all reported, each with its line; terms before "qubits" are refused', () => {
    const m = messages('spinyard-operator 1\nqubits 2\n1 Q0\nx Z1\noffset 1\noffset 2\n');
    expect(m.map((s) => s.split(':')[0])).toEqual(['line 3', 'line 4', 'line 6']);
    expect(messages('spinyard-operator 1\n1 Z0\n')[0]).toBe('line 2: a term comes before "qubits N"; declare the number of qubits first');
  });

  test('JSON issues name the path', () => {
    const r = parseOperatorJson({ format: 'spinyard-operator', version: 1, qubits: 2, terms: [{ coeff: 1, ops: 'Z0' }, { coeff: 'x', ops: 'Z1' }, { coeff: 1, ops: 'Z5' }] });
    expect(r.ok).toBe(false);
    expect(r.issues.map((i) => i.message)).toEqual([
      'terms[1].coeff: coefficient "x" is not a number; use a JSON number like 0.5',
      'terms[2].ops: qubit 5 is outside 0…1; raise "qubits" or fix the index',
    ]);
    expect(parseOperatorJson('{nope').issues[0].message).toMatch(/^\(document\): not valid JSON/);
    expect(parseOperatorJson({ format: 'other', version: 1 }).issues[0].message).toMatch(/^format: expected "spinyard-operator"/);
  });
});
