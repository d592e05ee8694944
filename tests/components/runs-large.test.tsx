/**
 * The large-network solvers in the app (components/runs/large-solvers.ts and its views): run
 * setup's proposal above the statevector limit, the comparison with the classical heuristic, the
 * bound and the best known answer (refined and unrefined side by side), RQAOA's rounds and the
 * blocks of qaoa-blocks.
 */
import { fireEvent, render, screen, within } from '@testing-library/react';
import { LargeComparison } from '../../components/runs/LargeComparison';
import { BlocksView, RecursionRounds } from '../../components/runs/LargeSolverDetail';
import { LargeProposal } from '../../components/runs/LargeProposal';
import { blockColours, blockSizeCounts, correlationRange, largeComparison, largeProposal, roundName } from '../../components/runs/large-solvers';
import { solverLine } from '../../components/runs/setup-words';
import type { JobResult, RunJob } from '../../components/runs/types';
import type { RqaoaRoundEntry } from '../../shared/engine/variational/rqaoa-log';

const result = (r: Partial<JobResult> & { value: number }): JobResult => ({ assignment: [], bound: null, gap: null, energy: null, expectation: null, params: null, seconds: 3, evaluations: 10, shots: 0, provenOptimal: false, ...r });
const job = (id: number, solver: string, family: string, r: JobResult | null): RunJob => ({ id, position: id, solver, label: solver, family, settings: {}, status: r ? 'succeeded' : 'running', progress: r ? 1 : 0.5, live: null, attempt: 1, queuedAt: null, startedAt: null, finishedAt: null, result: r, error: null });

describe('run setup proposal above the statevector limit', () => {
  const answers = [{ name: 'qaoa', qubits: 300 }, { name: 'rqaoa', qubits: 16 }, { name: 'qaoa-blocks', qubits: 14 }];
  test('proposed when QAOA would need more qubits than the limit; the plan\'s lower qubits count; none when it fits', () => {
    expect(largeProposal(answers, ['tabu', 'rqaoa', 'qaoa-blocks'])).toEqual({ needed: 300, limit: 20, proposed: ['rqaoa', 'qaoa-blocks'] });
    expect(largeProposal([{ name: 'qaoa', qubits: 18 }], ['exact', 'tabu', 'rqaoa', 'qaoa-blocks'], 16)).toMatchObject({ needed: 18, limit: 16 });
    expect(largeProposal([{ name: 'qaoa', qubits: 12 }], ['exact', 'tabu', 'qaoa', 'vqe'])).toBeNull();
  });

  test('each proposed solver with the time and price the preview states (never recomputed here)', () => {
    // Amounts in cents, as billing's priceOfRun gives them.
    const price = { amount: 1250, currency: 'EUR', lines: [{ label: 'Solver 2: 16 qubits', amount: 400 }, { label: 'Solver 3: 14 qubits', amount: 200 }] };
    const preview = { rqaoa: { solver: 'rqaoa', qubits: 16, estimatedSeconds: { atMost: 12 } }, 'qaoa-blocks': { solver: 'qaoa-blocks', qubits: 14, estimatedSeconds: { atMost: 12 } } } as const;
    const chosen = ['tabu', 'rqaoa', 'qaoa-blocks'];
    render(<LargeProposal proposal={{ needed: 300, limit: 20, proposed: ['rqaoa', 'qaoa-blocks'] }} chosen={chosen} labelOf={(n) => `Label ${n}`} lineOf={(n) => solverLine(preview[n as 'rqaoa'], price, chosen.indexOf(n) + 1)} />);
    expect(screen.getByTestId('large-proposal').textContent).toMatch(/300 qubits here, more than the 20-qubit limit of the statevector simulator\. Proposed instead/);
    expect(screen.getByTestId('large-proposal-line-rqaoa').textContent).toBe('needs 16 qubits · about 12 s · €4.00 for its qubits');
    expect(screen.getByTestId('large-proposal-line-qaoa-blocks').textContent).toMatch(/needs 14 qubits · about 12 s · €2\.00 for its qubits/);
  });
});

