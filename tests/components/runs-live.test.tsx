import { act, render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { RunView } from '../../components/runs/RunView';
import type { RunDetail } from '../../components/runs/types';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn(), replace: jest.fn() }), useLocalSearchParams: () => ({}) }));

const mockGet = jest.fn();
const mockPost = jest.fn(async (_path: string) => ({}));
jest.mock('../../components/api/client', () => ({
  api: { get: (path: string) => mockGet(path), post: (path: string) => mockPost(path), delete: jest.fn() },
  ApiError: class extends Error {},
  openEventStream: () => null, // no progress stream here: the screen falls back to polling (runs-stream.test.tsx has the stream)
}));

// Triangle, unit lanes: max cut = 2 (odd cycle C3: n − 1, common practice).
const doc = { name: 'Triangle', depots: [{ id: 'A' }, { id: 'B' }, { id: 'C' }], lanes: [{ from: 'A', to: 'B', weight: 1 }, { from: 'B', to: 'C', weight: 1 }, { from: 'A', to: 'C', weight: 1 }] };
const result = { value: 2, assignment: [0, 1, 1], bound: 2, gap: 0, energy: null, expectation: null, params: null, seconds: 0.01, evaluations: 4, shots: 0, provenOptimal: true };

function runAt(step: number): RunDetail {
  const done = step >= 2;
  return {
    id: 9, status: done ? 'succeeded' : 'running', problem: { kind: 'maxcut' }, networkId: 1, versionId: 5, networkName: 'Triangle', depotCount: 3, timeLimitSeconds: 10, seed: 1, createdBy: 1,
    createdAt: new Date(Date.now() - 2000).toISOString(), releasedAt: new Date(Date.now() - 2000).toISOString(), finishedAt: done ? new Date().toISOString() : null,
    jobs: [{
      id: 1, position: 0, solver: 'exact', label: 'Exact enumeration', family: 'exact', settings: {}, attempt: 1,
      status: done ? 'succeeded' : 'running', progress: done ? 1 : step * 0.4, live: done ? null : { fraction: step * 0.4, bestValue: 1 },
      queuedAt: null, startedAt: new Date(Date.now() - 1500).toISOString(), finishedAt: done ? new Date().toISOString() : null,
      result: done ? result : null, error: null,
    }],
  };
}

test('without a progress stream the run screen polls about every second while a job runs, shows progress, cancels, and stops polling when done', async () => {
  let step = 0;
  const runCalls = () => mockGet.mock.calls.filter(([p]) => p === '/runs/9').length;
  mockGet.mockImplementation(async (path: string) => {
    if (path === '/runs/9') return runAt(step++);
    if (path === '/solvers') return { solvers: [{ name: 'exact', label: 'Exact enumeration', family: 'exact', kinds: ['maxcut'], guarantee: '' }] };
    if (path === '/networks/1/versions/5') return { id: 5, number: 3, document: doc };
    throw new Error(`unexpected ${path}`);
  });
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={client}>
        <RunView id={9} role="dispatcher" />
      </QueryClientProvider>
    </SafeAreaProvider>,
  );
  await screen.findByTestId('cancel-run');
  expect(screen.getByTestId('percent-exact').textContent).toBe('0 %');
  act(() => screen.getByTestId('cancel-run').click());
  await waitFor(() => expect(mockPost).toHaveBeenCalledWith('/runs/9/cancel'));
  // Two more polls at ~1 s each bring the job to 40 %, then to done.
  await waitFor(() => expect(screen.getByTestId('percent-exact').textContent).toBe('100 %'), { timeout: 5000 });
  await screen.findByTestId('proven-exact');
  expect(screen.queryByTestId('cancel-run')).toBeNull();
  expect(screen.getByTestId('decision-support-note')).toBeTruthy();
  const afterDone = runCalls();
  expect(afterDone).toBeGreaterThanOrEqual(3); // running (0 %), running (40 %), done — plus the refetch after cancel
  await act(() => new Promise((r) => setTimeout(r, 2500)));
  expect(runCalls()).toBe(afterDone); // no more polling once every job finished
  client.clear();
}, 15_000);

test('a paid run\'s time counts from its payment (release to the queue), not from the hour it waited for payment', async () => {
  const finished = Date.parse('2026-12-01T12:00:00.000Z');
  const paid: RunDetail = {
    ...runAt(2),
    id: 10,
    createdAt: new Date(finished - 3600_000).toISOString(), // created, then waited an hour for its payment
    releasedAt: new Date(finished - 5_000).toISOString(),
    finishedAt: new Date(finished).toISOString(),
  };
  mockGet.mockImplementation(async (path: string) => {
    if (path === '/runs/10') return paid;
    if (path === '/solvers') return { solvers: [] };
    if (path === '/networks/1/versions/5') return { id: 5, number: 3, document: doc };
    if (path.startsWith('/billing/runs/')) return null;
    throw new Error(`unexpected ${path}`);
  });
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={client}>
        <RunView id={10} role="dispatcher" />
      </QueryClientProvider>
    </SafeAreaProvider>,
  );
  await waitFor(() => expect(screen.getByTestId('run-elapsed').textContent).toBe('Took 5.00 s'));
  client.clear();
});
