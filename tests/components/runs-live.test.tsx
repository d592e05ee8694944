import { act, screen, waitFor } from '@testing-library/react';
import type { RunDetail } from '../../components/runs/types';
import { renderRunView, triangleReads, triangleRun } from '../support/triangle-run';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn(), replace: jest.fn() }), useLocalSearchParams: () => ({}) }));

const mockGet = jest.fn();
const mockPost = jest.fn(async (_path: string) => ({}));
jest.mock('../../components/api/client', () => ({
  api: { get: (path: string) => mockGet(path), post: (path: string) => mockPost(path), delete: jest.fn() },
  ApiError: class extends Error {},
  openEventStream: () => null, // no progress stream here: the screen falls back to polling (runs-stream.test.tsx has the stream)
}));

const runAt = (step: number) => (step >= 2 ? triangleRun('succeeded', 1) : triangleRun('running', step * 0.4));

test('without a progress stream the run screen polls about every second while a job runs, shows progress, cancels, and stops polling when done', async () => {
  let step = 0;
  const runCalls = () => mockGet.mock.calls.filter(([p]) => p === '/runs/9').length;
  mockGet.mockImplementation(async (path: string) => {
    if (path === '/runs/9') return runAt(step++);
    return triangleReads(path);
  });
  const client = renderRunView(9);
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
    return triangleReads(path);
  });
  const client = renderRunView(10);
  await waitFor(() => expect(screen.getByTestId('run-elapsed').textContent).toBe('Took 5.00 s'));
  client.clear();
});
