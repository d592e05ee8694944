/**
 * Circuit resources against hand counts (rules: docs/runs.md, "Circuit resources") for QAOA
 * with p = 1 on a path, a ring and the complete graph on 4 depots, and the ladder ansatz; larger
 * complete graphs against the swap-network bound of Kivlichan et al., PRL 120, 110501 (2018):
 * n steps of at most ⌊n/2⌋ merged interaction-swaps (3 cx each, two-qubit depth 3 per step).
 */
import { ladderCircuit } from '../../../shared/engine/circuits/ladder';
import { qaoaCircuit } from '../../../shared/engine/circuits/qaoa';
import { circuitResources } from '../../../shared/engine/circuits/resources';
import { routeCircuit } from '../../../shared/engine/circuits/route';
import { circuitSummary } from '../../../shared/engine/circuits/summary';
import { complete, maxcutOperator, path, ring } from './graphs';

const counts = (r: { oneQubitGates: number; twoQubitGates: number; twoQubitDepth: number; depth: number; swaps: number }) =>
  [r.oneQubitGates, r.twoQubitGates, r.twoQubitDepth, r.depth, r.swaps];
const qaoa1 = (n: number, edges: [number, number][]) => qaoaCircuit({ operator: maxcutOperator(n, edges), layers: 1 });

describe('QAOA p = 1, hand-counted [1q, 2q, 2q depth, depth, swaps]', () => {
  test('path of 4 depots needs no swap on any layout', () => {
    const s = circuitSummary(qaoa1(4, path(4)));
    // 4 h + 3 rz + 4 rx; 3 × (cx rz cx); rounds {01, 23} then {12}: depth 1 + 3 + 3 + 1.
    expect(counts(s.layouts.all)).toEqual([11, 6, 4, 8, 0]);
    expect(counts(s.layouts.line)).toEqual([11, 6, 4, 8, 0]);
    expect(counts(s.layouts.grid)).toEqual([11, 6, 4, 8, 0]);
  });

  test('a path with scrambled labels is laid along the line (placement rule)', () => {
    const c = routeCircuit(qaoa1(4, [[2, 0], [0, 3], [3, 1]]), 'line');
    expect(c.swaps).toBe(0);
    expect(Array.from(c.initialPlacement)).toEqual([2, 0, 3, 1]); // walked from the end 1: 1, 3, 0, 2
  });

  test('ring of 4: direct on all-to-all and on the 2 × 2 grid, 5 swaps on a line', () => {
    const s = circuitSummary(qaoa1(4, ring(4)));
    expect(counts(s.layouts.all)).toEqual([12, 8, 4, 8, 0]);
    expect(counts(s.layouts.grid)).toEqual([12, 8, 4, 8, 0]);
    // Line: step 0 merges 01, 23; step 1 merges 03; step 2 swaps both pairs; 12 then direct.
    // 3 × 3 + 2 × 3 + 2 cx; depth 1 + 4 + 4 + 3 + 3 + 1.
    expect(counts(s.layouts.line)).toEqual([12, 17, 11, 16, 5]);
  });

  test('complete graph on 4 depots', () => {
    const s = circuitSummary(qaoa1(4, complete(4)));
    expect(counts(s.layouts.all)).toEqual([14, 12, 6, 11, 0]);
    // Line: merged 01, 23 | 03 | 13, 02 | direct 12: 5 × 3 + 2 cx.
    expect(counts(s.layouts.line)).toEqual([14, 17, 11, 17, 5]);
    // Grid 2 × 2 (snake 0 1 / 3 2): merged 01, 23 | 03; then 02, 13 | 12 direct between neighbours.
    expect(counts(s.layouts.grid)).toEqual([14, 15, 10, 16, 3]);
  });

  test.each([5, 6])('complete graph on %i depots stays within the full swap network', (n) => {
    const c = qaoa1(n, complete(n));
    for (const layout of ['line', 'grid'] as const) {
      const routed = routeCircuit(c, layout);
      const r = circuitResources(routed);
      expect(r.twoQubitGates).toBeLessThanOrEqual((3 * n * (n - 1)) / 2);
      expect(r.twoQubitDepth).toBeLessThanOrEqual(3 * n);
      // Every pair interacts exactly once: one rz per edge besides h and rx.
      expect(routed.gates.filter((g) => g.name === 'rz')).toHaveLength((n * (n - 1)) / 2);
    }
    expect(counts(circuitResources(routeCircuit(c, 'all'))).slice(0, 2)).toEqual([2 * n + (n * (n - 1)) / 2, n * (n - 1)]);
  });

  test('p layers repeat the cost operator; routing carries the order over', () => {
    const one = circuitSummary(qaoaCircuit({ operator: maxcutOperator(5, complete(5)), layers: 1 }));
    const three = circuitSummary(qaoaCircuit({ operator: maxcutOperator(5, complete(5)), layers: 3 }));
    expect(three.layouts.all.twoQubitGates).toBe(3 * one.layouts.all.twoQubitGates);
    expect(three.layouts.all.oneQubitGates).toBe(5 + 3 * (one.layouts.all.oneQubitGates - 5));
    expect(three.qubits).toBe(5);
  });

  test('linear terms add one rz each per layer', () => {
    const s = circuitSummary(qaoaCircuit({ operator: maxcutOperator(4, path(4), [0.5, 0, -1, 0]), layers: 2 }));
    expect(s.layouts.all.oneQubitGates).toBe(4 + 2 * (2 + 3 + 4));
  });
});

describe('ladder ansatz (VQE)', () => {
  test('ring of 4, one rung: cz direct on all-to-all, routed on a line', () => {
    const c = ladderCircuit({ numQubits: 4, layers: 1, entangler: 'ring' });
    const s = circuitSummary(c);
    // 2 rotation layers of ry + rz = 16; 4 cz in two rounds; depth ry rz cz cz ry rz.
    expect(counts(s.layouts.all)).toEqual([16, 4, 2, 6, 0]);
    // Line: merged cz·swap (2 cx + 2 h) on 01, 23 | 03; 2 swaps; cz 12 direct.
    expect(counts(s.layouts.line).slice(0, 2)).toEqual([16 + 6, 3 * 2 + 2 * 3 + 1]);
    expect(s.layouts.line.swaps).toBe(5);
  });

  test('line entangler needs no swap on a line', () => {
    const s = circuitSummary(ladderCircuit({ numQubits: 6, layers: 2, entangler: 'line' }));
    expect(s.layouts.line).toEqual(s.layouts.all);
  });
});

test('the grid never needs more two-qubit gates than the line (the snake is a line inside the grid)', () => {
  let seed = 17;
  const next = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
  for (let trial = 0; trial < 12; trial++) {
    const n = 5 + Math.floor(next() * 8);
    const edges: [number, number][] = [];
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (next() < 0.35) edges.push([i, j]);
    if (edges.length === 0) continue;
    const s = circuitSummary(qaoaCircuit({ operator: maxcutOperator(n, edges), layers: 2 }));
    expect(s.layouts.grid.twoQubitGates).toBeLessThanOrEqual(s.layouts.line.twoQubitGates);
    expect(s.layouts.line.twoQubitGates).toBeGreaterThanOrEqual(s.layouts.all.twoQubitGates);
  }
});
