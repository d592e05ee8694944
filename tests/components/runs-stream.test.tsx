import { act, screen, waitFor } from '@testing-library/react';
import type { RunDetail } from '../../components/runs/types';
import { MockStream } from '../support/mock-event-stream';
import { renderRunView, triangleReads, triangleRun } from '../support/triangle-run';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn(), replace: jest.fn() }), useLocalSearchParams: () => ({}) }));

const mockGet = jest.fn();
jest.mock('../../components/api/client', () => ({
  api: { get: (path: string) => mockGet(path), post: jest.fn(async () => ({})), delete: jest.fn() },
  ApiError: class extends Error {},
  // The shared stand-in, loaded inside the factory because jest hoists this call above imports.
  openEventStream: (path: string) => new (jest.requireActual('../support/mock-event-stream') as typeof import('../support/mock-event-stream')).MockStream(path),
}));

const runWith = triangleRun;

let serverRun: RunDetail;
const runCalls = () => mockGet.mock.calls.filter(([p]) => p === '/runs/9').length;
const wait = (ms: number) => act(() => new Promise((r) => setTimeout(r, ms)));

function show() {
  mockGet.mockImplementation(async (path: string) => (path === '/runs/9' ? serverRun : triangleReads(path)));
  return renderRunView(9);
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
