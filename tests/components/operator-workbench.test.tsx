/**
 * Operators of your own on screen: inspect shows terms, groups and shots; a refused operator
 * lists its problems by line (as the API names them); a run shows the energy next to the exact
 * ground energy, the gap and the circuit resources.
 */
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { OperatorWorkbench } from '../../components/operators/OperatorWorkbench';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn(), replace: jest.fn() }) }));
jest.mock('expo-document-picker', () => ({ getDocumentAsync: jest.fn() }));
const mockPost = jest.fn();
jest.mock('../../components/api/client', () => ({
  ...jest.requireActual('../../components/api/client'),
  api: { post: (path: string, body: unknown) => mockPost(path, body) },
}));

function show() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={client}><OperatorWorkbench wide={false} /></QueryClientProvider>
    </SafeAreaProvider>,
  );
}

test('inspect, then a refused operator lists its lines, then a run shows the gap', async () => {
  const { ApiError } = jest.requireActual('../../components/api/client');
  mockPost.mockImplementation(async (path: string, body: { text: string }) => {
    if (path === '/operators/inspect') return { qubits: 4, terms: 8, offset: 0, diagonal: false, coefficientNorm: 8, groups: [{ basis: 'ZZZZ', terms: 4 }, { basis: 'XXXX', terms: 4 }], precision: 0.08, shots: { uniformPerGroup: 5000, uniformTotal: 10000, weightedTotal: 10000 }, largest: [{ coeff: -1, factors: 'Z0 Z1' }] };
    if (body.text.includes('W1')) throw new ApiError(400, 'The operator has 1 problem(s)', { text: ['line 4: unknown Pauli letter "W" in "W1"; use X, Y or Z'] });
    return { solver: 'vqe', ansatz: 'alternating', qubits: 4, terms: 8, diagonal: false, energy: -5.2, exact: { energy: -5.2262, method: 'dense diagonalisation (ml-matrix), 16 × 16' }, gap: 0.0262, relativeGap: 0.005, params: [0.1, 0.2, 0.3, 0.4], paramNames: ['γ1', 'γ2', 'β1', 'β2'], evaluations: 120, shots: 0, seconds: 0.4, stopped: false, trace: [], circuit: { qubits: 4, layouts: { all: { oneQubitGates: 20, twoQubitGates: 16, twoQubitDepth: 8, depth: 14, swaps: 0 }, line: { oneQubitGates: 20, twoQubitGates: 34, twoQubitDepth: 22, depth: 30, swaps: 10 }, grid: { oneQubitGates: 20, twoQubitGates: 16, twoQubitDepth: 8, depth: 14, swaps: 0 } } }, circuitNote: null };
  });
  show();
  fireEvent.click(screen.getByTestId('operator-inspect'));
  await waitFor(() => expect(screen.getByTestId('operator-inspection').textContent).toContain('2 qubit-wise commuting group(s)'));
  fireEvent.change(screen.getByTestId('operator-text'), { target: { value: 'spinyard-operator 1\nqubits 2\n0.5 Z0 Z1\n1 W1\n' } });
  fireEvent.click(screen.getByTestId('operator-run'));
  await waitFor(() => expect(screen.getByTestId('operator-problems').textContent).toContain('line 4: unknown Pauli letter "W"'));
  fireEvent.change(screen.getByTestId('operator-text'), { target: { value: 'spinyard-operator 1\nqubits 4\n-1 Z0 Z1\n' } });
  fireEvent.change(screen.getByTestId('operator-layers'), { target: { value: '3' } });
  fireEvent.click(screen.getByTestId('operator-run'));
  await waitFor(() => expect(screen.getByTestId('operator-gap').textContent).toContain('0.0262 (0.50 % of |exact|)'));
  expect(screen.getByTestId('operator-circuit').textContent).toContain('Line: 20 one-qubit and 34 two-qubit gates');
  const body = mockPost.mock.calls.filter(([p]) => p === '/operators/solve').at(-1)![1];
  expect(body).toEqual({ text: 'spinyard-operator 1\nqubits 4\n-1 Z0 Z1\n', solver: 'vqe', settings: { layers: 3, ansatz: 'alternating' } });
});
