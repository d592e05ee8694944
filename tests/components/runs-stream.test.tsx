import { act, render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { RunView } from '../../components/runs/RunView';
import type { RunDetail } from '../../components/runs/types';
import { MockStream } from '../support/mock-event-stream';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn(), replace: jest.fn() }), useLocalSearchParams: () => ({}) }));

const mockGet = jest.fn();
jest.mock('../../components/api/client', () => ({
  api: { get: (path: string) => mockGet(path), post: jest.fn(async () => ({})), delete: jest.fn() },
  ApiError: class extends Error {},
  // The shared stand-in, loaded inside the factory because jest hoists this call above imports.
  openEventStream: (path: string) => new (jest.requireActual('../support/mock-event-stream') as typeof import('../support/mock-event-stream')).MockStream(path),
}));

// Triangle, unit lanes: max cut = 2 (odd cycle C3: n − 1, common practice).
const doc = { name: 'Triangle', depots: [{ id: 'A' }, { id: 'B' }, { id: 'C' }], lanes: [{ from: 'A', to: 'B', weight: 1 }, { from: 'B', to: 'C', weight: 1 }, { from: 'A', to: 'C', weight: 1 }] };
const result = { value: 2, assignment: [0, 1, 1], bound: 2, gap: 0, energy: null, expectation: null, params: null, seconds: 0.01, evaluations: 4, shots: 0, provenOptimal: true };

function runWith(status: 'running' | 'succeeded', progress: number): RunDetail {
  const done = status === 'succeeded';
  return {
    id: 9, status, problem: { kind: 'maxcut' }, networkId: 1, versionId: 5, networkName: 'Triangle', depotCount: 3, timeLimitSeconds: 10, seed: 1, createdBy: 1,
    createdAt: new Date(Date.now() - 2000).toISOString(), finishedAt: done ? new Date().toISOString() : null,
    jobs: [{
      id: 1, position: 0, solver: 'exact', label: 'Exact enumeration', family: 'exact', settings: {}, attempt: 1,
      status, progress, live: done ? null : { fraction: progress, bestValue: 1 },
      queuedAt: null, startedAt: new Date(Date.now() - 1500).toISOString(), finishedAt: done ? new Date().toISOString() : null,
      result: done ? result : null, error: null,
    }],
  } as RunDetail;
}

let serverRun: RunDetail;
const runCalls = () => mockGet.mock.calls.filter(([p]) => p === '/runs/9').length;
const wait = (ms: number) => act(() => new Promise((r) => setTimeout(r, ms)));

function show() {
  mockGet.mockImplementation(async (path: string) => {
    if (path === '/runs/9') return serverRun;
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
  return client;
}

beforeEach(() => {
  MockStream.all = [];
  mockGet.mockReset();
  serverRun = runWith('running', 0);
});

test('an open progress stream moves the run screen without polling, fetches a finished job once, and closes at the end', async () => {
  const client = show();
  await screen.findByTestId('cancel-run');
  await waitFor(() => expect(MockStream.all).toHaveLength(1));
  const stream = MockStream.all[0];
  expect(stream.path).toBe('/runs/9/events');
  act(() => stream.onopen?.());
  act(() => stream.emit('snapshot', runWith('running', 0)));
  const before = runCalls();
  await wait(2500); // polling would have asked twice by now
  expect(runCalls()).toBe(before);
  act(() => stream.emit('progress', { type: 'progress', runId: 9, jobId: 1, progress: 0.4, live: { fraction: 0.4, bestValue: 2 } }));
  await waitFor(() => expect(screen.getByTestId('percent-exact').textContent).toBe('40 %'));
  expect(runCalls()).toBe(before);
  // The job finished: the event carries no result, so the run is fetched once.
  serverRun = runWith('succeeded', 1);
  act(() => stream.emit('status', { type: 'status', runId: 9, jobId: 1, status: 'succeeded' }));
  await screen.findByTestId('proven-exact');
  expect(runCalls()).toBe(before + 1);
  act(() => stream.emit('end', { status: 'succeeded', run: serverRun }));
  expect(stream.closed).toBe(true);
  expect(screen.queryByTestId('cancel-run')).toBeNull();
  await wait(1500);
  expect(runCalls()).toBe(before + 1);
  expect(MockStream.all).toHaveLength(1); // no second stream for a finished run
  client.clear();
}, 15_000);

test('when the stream fails the run screen polls again, once a second, and does not reopen the stream', async () => {
  const client = show();
  await screen.findByTestId('cancel-run');
  await waitFor(() => expect(MockStream.all).toHaveLength(1));
  const stream = MockStream.all[0];
  act(() => stream.onopen?.());
  const before = runCalls();
  await wait(1500);
  expect(runCalls()).toBe(before);
  act(() => stream.onerror?.());
  expect(stream.closed).toBe(true);
  serverRun = runWith('running', 0.4);
  await waitFor(() => expect(screen.getByTestId('percent-exact').textContent).toBe('40 %'), { timeout: 3000 });
  await wait(2200);
  expect(runCalls()).toBeGreaterThanOrEqual(before + 2);
  expect(MockStream.all).toHaveLength(1);
  client.clear();
}, 15_000);
