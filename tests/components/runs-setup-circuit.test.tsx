/**
 * Circuit resources in the run setup, before launch: one plain line per chosen QAOA/VQE entry for
 * dispatchers, and the table per qubit layout behind the details control — numbers from the
 * engine's own plan of the circuit (shared/engine/solvers/circuit-plan.ts), as the preview sends them.
 */
import { fireEvent, render, screen } from '@testing-library/react';
import { EncodingSummary } from '../../components/runs/EncodingSummary';
import { circuitLine } from '../../components/runs/setup-words';
import type { RunPreview } from '../../components/runs/types';
import { qaoaSolver } from '../../shared/engine/solvers/qaoa';
import { problemOf, ringEdges } from '../unit/encodings/fixtures';

// A 4-depot ring, QAOA p = 1: 8 two-qubit gates on all-to-all, 17 on a line (hand count, docs/runs.md).
const circuit = qaoaSolver.plannedCircuit(problemOf(4, ringEdges(4), { kind: 'maxcut' }), qaoaSolver.parseSettings({ layers: 1 }), 0)!.summary;
const enc = { method: 'max-cut', qubits: 4, pauliTerms: 4, offset: -2, penalties: [], rule: 'one qubit per depot', commutingGroups: 1, precision: 0.04, shots: 10_000 };
const preview: RunPreview = {
  encoding: enc, circuit: 'the maxcut encoding',
  solvers: [
    { solver: 'qaoa', qubits: 4, refusal: null, circuit, estimatedSeconds: { atMost: 12 } },
    { solver: 'tabu', qubits: 0, refusal: null, circuit: null, estimatedSeconds: { atMost: 12 } },
    { solver: 'vqe', qubits: 4, refusal: 'too wide', circuit, estimatedSeconds: { atMost: 12 } },
  ],
};
const solvers = [{ name: 'qaoa', label: 'QAOA (simulated quantum circuit)', family: 'variational' as const, kinds: ['maxcut' as const], guarantee: '' }];

test('the plain line: qubits and two-qubit gates on a line, and when every pair is connected', () => {
  expect(circuit.layouts.all.twoQubitGates).toBe(8);
  expect(circuit.layouts.line.twoQubitGates).toBe(17);
  expect(circuitLine('QAOA', circuit)).toBe('QAOA on a real device: 4 qubits and 17 two-qubit gates with the qubits in a line (8 if every pair were connected).');
  const path = qaoaSolver.plannedCircuit(problemOf(4, [[0, 1, 1], [1, 2, 1], [2, 3, 1]], { kind: 'maxcut' }), qaoaSolver.parseSettings({ layers: 1 }), 0)!.summary;
  expect(circuitLine('QAOA', path)).toBe('QAOA on a real device: 4 qubits and 6 two-qubit gates with the qubits in a line.'); // a path needs no swaps
});

test('phone, dispatcher: one line per chosen circuit solver; the table only behind the details control', () => {
  render(<EncodingSummary preview={preview} solvers={solvers} chosen={['qaoa', 'tabu', 'vqe']} />);
  expect(screen.getByTestId('circuit-line-qaoa').textContent).toBe('QAOA on a real device: 4 qubits and 17 two-qubit gates with the qubits in a line (8 if every pair were connected).');
  expect(screen.queryByTestId('circuit-line-tabu')).toBeNull(); // classical: no circuit
  expect(screen.queryByTestId('circuit-line-vqe')).toBeNull(); // refused: it will not run
  expect(screen.queryByTestId('enc-resources')).toBeNull();
  fireEvent.click(screen.getByTestId('encoding-details-toggle'));
  const line = screen.getByTestId('enc-qaoa-line').textContent!;
  expect(line).toContain('Two-qubit gates: 17');
  expect(line).toContain('Swaps: 5');
  expect(screen.getByTestId('enc-qaoa-all').textContent).toContain('Two-qubit depth: 4');
  expect(screen.getByTestId('enc-qaoa-grid').textContent).toContain('Depth: 8');
  expect(screen.getByTestId('enc-resources-qaoa').textContent).toContain('QAOA · 4 qubits');
});

test('wide: a table with a header row; unchosen solvers are left out', () => {
  render(<EncodingSummary preview={preview} solvers={solvers} chosen={['tabu']} wide />);
  expect(screen.queryByTestId('circuit-line-qaoa')).toBeNull();
  render(<EncodingSummary preview={preview} solvers={solvers} chosen={['qaoa']} wide analyst />);
  expect(screen.getByTestId('enc-resources-qaoa').textContent).toContain('LayoutOne-qubit gatesTwo-qubit gatesTwo-qubit depthDepthSwaps'); // the header row
  expect(screen.getByTestId('enc-qaoa-line').textContent).toBe(['Line', 12, 17, 11, 16, 5].join('')); // hand count, docs/runs.md
});
