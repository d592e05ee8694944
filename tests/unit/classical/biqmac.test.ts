import { computeBounds } from '../../../shared/engine/solvers/bounds';
import { gwSolver } from '../../../shared/engine/solvers/gw';
import { tabuSolver } from '../../../shared/engine/solvers/tabu';
import { maxcutEigenBound } from '../../../shared/engine/classical/bounds';
import { ctx, problemOf } from './helpers';
import { biqmacRow, readInstance } from '../../data/load';


// Biq Mac library (Wiegele 2007), instances from the rudy generator; optima from BiqBin
// branch-and-bound runs (see tests/data/biqmac/SOURCE.md). Only rows whose status is `proven`
// or `cited` are used; the evidence column is printed into the test name.
const picked = ['g05_60.0', 'pm1s_100.0', 'w01_100.0', 'pw01_100.0'].map(biqmacRow);

describe('Biq Mac proven optima (Wiegele 2007; BiqBin outputs)', () => {
  test.each(picked.map((r) => [r.instance, r.optimum, r.status, r.evidence] as const))(
    '%s: tabu reaches %i within 3 s; eigenvalue bound ≥ optimum (status %s; evidence: %s)',
    async (name, optimum, status) => {
      expect(['proven', 'cited']).toContain(status);
      const { n, edges } = readInstance('biqmac', name);
      const problem = problemOf(n, edges);
      const r = await tabuSolver.solve(problem, tabuSolver.parseSettings({ target: optimum }), ctx(3, 1));
      expect(r.value).toBe(optimum);
      const eig = maxcutEigenBound(problem, { knownValue: optimum })!;
      expect(eig.plain).toBeGreaterThanOrEqual(optimum);
      expect(eig.shifted).toBeGreaterThanOrEqual(optimum);
      expect(computeBounds(problem, { knownValue: optimum }).bound!).toBeGreaterThanOrEqual(optimum);
    },
    20000,
  );
});


describe('Goemans–Williamson on a Biq Mac instance (non-negative weights)', () => {
  test('g05_60.0: cut ≥ 0.878 × the proven optimum 536 (Goemans & Williamson, J. ACM 42(6) 1995: α = 0.87856 in expectation; best of many hyperplanes + polish); certified SDP bound ≥ 536', async () => {
    const row = biqmacRow('g05_60.0');
    expect(row.status).toBe('proven');
    const optimum = row.optimum;
    const { n, edges } = readInstance('biqmac', 'g05_60.0');
    const problem = problemOf(n, edges);
    const r = await gwSolver.solve(problem, gwSolver.parseSettings({}), ctx(5, 2));
    expect(r.value).toBeGreaterThanOrEqual(0.87856 * optimum);
    expect(r.value).toBeLessThanOrEqual(optimum);
    expect(r.bound).not.toBeNull();
    expect(r.bound!).toBeGreaterThanOrEqual(optimum);
  });
});
