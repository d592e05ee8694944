import { fireEvent, render, screen } from '@testing-library/react';
import type { ImportPreview } from '../../shared/schemas/networks';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn(), replace: jest.fn() }) }));
jest.mock('expo-document-picker', () => ({ getDocumentAsync: jest.fn() }));

// eslint-disable-next-line import/first
import { PreviewView } from '../../components/networks/ImportScreen';

/**
 * The import preview as the user sees it: counts, every problem with its place and fix, and the
 * GraphML key mapping (GraphML keys per the GraphML primer, graphml.graphdrawing.org).
 */
const base: ImportPreview = {
  fileName: 'yard.graphml',
  depotsFileName: null,
  format: 'graphml',
  counts: { depots: 2, lanes: 1 },
  firstDepots: [{ id: 'a', name: 'Alder' }, { id: 'b' }],
  firstLanes: [{ from: 'a', to: 'b', weight: 1 }],
  issues: [
    { file: 'yard.graphml', line: 9, where: 'lanes', severity: 'error', message: 'lane a–z ends at unknown depot "z"; add the depot or fix the id', text: 'yard.graphml line 9: lane a–z ends at unknown depot "z"; add the depot or fix the id' },
    { file: 'yard.graphml', severity: 'warning', message: 'no edge key named weight or volume was found; every lane weighs 1', text: 'yard.graphml: no edge key named weight or volume was found; every lane weighs 1' },
  ],
  errorCount: 1,
  warningCount: 1,
  summary: { depots: 2, lanes: 1, totalVolume: 1, components: 1, minDegree: 1, maxDegree: 1, hasCoordinates: false },
  suggestedName: 'yard',
  graphml: { keys: [{ id: 't', for: 'edge', name: 'tonnes' }, { id: 'lbl', for: 'node', name: 'label' }], mapping: { laneWeight: null, depotName: 'lbl', depotLat: null, depotLon: null, depotWeight: null } },
  limits: { maxFileBytes: 20 * 1024 * 1024, maxDepots: 20000, maxLanes: 200000 },
};

test('errors come first with file, line and fix; warnings follow; the first rows are shown', () => {
  render(<PreviewView preview={base} mapping={{}} onMapping={() => {}} />);
  expect(screen.getByTestId('preview-counts').textContent).toMatch(/yard\.graphml read as graphml: 2 depots and 1 lanes passed every check/);
  expect(screen.getByTestId('preview-errors').textContent).toMatch(/1 error — nothing will be saved as it stands.*yard\.graphml line 9: lane a–z ends at unknown depot "z"; add the depot or fix the id/);
  expect(screen.getByTestId('preview-warnings').textContent).toMatch(/every lane weighs 1/);
  expect(screen.getByText('a – b: 1')).toBeTruthy();
  expect(screen.getByText('a · Alder')).toBeTruthy();
});

test('GraphML mapping: keys listed per field, an unread lane volume says what happens, choosing a key reports the mapping', () => {
  const onMapping = jest.fn();
  render(<PreviewView preview={base} mapping={{}} onMapping={onMapping} />);
  const mapping = screen.getByTestId('graphml-mapping');
  expect(mapping.textContent).toMatch(/Lane volume.*t \(tonnes\).*not read \(every lane weighs 1\)/);
  fireEvent.click(screen.getByRole('button', { name: 't (tonnes)' }));
  expect(onMapping).toHaveBeenCalledWith({ laneWeight: 't' });
});

test('a clean file says so', () => {
  render(<PreviewView preview={{ ...base, issues: [], errorCount: 0, warningCount: 0, graphml: null, format: 'csv', fileName: 'lanes.csv' }} mapping={{}} onMapping={() => {}} />);
  expect(screen.getByTestId('preview-ok').textContent).toBe('No errors found.');
  expect(screen.queryByTestId('graphml-mapping')).toBeNull();
});