describe('comparison: rqaoa and qaoa-blocks against tabu, the bound and the best known answer', () => {
  // Max-cut: best known 1,000 (found by tabu in run 7); bound 1,100.
  const run = {
    id: 9,
    problem: { kind: 'maxcut' as const },
    bestKnown: { value: 1000, runId: 7, solver: 'tabu', provenOptimal: false, runsCompared: 3 },
    jobs: [
      job(1, 'tabu', 'heuristic', result({ value: 990 })),
      job(2, 'rqaoa', 'variational', result({ value: 980, refinement: { applied: true, unrefinedValue: 950, unrefinedInfeasible: false, moves: 12 } })),
      job(3, 'qaoa-blocks', 'variational', result({ value: 960, refinement: { applied: true, unrefinedValue: 960, unrefinedInfeasible: false, moves: 0 } })),
    ],
  };
  test('gaps to best known and bound, refinement changed or not, unrefined value beside the final one', () => {
    const c = largeComparison(run, 1100)!;
    const by = Object.fromEntries(c.rows.map((r) => [r.solver, r]));
    expect(by.rqaoa).toMatchObject({ value: 980, unrefined: 950, refinement: 'changed', role: 'variational' });
    expect(by.rqaoa.gapToBestKnown).toBeCloseTo(0.02, 12); // (1000 − 980)/1000
    expect(by.rqaoa.gapToBound).toBeCloseTo(120 / 1100, 12);
    expect(by['qaoa-blocks']).toMatchObject({ unrefined: 960, refinement: 'unchanged' });
    expect(by.tabu).toMatchObject({ role: 'classical', unrefined: null, refinement: 'none' });
    expect(largeComparison({ ...run, jobs: [run.jobs[0]] }, 1100)).toBeNull();
  });

  test('the best known answer includes this run\'s own answers (arrived after the run was read); the server\'s wins ties', () => {
    const better = { ...run, jobs: [...run.jobs, job(4, 'anneal', 'heuristic', result({ value: 1010 }))] };
    expect(largeComparison(better, 1100)!.bestKnown).toEqual({ value: 1010, runId: 9, solver: 'anneal', provenOptimal: false, runsCompared: 3 });
    expect(largeComparison({ ...run, bestKnown: null }, 1100)!.bestKnown).toMatchObject({ value: 990, runId: 9, solver: 'tabu', runsCompared: 1 });
    const tie = { ...run, jobs: [...run.jobs, job(4, 'anneal', 'heuristic', result({ value: 1000 }))] };
    expect(largeComparison(tie, 1100)!.bestKnown).toMatchObject({ runId: 7, solver: 'tabu' });
    // Min questions: the lower crossing weight; an unbalanced answer never counts.
    const split = { id: 2, problem: { kind: 'bisection' as const }, bestKnown: null, jobs: [job(1, 'fm', 'heuristic', result({ value: 30 })), job(2, 'qaoa-blocks', 'variational', result({ value: 20, infeasible: true }))] };
    expect(largeComparison(split, null)!.bestKnown).toMatchObject({ value: 30, solver: 'fm' });
  });

  test.each([false, true])('drawn on a %s screen with the best-known source named', (wide) => {
    render(<LargeComparison comparison={largeComparison(run, 1100, { rqaoa: 'Recursive QAOA' })!} valueName="Cut weight" wide={wide} runId={9} />);
    expect(screen.getByTestId('best-known').textContent).toMatch(/Best known answer: 1,000 — the best balanced answer any run on this network version has found.*3 runs compared; found by tabu in run 7.*not proven optimal/);
    const rq = screen.getByTestId('large-row-rqaoa');
    expect(within(rq).getByTestId('large-unrefined-rqaoa').textContent).toBe('950');
    expect(within(rq).getByTestId('large-value-rqaoa').textContent).toBe('980');
    expect(within(rq).getByTestId('large-refinement-rqaoa').textContent).toBe('Changed the answer');
    expect(within(rq).getByTestId('large-bestKnownGap-rqaoa').textContent).toBe('2.0 %');
    expect(screen.getByTestId('large-refinement-qaoa-blocks').textContent).toBe('Ran, no change');
  });
});

