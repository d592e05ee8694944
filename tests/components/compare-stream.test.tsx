import { act, render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { CompareView } from '../../components/runs/CompareView';
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

function run(id: number, status: 'running' | 'succeeded'): RunDetail {
  const done = status === 'succeeded';
  return {
    id, status, problem: { kind: 'maxcut' }, networkId: 1, versionId: 5, networkName: 'Triangle', depotCount: 3, timeLimitSeconds: 10, seed: 1, createdBy: 1,
    createdAt: new Date(Date.now() - 2000).toISOString(), finishedAt: done ? new Date().toISOString() : null,
    jobs: [{
      id: id * 10, position: 0, solver: 'exact', label: 'Exact enumeration', family: 'exact', settings: {}, attempt: 1,
      status, progress: done ? 1 : 0.2, live: done ? null : { fraction: 0.2, bestValue: 1 },
      queuedAt: null, startedAt: new Date(Date.now() - 1500).toISOString(), finishedAt: done ? new Date().toISOString() : null,
      result: done ? result : null, error: null,
    }],
  } as RunDetail;
}

const served: Record<string, RunDetail> = {};
const calls = (path: string) => mockGet.mock.calls.filter(([p]) => p === path).length;
const wait = (ms: number) => act(() => new Promise((r) => setTimeout(r, ms)));

beforeEach(() => {
  MockStream.all = [];
  mockGet.mockReset();
  served['/runs/9'] = run(9, 'running');
  served['/runs/10'] = run(10, 'succeeded');
  mockGet.mockImplementation(async (path: string) => {
    if (served[path]) return served[path];
    if (path === '/solvers') return { solvers: [{ name: 'exact', label: 'Exact enumeration', family: 'exact', kinds: ['maxcut'], guarantee: '' }] };
    if (path === '/networks/1/versions/5') return { id: 5, number: 3, document: doc };
    throw new Error(`unexpected ${path}`);
  });
});

function show() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={client}>
        <CompareView ids={[9, 10]} role="analyst" />
      </QueryClientProvider>
    </SafeAreaProvider>,
  );
  return client;
}

test('compare follows a running run by its progress stream, never polls the finished one, and stops at the end', async () => {
  const client = show();
  await waitFor(() => expect(MockStream.all).toHaveLength(1));
  const stream = MockStream.all[0];
  expect(stream.path).toBe('/runs/9/events'); // the finished run 10 gets no stream
  act(() => stream.onopen?.());
  const before9 = calls('/runs/9');
  await wait(2500); // polling once a second would have asked twice by now
  expect(calls('/runs/9')).toBe(before9);
  expect(calls('/runs/10')).toBe(1);
  served['/runs/9'] = run(9, 'succeeded');
  act(() => stream.emit('end', { status: 'succeeded', run: served['/runs/9'] }));
  expect(stream.closed).toBe(true);
  await screen.findAllByText(/optimal/);
  await wait(1500);
  expect(calls('/runs/9')).toBe(before9);
  expect(MockStream.all).toHaveLength(1);
  client.clear();
}, 15_000);

test('when a run\'s stream fails, compare polls that run once a second until it ends', async () => {
  const client = show();
  await waitFor(() => expect(MockStream.all).toHaveLength(1));
  const stream = MockStream.all[0];
  act(() => stream.onopen?.());
  act(() => stream.onerror?.());
  expect(stream.closed).toBe(true);
  const before9 = calls('/runs/9');
  await wait(2300);
  expect(calls('/runs/9')).toBeGreaterThanOrEqual(before9 + 2);
  served['/runs/9'] = run(9, 'succeeded');
  await wait(1300);
  const after = calls('/runs/9');
  await wait(1500);
  expect(calls('/runs/9')).toBe(after); // finished: no more polling
  expect(calls('/runs/10')).toBe(1);
  expect(MockStream.all).toHaveLength(1);
  client.clear();
}, 15_000);
