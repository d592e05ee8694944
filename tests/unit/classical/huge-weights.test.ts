import { computeBounds } from '../../../shared/engine/classical/bounds';
import { getSolver, listSolvers } from '../../../shared/engine/solvers/registry';
import { problemOf, randomGraph } from './helpers';

// Networks may carry weights up to the largest finite double per lane (imports allow 1e300;
// only totals past ~1.8e308 are refused). Scaling every weight by a positive factor does not
// change which assignment is best (common practice), so each classical solver must answer
// such a network as it answers the same network in ordinary units.
describe('classical solvers on lanes of 1e300', () => {
  const edges = randomGraph(16, 0.4, 91, 'real');
  const plain = problemOf(16, edges);
  const huge = problemOf(16, edges.map(([u, v, w]) => [u, v, w * 1e300] as typeof edges[number]));
  const names = listSolvers('maxcut').map((s) => s.name).filter((n) => ['gw', 'tabu', 'anneal', 'greedy', 'exact'].includes(n));

  test.each(names)('%s answers with a finite value and the same cut as in small units', async (name) => {
    const def = getSolver(name);
    const settings = def.parseSettings({});
    const ctx = { seed: 3, timeLimitSeconds: 1 };
    const small = await def.solve(plain, settings, ctx);
    const big = await def.solve(huge, settings, ctx);
    expect(Number.isFinite(big.value)).toBe(true);
    expect(big.value / 1e300).toBeCloseTo(small.value, 6);
  }, 60000);
});

describe('bounds on lanes of 1e300 scale with the weights', () => {
  const edges = randomGraph(16, 0.4, 92, 'real');
  const scaled = edges.map(([u, v, w]) => [u, v, w * 1e300] as typeof edges[number]);
  test.each(['maxcut', 'bisection'] as const)('%s: the bound is finite and 1e300 × the bound in small units', (kind) => {
    const small = computeBounds(problemOf(16, edges, { kind }));
    const big = computeBounds(problemOf(16, scaled, { kind }));
    expect(small.bound).not.toBeNull();
    expect(Number.isFinite(big.bound)).toBe(true);
    expect((big.bound as number) / 1e300).toBeCloseTo(small.bound as number, 6);
    expect(big.source.startsWith(small.source)).toBe(true); // 1e300 × w is an integer, so it may add 'rounded'
  });
});