describe('RQAOA rounds and the blocks', () => {
  const entry = (from: number, to: number, eliminated: number, strongest: number, weakest: number): RqaoaRoundEntry => ({ from, to, spins: 300 - from, eliminated, same: eliminated - 1, opposite: 1, dropped: 0, strongest, weakest, gamma: 0.31, beta: -0.12 });
  test('round names and correlation ranges', () => {
    expect(roundName({ from: 3, to: 3 })).toBe('Round 3');
    expect(roundName({ from: 10, to: 14 })).toBe('Rounds 10–14');
    expect(roundName({ from: 0, to: 0 })).toBe('Before round 1');
    expect(correlationRange({ strongest: 0.91234, weakest: 0.64, eliminated: 3 })).toBe('0.912–0.640');
    expect(correlationRange({ strongest: 0, weakest: 0, eliminated: 0 })).toBe('—');
  });

  test.each([false, true])('rounds listed with depots eliminated and correlations; the rest behind "Show all" (wide: %s)', (wide) => {
    const log = Array.from({ length: 12 }, (_, i) => entry(i + 1, i + 1, 3, 0.9 - i * 0.01, 0.5));
    render(<RecursionRounds recursion={{ rounds: 12, remainder: 16, eliminationsTotal: 36, eliminations: [], roundLog: log }} label="Recursive QAOA" wide={wide} />);
    expect(screen.getByTestId('rqaoa-summary').textContent).toMatch(/12 rounds of one-layer QAOA; 36 depots eliminated.*last 16 solved exactly/);
    expect(screen.getAllByTestId('rqaoa-round')).toHaveLength(8);
    expect(screen.getAllByTestId('rqaoa-round')[0].textContent).toMatch(/Round 1.*0\.900–0\.500/);
    fireEvent.click(screen.getByTestId('rqaoa-rounds-all'));
    expect(screen.getAllByTestId('rqaoa-round')).toHaveLength(12);
  });

  test('block colouring: blocks joined by a lane differ (greedy, Welsh & Powell 1967); sizes counted', () => {
    // Six blocks on a ring (an even cycle is 2-colourable; greedy needs at most 3 colours) with one chord.
    const blockOf = [0, 0, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5];
    const ends: [number, number][] = [[1, 2], [3, 4], [5, 6], [7, 8], [9, 10], [11, 0], [0, 6]];
    const colour = blockColours(blockOf, ends, 8);
    for (const [a, b] of ends) expect(colour[blockOf[a]]).not.toBe(colour[blockOf[b]]);
    expect(Math.max(...colour)).toBeLessThanOrEqual(2);
    // With a palette of 1, every block gets colour 0 (no crash, least-used colour).
    expect(blockColours(blockOf, ends, 1)).toEqual([0, 0, 0, 0, 0, 0]);
    expect(blockSizeCounts([14, 14, 13, 14, 9])).toEqual([{ size: 14, blocks: 3 }, { size: 13, blocks: 1 }, { size: 9, blocks: 1 }]);
  });

  test('blocks view: count, sizes and merge in words, the drawing coloured by block', () => {
    const depots = Array.from({ length: 6 }, (_, i) => ({ id: `Q${i}`, name: `Quillmere ${i}`, x: i, y: i % 2 }));
    const lanes = [{ from: 'Q0', to: 'Q1', weight: 1 }, { from: 'Q2', to: 'Q3', weight: 1 }, { from: 'Q1', to: 'Q2', weight: 2 }];
    render(<BlocksView decomposition={{ blocks: 2, sizes: [3, 3], blockOf: [0, 0, 0, 1, 1, 1], largestQubits: 3, merge: 'exact' }} document={{ depots, lanes }} label="QAOA by blocks" />);
    expect(screen.getByTestId('blocks-summary').textContent).toBe('2 blocks, widest circuit 3 qubits; orientations by exact enumeration over the block orientations.');
    expect(screen.getByTestId('block-sizes').textContent).toBe('2 × 3 depots');
  });
});
