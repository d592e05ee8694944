import { render, screen } from '@testing-library/react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { RunList } from '../../components/runs/RunList';

jest.mock('expo-router', () => ({
  useRouter: () => ({ push: jest.fn(), replace: jest.fn() }),
  useLocalSearchParams: () => ({}),
  Link: ({ children }: { children: unknown }) => children,
}));
const mockRuns = [1, 2, 3].map((id) => ({ id, status: 'succeeded', problem: { kind: 'maxcut' }, networkId: 1, networkName: 'Quillmere Valley — core', depotCount: 12, solvers: ['tabu'], createdAt: '2026-12-01T10:00:00Z' }));
jest.mock('../../components/queries/runs', () => ({
  useRunsQuery: () => ({ isPending: false, isError: false, data: mockRuns }),
  useSolversQuery: () => ({ isPending: false }),
  useSolverLabels: () => ({ tabu: 'Tabu search' }),
}));

test('an analyst sees the operator link once (in the header), not again under the list', () => {
  render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 1440, height: 900 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <RunList role="analyst" />
    </SafeAreaProvider>,
  );
  expect(screen.getAllByTestId('open-operator')).toHaveLength(1);
  expect(screen.getByTestId('run-item-3')).toBeTruthy();
});
