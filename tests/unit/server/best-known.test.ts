/**
 * The best-known rule's pure parts (server/services/runs/best-known.ts): which runs ask the same
 * question, and the value read from the first characters of a stored result — checked on what the
 * orchestrator really stores, so a change of its field order fails here and not silently.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { solveProblem } from '../../../shared/engine/solvers/orchestrate';
import { questionKey, valueOf } from '../../../server/services/runs/best-known';
import { petersen } from '../classical/helpers';

describe('best known answer: same question, stored value', () => {
  test('questions match whatever the key order of their pins; kind, k, tolerance and pins tell them apart', () => {
    expect(questionKey({ kind: 'maxcut', pins: { A: 0, B: 1 } })).toBe(questionKey({ pins: { B: 1, A: 0 }, kind: 'maxcut' }));
    expect(questionKey({ kind: 'maxcut' })).toBe(questionKey({ kind: 'maxcut', tolerance: 0.2 })); // max-cut has no balance rule
    expect(questionKey({ kind: 'maxcut' })).not.toBe(questionKey({ kind: 'maxcut', pins: { A: 0 } }));
    expect(questionKey({ kind: 'bisection', tolerance: 0.05 })).not.toBe(questionKey({ kind: 'bisection', tolerance: 0.1 }));
    expect(questionKey({ kind: 'kway', k: 3 })).not.toBe(questionKey({ kind: 'kway', k: 4 }));
  });

  test('the value of a stored orchestrator result: Petersen max-cut 12 (common practice), a bisection\'s fractional weight', async () => {
    const max = await solveProblem(bindProblem(compactFromEdges(10, petersen()), { kind: 'maxcut' }), 'exact', {}, { seed: 1, timeLimitSeconds: 5 }, { bounds: false });
    expect(valueOf(JSON.stringify(max).slice(0, 240))).toBe(12);
    const split = await solveProblem(bindProblem(compactFromEdges(4, [[0, 1, 0.25], [1, 2, 1.5], [2, 3, 0.25], [3, 0, 1.5]]), { kind: 'bisection', tolerance: 0 }), 'exact', {}, { seed: 1, timeLimitSeconds: 5 }, { bounds: false });
    expect(split.value).toBe(0.5);
    expect(valueOf(JSON.stringify(split).slice(0, 240))).toBe(0.5);
    expect(valueOf('{"value":3}')).toBeNull();
    expect(valueOf(null)).toBeNull();
  });
});
