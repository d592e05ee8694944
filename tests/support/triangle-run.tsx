/**
 * A one-solver run on a triangle for the run screen's component tests, and the screen rendered
 * at phone size. Triangle, unit lanes: max cut = 2 (odd cycle C3: n − 1, common practice).
 */
import { render } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { RunView } from '../../components/runs/RunView';
import type { RunDetail } from '../../components/runs/types';

export const triangleDoc = { name: 'Triangle', depots: [{ id: 'A' }, { id: 'B' }, { id: 'C' }], lanes: [{ from: 'A', to: 'B', weight: 1 }, { from: 'B', to: 'C', weight: 1 }, { from: 'A', to: 'C', weight: 1 }] };
const result = { value: 2, assignment: [0, 1, 1], bound: 2, gap: 0, energy: null, expectation: null, params: null, seconds: 0.01, evaluations: 4, shots: 0, provenOptimal: true };

/** Run 9 on version 5 of network 1: exact enumeration running at `progress`, or finished with the optimum. */
export function triangleRun(status: 'running' | 'succeeded', progress: number): RunDetail {
  const done = status === 'succeeded';
  return {
    id: 9, status, problem: { kind: 'maxcut' }, networkId: 1, versionId: 5, networkName: 'Triangle', depotCount: 3, timeLimitSeconds: 10, seed: 1, createdBy: 1,
    createdAt: new Date(Date.now() - 2000).toISOString(), releasedAt: new Date(Date.now() - 2000).toISOString(), finishedAt: done ? new Date().toISOString() : null,
    jobs: [{
      id: 1, position: 0, solver: 'exact', label: 'Exact enumeration', family: 'exact', settings: {}, attempt: 1,
      status, progress, live: done ? null : { fraction: progress, bestValue: 1 },
      queuedAt: null, startedAt: new Date(Date.now() - 1500).toISOString(), finishedAt: done ? new Date().toISOString() : null,
      result: done ? result : null, error: null,
    }],
  } as RunDetail;
}

/** What the run screen reads besides the run itself: the solver list and the network version. */
export function triangleReads(path: string): unknown {
  if (path === '/solvers') return { solvers: [{ name: 'exact', label: 'Exact enumeration', family: 'exact', kinds: ['maxcut'], guarantee: '' }] };
  if (path === '/networks/1/versions/5') return { id: 5, number: 3, document: triangleDoc };
  if (path.startsWith('/billing/runs/')) return null;
  throw new Error(`unexpected ${path}`);
}

/** The run screen of run `id` as a dispatcher on a 390 × 844 phone; returns its query client. */
export function renderRunView(id: number): QueryClient {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={client}>
        <RunView id={id} role="dispatcher" />
      </QueryClientProvider>
    </SafeAreaProvider>,
  );
  return client;
}
