/**
 * The best-known rule's pure parts: which runs ask the same question
 * (server/services/runs/best-known.ts), and the answer columns stored beside a result
 * (server/services/runs/answer-columns.ts) — checked on what the orchestrator really returns.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { solveProblem } from '../../../shared/engine/solvers/orchestrate';
import { answerColumnsOf } from '../../../server/services/runs/answer-columns';
import { questionKey } from '../../../server/services/runs/best-known';
import { petersen } from '../classical/helpers';

describe('best known answer: same question, stored answer columns', () => {
  test('questions match whatever the key order of their pins; kind, k, tolerance and pins tell them apart', () => {
    expect(questionKey({ kind: 'maxcut', pins: { A: 0, B: 1 } })).toBe(questionKey({ pins: { B: 1, A: 0 }, kind: 'maxcut' }));
    expect(questionKey({ kind: 'maxcut' })).toBe(questionKey({ kind: 'maxcut', tolerance: 0.2 })); // max-cut has no balance rule
    expect(questionKey({ kind: 'maxcut' })).not.toBe(questionKey({ kind: 'maxcut', pins: { A: 0 } }));
    expect(questionKey({ kind: 'bisection', tolerance: 0.05 })).not.toBe(questionKey({ kind: 'bisection', tolerance: 0.1 }));
    expect(questionKey({ kind: 'kway', k: 3 })).not.toBe(questionKey({ kind: 'kway', k: 4 }));
  });

  test('answer columns of orchestrator results: Petersen max-cut 12 proven (common practice), a bisection\'s fractional weight, an infeasible answer', async () => {
    const max = await solveProblem(bindProblem(compactFromEdges(10, petersen()), { kind: 'maxcut' }), 'exact', {}, { seed: 1, timeLimitSeconds: 5 }, { bounds: false });
    expect(answerColumnsOf(JSON.parse(JSON.stringify(max)))).toEqual({ answerValue: 12, answerFeasible: true, answerProven: true });
    const split = await solveProblem(bindProblem(compactFromEdges(4, [[0, 1, 0.25], [1, 2, 1.5], [2, 3, 0.25], [3, 0, 1.5]]), { kind: 'bisection', tolerance: 0 }), 'exact', {}, { seed: 1, timeLimitSeconds: 5 }, { bounds: false });
    expect(split.value).toBe(0.5);
    expect(answerColumnsOf(split).answerValue).toBe(0.5);
    expect(answerColumnsOf({ value: 7, infeasible: true })).toEqual({ answerValue: 7, answerFeasible: false, answerProven: false });
    expect(answerColumnsOf({ value: Number.NaN })).toEqual({ answerValue: null, answerFeasible: null, answerProven: null });
    expect(answerColumnsOf(null).answerValue).toBeNull();
  });
});
