import { computeBounds } from '../../../shared/engine/solvers/bounds';
import { tabuSolver } from '../../../shared/engine/solvers/tabu';
import { ctx, problemOf } from './helpers';
import { gsetRow, readInstance } from '../../data/load';


// G-set (Helmberg & Rendl, SIAM J. Optim. 10(3) 2000); best-known cuts from Benlic & Hao,
// "Breakout local search for the max-cut problem", Eng. Appl. AI 26(3) (2013).

describe('G-set: tabu within 0.5 % of the best known cut (Benlic & Hao 2013)', () => {
  test.each(['G11', 'G14'])('%s within 10 s', async (name) => {
    const row = gsetRow(name);
    const best = row.best_known;
    const { n, edges } = readInstance('gset', name);
    const problem = problemOf(n, edges);
    const threshold = Math.ceil(0.995 * best);
    const r = await tabuSolver.solve(problem, tabuSolver.parseSettings({ target: threshold }), ctx(10, 1));
    expect(r.value).toBeGreaterThanOrEqual(threshold);
    expect(r.value).toBeLessThanOrEqual(best); // a value above the best known would need a second look
    expect(r.value).toBeLessThanOrEqual(row.sdp_upper_bound); // certified SDP bound in the csv
  }, 20000);
});

describe('G-set: the shifted eigenvalue bound reaches the SDP value (Delorme & Poljak 1993)', () => {
  // sdp_upper_bound in best-known.csv: certified low-rank SDP values [computed when the data
  // folder was assembled]; min over u of (n/4)·λmax(L + diag u) equals the SDP value.
  test.each(['G11', 'G14'])('%s: best known ≤ bound ≤ SDP value + 1', (name) => {
    const row = gsetRow(name);
    const { n, edges } = readInstance('gset', name);
    const report = computeBounds(problemOf(n, edges));
    expect(report.bound!).toBeGreaterThanOrEqual(row.best_known);
    expect(report.bound!).toBeLessThanOrEqual(row.sdp_upper_bound + 1);
    expect(report.source).toMatch(/shift/);
  }, 20000);
});
