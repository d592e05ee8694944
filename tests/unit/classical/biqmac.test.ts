import * as path from 'node:path';
import { computeBounds, gwSolver, tabuSolver } from '../../../shared/engine/solvers/classical';
import { maxcutEigenBound } from '../../../shared/engine/classical/bounds';
import { DATA, ctx, problemOf, readCsv, readInstance } from './helpers';


// Biq Mac library (Wiegele 2007), instances from the rudy generator; optima from BiqBin
// branch-and-bound runs (see data/biqmac/SOURCE.md). Only rows whose status is `proven`
// or `cited` are used; the evidence column is printed into the test name.
const optima = readCsv(path.join(DATA, 'biqmac/OPTIMA.csv'));
const picked = ['g05_60.0', 'pm1s_100.0', 'w01_100.0', 'pw01_100.0'].map((name) => optima.find((r) => r.instance === name)!);

describe('Biq Mac proven optima (Wiegele 2007; BiqBin outputs)', () => {
  test.each(picked.map((r) => [r.instance, Number(r.optimum), r.status, r.evidence] as const))(
    '%s: tabu reaches %i within 3 s; eigenvalue bound ≥ optimum (status %s; evidence: %s)',
    async (name, optimum, status) => {
      expect(['proven', 'cited']).toContain(status);
      const { n, edges } = readInstance(path.join(DATA, 'biqmac', name));
      const problem = problemOf(n, edges);
      const r = await tabuSolver.solve(problem, tabuSolver.parseSettings({ target: optimum }), ctx(3, 1));
      expect(r.value).toBe(optimum);
      const eig = maxcutEigenBound(problem, { knownValue: optimum })!;
      expect(eig.plain).toBeGreaterThanOrEqual(optimum);
      expect(eig.shifted).toBeGreaterThanOrEqual(optimum);
      expect(eig.shifted).toBeLessThanOrEqual(eig.plain + 1e-9);
      expect(computeBounds(problem, { knownValue: optimum }).bound!).toBeGreaterThanOrEqual(optimum);
    },
    20000,
  );
});


describe('Goemans–Williamson on a Biq Mac instance (non-negative weights)', () => {
  test('g05_60.0: cut ≥ 0.878 × the proven optimum 536 (Goemans & Williamson, J. ACM 42(6) 1995: α = 0.87856 in expectation; best of many hyperplanes + polish); certified SDP bound ≥ 536', async () => {
    const row = optima.find((r) => r.instance === 'g05_60.0')!;
    expect(row.status).toBe('proven');
    const optimum = Number(row.optimum);
    const { n, edges } = readInstance(path.join(DATA, 'biqmac', 'g05_60.0'));
    const problem = problemOf(n, edges);
    const r = await gwSolver.solve(problem, gwSolver.parseSettings({}), ctx(5, 2));
    expect(r.value).toBeGreaterThanOrEqual(0.87856 * optimum);
    expect(r.value).toBeLessThanOrEqual(optimum);
    expect(r.bound).not.toBeNull();
    expect(r.bound!).toBeGreaterThanOrEqual(optimum);
  });
});
