import { fireEvent, render, screen } from '@testing-library/react';
import { createBody, cyclePin, DEFAULT_ADVANCED, initialSetup, problemOf } from '../../components/runs/setup';
import { EncodingSummary, estimatedSeconds } from '../../components/runs/EncodingSummary';
import { isLive } from '../../components/queries/runs';
import { defaultSolvers, VARIATIONAL_MAX_QUBITS } from '../../shared/runs/default-solvers';
import type { RunPreview } from '../../components/runs/types';

const families = { exact: 'exact', tabu: 'heuristic', fm: 'heuristic', qaoa: 'variational', vqe: 'variational' };

describe('run setup rules', () => {
  test('a tap cycles a depot free → side A → side B → free (k-way: through every region)', () => {
    let pins: Record<string, number> = {};
    pins = cyclePin(pins, 'D1', 2);
    expect(pins).toEqual({ D1: 0 });
    pins = cyclePin(pins, 'D1', 2);
    expect(pins).toEqual({ D1: 1 });
    pins = cyclePin(pins, 'D1', 2);
    expect(pins).toEqual({});
    let k = {};
    for (let i = 0; i < 3; i++) k = cyclePin(k, 'D7', 3);
    expect(k).toEqual({ D7: 2 });
  });

  test('dispatcher runs carry no settings, so the service treats them as defaults', () => {
    const s = { ...initialSetup(), kind: 'bisection' as const, tolerancePercent: '5', pins: { D1: 0 } };
    const body = createBody(12, s, ['exact', 'fm', 'qaoa'], families);
    expect(body).toEqual({ versionId: 12, problem: { kind: 'bisection', tolerance: 0.05, pins: { D1: 0 } }, solvers: [{ solver: 'exact' }, { solver: 'fm' }, { solver: 'qaoa' }] });
  });

  test('analyst settings go only to the variational solvers; unchanged defaults are left out', () => {
    const s = { ...initialSetup(), advanced: { ...DEFAULT_ADVANCED, layers: '3', shots: '2048', ansatz: 'alternating' as const, seed: '7', timeLimitSeconds: '30' } };
    const body = createBody(3, s, ['exact', 'qaoa', 'vqe'], families);
    expect(body.solvers).toEqual([{ solver: 'exact' }, { solver: 'qaoa', settings: { layers: 3, shots: 2048 } }, { solver: 'vqe', settings: { layers: 3, shots: 2048, ansatz: 'alternating' } }]);
    expect(body.seed).toBe(7);
    expect(body.timeLimitSeconds).toBe(30);
  });

  test('the noise comparison goes to the circuit solvers only, as their noise setting', () => {
    const s = { ...initialSetup(), advanced: { ...DEFAULT_ADVANCED, noise: true } };
    expect(createBody(3, s, ['tabu', 'qaoa', 'vqe'], families).solvers).toEqual([{ solver: 'tabu' }, { solver: 'qaoa', settings: { noise: true } }, { solver: 'vqe', settings: { noise: true } }]);
  });

  test('k-way pins past the last region are dropped when k is lowered', () => {
    expect(problemOf({ ...initialSetup(), kind: 'kway', k: 3, pins: { A: 0, B: 4 } })).toEqual({ kind: 'kway', k: 3, tolerance: 0.05, pins: { A: 0 } });
  });
});

describe('defaultSolvers (shared by API and app)', () => {
  // Each solver has answered for the problem: the qubits it would simulate, whether it (or the plan) refuses.
  const listing = (qubits: number, extra: Record<string, { qubits?: number; refused?: boolean; kinds?: readonly ('maxcut' | 'bisection' | 'kway')[] }> = {}) => [
    { name: 'exact', family: 'exact' as const, kinds: ['maxcut', 'bisection', 'kway'] as const },
    { name: 'tabu', family: 'heuristic' as const, kinds: ['maxcut', 'bisection'] as const },
    { name: 'fm', family: 'heuristic' as const, kinds: ['bisection', 'kway'] as const },
    { name: 'qaoa', family: 'variational' as const, kinds: ['maxcut', 'bisection', 'kway'] as const, qubits },
    { name: 'vqe', family: 'variational' as const, kinds: ['maxcut', 'bisection', 'kway'] as const, qubits },
    { name: 'decomposed', family: 'variational' as const, kinds: ['maxcut'] as const, qubits: 14 },
    { name: 'rqaoa', family: 'variational' as const, kinds: ['maxcut', 'bisection'] as const, qubits: 16 },
  ].map((s) => ({ ...s, ...extra[s.name] }));
  test('small max-cut: exact, tabu, QAOA and VQE', () => {
    expect(defaultSolvers({ kind: 'maxcut', depots: 12 }, listing(12))).toEqual(['exact', 'tabu', 'qaoa', 'vqe']);
  });
  test('bisection uses FM as its heuristic', () => {
    expect(defaultSolvers({ kind: 'bisection', depots: 12 }, listing(16))).toEqual(['exact', 'fm', 'qaoa', 'vqe']);
  });
  test('large max-cut: no exact enumeration (2^200 assignments), decomposition instead of direct circuits', () => {
    expect(defaultSolvers({ kind: 'maxcut', depots: 200 }, listing(200))).toEqual(['tabu', 'rqaoa', 'decomposed']);
    expect(defaultSolvers({ kind: 'maxcut', depots: 30 }, listing(VARIATIONAL_MAX_QUBITS + 1))).toEqual(['tabu', 'rqaoa', 'decomposed']);
  });
  test('above the statevector limit both large-network solvers are proposed, each only where it takes the problem', () => {
    // rqaoa refuses bisection above 80 free depots (variational/rqaoa-problem.ts): the decomposition alone.
    expect(defaultSolvers({ kind: 'bisection', depots: 300 }, listing(300, { rqaoa: { refused: true }, decomposed: { kinds: ['maxcut', 'bisection'] } }))).toEqual(['fm', 'decomposed']);
    // Small enough for direct circuits: neither is proposed.
    expect(defaultSolvers({ kind: 'maxcut', depots: 12 }, listing(12))).not.toContain('rqaoa');
    // A plan whose qubits are below rqaoa's exact remainder: not proposed.
    expect(defaultSolvers({ kind: 'maxcut', depots: 300 }, listing(300), { maxQubits: 15 })).toEqual(['tabu', 'decomposed']);
  });
  test('pinned depots shrink the exact search (30 depots, 10 pinned: 2^20 assignments)', () => {
    expect(defaultSolvers({ kind: 'maxcut', depots: 30, pinned: 10 }, listing(20))[0]).toBe('exact');
  });
  test('k regions: the qubits the solvers simulate decide (15 for the first split), not the one-hot count', () => {
    expect(defaultSolvers({ kind: 'kway', depots: 12, k: 3 }, listing(15))).toEqual(['exact', 'fm', 'qaoa', 'vqe']);
  });
  test('never a solver that refuses or that the plan refuses, and circuits stay within the plan\'s qubits', () => {
    expect(defaultSolvers({ kind: 'maxcut', depots: 12 }, listing(12, { qaoa: { refused: true } }))).toEqual(['exact', 'tabu', 'vqe']);
    expect(defaultSolvers({ kind: 'maxcut', depots: 18 }, listing(18), { maxQubits: 16 })).toEqual(['exact', 'tabu', 'rqaoa', 'decomposed']);
    expect(defaultSolvers({ kind: 'maxcut', depots: 200 }, listing(200, { decomposed: { refused: true }, rqaoa: { refused: true } }))).toEqual(['tabu']);
  });
});

