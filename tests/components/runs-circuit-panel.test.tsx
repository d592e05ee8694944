/**
 * The run screen's "On a real device" panel: resources per layout (counted by the engine here),
 * device time, the noise comparison with ratios and the noisy best answer, the four OpenQASM
 * downloads for the chosen layout, and the analysts-only recomputation under other assumptions.
 */
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { qaoaCircuit } from '../../shared/engine/circuits/qaoa';
import { circuitSummary } from '../../shared/engine/circuits/summary';
import { defaultAssumptions } from '../../shared/engine/circuits/device';
import { CircuitPanel } from '../../components/runs/CircuitPanel';
import type { RunJob } from '../../components/runs/types';

const mockPost = jest.fn();
jest.mock('../../components/api/client', () => ({
  api: { get: jest.fn(), post: (path: string, body: unknown) => mockPost(path, body) },
  ApiError: class extends Error {},
}));

// Max-cut operator of a 4-depot ring, QAOA p = 1: 12 one-qubit and 8 two-qubit gates on all-to-all (hand count, docs/runs.md).
const ring = { numQubits: 4, offset: -2, linear: new Float64Array(4), quadI: Int32Array.of(0, 1, 2, 0), quadJ: Int32Array.of(1, 2, 3, 3), quadCoeff: new Float64Array(4).fill(0.5) };
const circuit = circuitSummary(qaoaCircuit({ operator: ring, layers: 1 }));
const time = (c: number) => ({ circuitSeconds: c, shotSeconds: c + 101e-6, estimateSeconds: 10_000 * (c + 101e-6), runSeconds: 50 * 10_000 * (c + 101e-6) });
const result = {
  value: 4, assignment: [0, 1, 0, 1], bound: 4, gap: 0, energy: -3.2, expectation: 3.2, params: [0.4, 0.3], seconds: 0.1, evaluations: 50, shots: 0, provenOptimal: true,
  circuit,
  deviceTime: { shotsPerSetting: 10_000, settings: 1, estimates: 50, readoutShots: 1024, assumptions: defaultAssumptions(), layouts: { all: time(1e-7), line: time(4e-7), grid: time(1e-7) } },
  noise: {
    layout: 'line' as const, assumptions: defaultAssumptions(),
    noiseless: { energy: -3.2, expectation: 3.2, ratio: 0.8 },
    depolarizing: { fidelity: 0.9, energy: -3.08, expectation: 3.08, ratio: 0.77 },
    trajectories: { count: 20, shots: 2000, energy: -3.1, energyStdError: 0.01, expectation: 3.1, expectationStdError: 0.012, ratio: 0.775, best: { assignment: [0, 1, 0, 1], value: 4, feasible: true } },
    reference: { value: 4, what: 'the bound (solver)' },
  },
};
const job = { id: 3, solver: 'qaoa', status: 'succeeded', result } as unknown as RunJob;

function show(role: 'dispatcher' | 'analyst', wide = false) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <CircuitPanel runId={9} job={job} result={job.result!} role={role} wide={wide} valueName="Cut weight" />
    </QueryClientProvider>,
  );
}

test('phone: resources per layout, device time, noise with ratios and the noisy best answer', () => {
  show('dispatcher');
  expect(screen.getByText('On a real device')).toBeTruthy();
  const all = screen.getByTestId('resources-all').textContent!;
  expect(all).toContain('One-qubit gates: 12');
  expect(all).toContain('Two-qubit gates: 8');
  expect(screen.getByTestId('resources-line').textContent).toContain('Swaps: 5');
  expect(screen.getByTestId('time-line').textContent).toContain('One energy estimate: 1.01 s');
  expect(screen.getByTestId('noise-depolarizing').textContent).toContain('Approximation ratio: 0.770');
  expect(screen.getByTestId('noise-trajectories').textContent).toContain('3.100 ± 0.012');
  expect(screen.getByTestId('noisy-best').textContent).toContain('cut weight 4');
  expect(screen.getByTestId('assumptions').textContent).toMatch(/from memory/);
  // Durations in the unit they are quoted in (was "reset and latency per shot 100000 ns").
  expect(screen.getByTestId('assumptions').textContent).toMatch(/one-qubit gate duration 25 ns; two-qubit gate duration 12 ns; read-out duration 1 µs; reset and latency per shot 100 µs/);
  expect(screen.queryByTestId('edit-assumptions')).toBeNull(); // dispatchers see the defaults only
});

test('four OpenQASM downloads follow the chosen layout', () => {
  show('dispatcher');
  const hrefs = () => [0, 1, 2, 3].map((i) => screen.getByTestId(`qasm-${i}`).getAttribute('href'));
  expect(hrefs()).toEqual([
    '/api/runs/9/circuit.qasm?job=3&version=3&layout=line&form=bound',
    '/api/runs/9/circuit.qasm?job=3&version=3&layout=line&form=parameterised',
    '/api/runs/9/circuit.qasm?job=3&version=2&layout=line&form=bound',
    '/api/runs/9/circuit.qasm?job=3&version=2&layout=line&form=parameterised',
  ]);
  fireEvent.click(screen.getByLabelText('Qubit layout: Square grid'));
  expect(hrefs().every((h) => h!.includes('layout=grid'))).toBe(true);
  expect(screen.getByTestId('qasm-2').getAttribute('download')).toBe('run-9-qaoa-grid-bound-openqasm2.qasm');
});

test('wide: a table with column headers', () => {
  show('dispatcher', true);
  expect(screen.getAllByText('Two-qubit depth').length).toBeGreaterThan(0);
  expect(screen.getByTestId('resources-grid').textContent).toContain('Square grid');
});

test('analysts change an assumption (ns in the form, seconds to the API) and see the recomputed time', async () => {
  const answer = { job: 3, solver: 'qaoa', circuit, deviceTime: { ...result.deviceTime, assumptions: { ...defaultAssumptions(), twoQubitGateSeconds: 200e-9 }, layouts: { all: time(2e-6), line: time(8e-6), grid: time(2e-6) } }, noise: result.noise, defaults: {} };
  mockPost.mockResolvedValue(answer);
  show('analyst');
  fireEvent.click(screen.getByTestId('edit-assumptions'));
  fireEvent.change(screen.getByTestId('assume-twoQubitGateSeconds'), { target: { value: '200' } });
  fireEvent.click(screen.getByTestId('recompute-device'));
  await waitFor(() => expect(mockPost).toHaveBeenCalled());
  const [path, body] = mockPost.mock.calls[0];
  expect(path).toBe('/runs/9/device');
  expect(body.job).toBe(3);
  expect(body.assumptions.twoQubitGateSeconds).toBeCloseTo(200e-9, 15);
  expect(Object.keys(body.assumptions)).toEqual(['twoQubitGateSeconds']);
  await waitFor(() => expect(screen.getByText(/Time on a device \(your assumptions\)/)).toBeTruthy());
  expect(screen.getByTestId('time-line').textContent).toContain('Circuit: 8.00 µs');
});
