import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { OperatorInspector } from '../../components/runs/OperatorInspector';
import { boundProblem } from '../../components/runs/partition';
import type { RunDetail, RunPreview } from '../../components/runs/types';
import { getSolver } from '../../shared/engine/solvers/registry';
import { describeEncoding } from '../../shared/engine/solvers/orchestrate';

// The preview the server would send for this run: the summary of the circuit QAOA simulates,
// which for k regions is the first split (server/services/runs/preview.ts asks the solver).
const mockPost = jest.fn();
jest.mock('../../components/api/client', () => ({
  api: { get: jest.fn(), post: (path: string, body: unknown) => mockPost(path, body), delete: jest.fn() },
  ApiError: class extends Error {},
}));

// Cycle C6, unit lanes: three regions of two depots.
const c6 = {
  depots: Array.from({ length: 6 }, (_, i) => ({ id: `C${i}` })),
  lanes: Array.from({ length: 6 }, (_, i) => ({ from: `C${i}`, to: `C${(i + 1) % 6}`, weight: 1 })),
};
const problem = { kind: 'kway' as const, k: 3, tolerance: 0 };
const run = { id: 7, versionId: 3, problem, jobs: [{ solver: 'qaoa' }] } as unknown as RunDetail;

test('k regions: the term list counts the qubits of the operator QAOA simulates, as the summary does', async () => {
  const qaoa = getSolver('qaoa');
  const target = qaoa.circuit(boundProblem(c6, problem), qaoa.parseSettings({}));
  expect(target).not.toBeNull();
  const encoding = describeEncoding(target!.problem, target!.options);
  expect(encoding.qubits).toBe(6); // one qubit per depot for the first split, not 6 × 3 one-hot
  mockPost.mockResolvedValue({ depots: 6, lanes: 6, encoding, circuit: target!.what, encodingNote: null, solvers: [] } as unknown as RunPreview);

  render(
    <QueryClientProvider client={new QueryClient()}>
      <OperatorInspector run={run} document={c6} />
    </QueryClientProvider>,
  );
  fireEvent.click(screen.getByText('Inspect the cost operator'));
  await waitFor(() => expect(screen.getByText(/terms on 6 qubits/)).toBeTruthy());
  expect(screen.queryByText(/on 18 qubits/)).toBeNull();
  expect(screen.getAllByText(/Z0 \(C0\)/).length).toBeGreaterThan(0);
});