describe('polling rule', () => {
  test('a run is live while any job is queued or running, not when all finished or it waits for payment', () => {
    const job = (status: string) => ({ status }) as never;
    expect(isLive({ status: 'running', jobs: [job('succeeded'), job('running')] })).toBe(true);
    expect(isLive({ status: 'queued', jobs: [job('queued')] })).toBe(true);
    expect(isLive({ status: 'partial', jobs: [job('succeeded'), job('failed')] })).toBe(false);
    expect(isLive({ status: 'awaiting_payment', jobs: [job('queued')] })).toBe(false);
  });
});

describe('<EncodingSummary>', () => {
  // Max-cut on K4 with unit lanes: 4 depot qubits, 6 ZZ terms (one per lane), offset −W/2 = −3
  // under energy = −cut (H = Σ w(Z_uZ_v − 1)/2); one Z-basis measurement group (common practice).
  const preview: RunPreview = {
    encoding: { method: 'maxcut', qubits: 4, depotQubits: 4, slackQubits: 0, pauliTerms: 6, offset: -3, penalties: [], rule: 'energy = −cut', commutingGroups: 1, precision: 0.06, shots: 2500 },
    solvers: [
      { solver: 'exact', refusal: null, estimatedSeconds: { atMost: 12 } },
      { solver: 'qaoa', refusal: null, estimatedSeconds: { atMost: 12 } },
      { solver: 'vqe', refusal: 'needs 30 qubits; the limit is 24', estimatedSeconds: { atMost: 12 } },
    ],
  };
  test('shows the figures, refusals, the time budget and no price when none is returned', () => {
    render(<EncodingSummary preview={preview} />);
    // Plain words first; the encoding maths behind the details control.
    expect(screen.getByTestId('run-cost').textContent).toBe('This run is free on your plan.');
    expect(screen.getByTestId('run-time').textContent).toMatch(/about 12 s/);
    expect(screen.queryByTestId('enc-qubits')).toBeNull();
    fireEvent.click(screen.getByTestId('encoding-details-toggle'));
    expect(screen.getByTestId('enc-qubits').textContent).toBe('4');
    expect(screen.getByTestId('enc-terms').textContent).toBe('6');
    expect(screen.getByTestId('enc-offset').textContent).toBe('-3');
    expect(screen.getByTestId('enc-groups').textContent).toBe('1');
    expect(screen.getByTestId('enc-shots').textContent).toBe('2,500');
    expect(screen.getByTestId('refusal-vqe').textContent).toMatch(/needs 30 qubits/);
    expect(screen.queryByTestId('enc-price')).toBeNull();
    expect(estimatedSeconds(preview)).toBe(12);
  });
  test('shows the price and its lines when the preview has one (money written by shared/plans.ts)', () => {
    render(<EncodingSummary preview={{ ...preview, price: { amount: 250, currency: 'eur', lines: [{ label: 'Depots above the plan', amount: 150 }, { label: 'Qubits above the plan', amount: 100 }] } }} />);
    expect(screen.getByTestId('run-cost').textContent).toBe('This run costs €2.50; it starts once it is paid.');
    fireEvent.click(screen.getByTestId('encoding-details-toggle'));
    expect(screen.getByTestId('enc-price').textContent).toBe('€2.50');
    expect(screen.getByTestId('enc-price-lines').textContent).toContain('Depots above the plan: €1.50');
  });
});
