/**
 * The region-count rule lives in one place (shared/engine/problem/limits.ts); the engine's
 * binding, the API schema and the CLI all ask it, so k = 32 works everywhere and 33 nowhere.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem, ProblemError } from '../../../shared/engine/problem/bind';
import { isRegionCount, MAX_REGIONS, MIN_REGIONS, REGION_CHOICES } from '../../../shared/engine/problem/limits';
import { ProblemInputSchema } from '../../../shared/schemas/runs';
import { problemFrom } from '../../../server/cli/load';

const ring = (n: number) => compactFromEdges(n, Array.from({ length: n }, (_, i) => [i, (i + 1) % n, 1] as [number, number, number]));

describe('k regions: 3…32, one rule', () => {
  test('the rule itself', () => {
    expect([MIN_REGIONS, MAX_REGIONS]).toEqual([3, 32]);
    expect(isRegionCount(32)).toBe(true);
    expect(isRegionCount(33)).toBe(false);
    expect(isRegionCount(2)).toBe(false);
    expect(isRegionCount(4.5)).toBe(false);
    expect(REGION_CHOICES.every(isRegionCount)).toBe(true);
    expect(REGION_CHOICES).toContain(32);
  });
  test('engine binding: k = 32 with a pin on region 31; k = 33 refused', () => {
    const net = ring(40);
    const p = bindProblem(net, { kind: 'kway', k: 32, pins: { [net.depotIds[0]]: 31 } });
    expect(p.k).toBe(32);
    expect(p.pins[0]).toBe(31);
    expect(() => bindProblem(net, { kind: 'kway', k: 33 })).toThrow(ProblemError);
  });
  test('API schema: k = 32 and pins up to 31 pass; 33 and a pin on 32 fail', () => {
    expect(ProblemInputSchema.safeParse({ kind: 'kway', k: 32, pins: { a: 31 } }).success).toBe(true);
    expect(ProblemInputSchema.safeParse({ kind: 'kway', k: 33 }).success).toBe(false);
    expect(ProblemInputSchema.safeParse({ kind: 'kway', k: 32, pins: { a: 32 } }).success).toBe(false);
  });
  test('CLI: --k 32 binds, --k 33 names the range', () => {
    const net = ring(40);
    expect(problemFrom(net, { problem: 'kway', k: '32', pins: [] }).k).toBe(32);
    expect(() => problemFrom(net, { problem: 'kway', k: '33', pins: [] })).toThrow(/3…32/);
  });
});
