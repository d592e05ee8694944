import * as fs from 'node:fs';
import * as path from 'node:path';
import { computeBounds, tabuSolver } from '../../../shared/engine/solvers/classical';
import { maxcutEigenBound } from '../../../shared/engine/classical/bounds';
import { DATA, ctx, problemOf, readInstance } from './helpers';

/** Rows of a small CSV with quoted fields (the data folders' OPTIMA.csv / best-known.csv). */
function readCsv(file: string): Array<Record<string, string>> {
  const [head, ...rows] = fs.readFileSync(file, 'utf8').trim().split(/\r?\n/);
  const split = (line: string): string[] => {
    const out: string[] = [];
    let cur = '', quoted = false;
    for (const ch of line) {
      if (ch === '"') quoted = !quoted;
      else if (ch === ',' && !quoted) { out.push(cur); cur = ''; }
      else cur += ch;
    }
    out.push(cur);
    return out;
  };
  const keys = split(head);
  return rows.map((r) => Object.fromEntries(split(r).map((v, i) => [keys[i], v])));
}

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

// G-set (Helmberg & Rendl, SIAM J. Optim. 10(3) 2000); best-known cuts from Benlic & Hao,
// "Breakout local search for the max-cut problem", Eng. Appl. AI 26(3) (2013).
const bestKnown = readCsv(path.join(DATA, 'gset/best-known.csv'));

describe('G-set: tabu within 0.5 % of the best known cut (Benlic & Hao 2013)', () => {
  test.each(['G11', 'G14'])('%s within 10 s', async (name) => {
    const row = bestKnown.find((r) => r.instance === name)!;
    const best = Number(row.best_known);
    const { n, edges } = readInstance(path.join(DATA, 'gset', `${name}.txt`));
    const problem = problemOf(n, edges);
    const threshold = Math.ceil(0.995 * best);
    const r = await tabuSolver.solve(problem, tabuSolver.parseSettings({ target: threshold }), ctx(10, 1));
    expect(r.value).toBeGreaterThanOrEqual(threshold);
    expect(r.value).toBeLessThanOrEqual(best); // a value above the best known would need a second look
    expect(r.value).toBeLessThanOrEqual(Number(row.sdp_upper_bound)); // certified SDP bound in the csv
  }, 20000);
});
