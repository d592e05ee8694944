/**
 * rqaoa's per-round log (variational/rqaoa-log.ts): what the run screen shows of each round —
 * depots eliminated and the correlations used — agrees with the elimination list and the
 * first-round angles the result reports, and stays within its cap on long recursions.
 */
import { getSolver } from '../../../shared/engine/solvers/registry';
import { createRng } from '../../../shared/engine/random';
import { ROUND_LOG_CAP, roundLog } from '../../../shared/engine/variational/rqaoa-log';
import { problemOf, randomGraph } from '../encodings/fixtures';

describe('rqaoa round log', () => {
  test('one entry per round: eliminations, signs and correlations as listed, round 1 at the reported angles', async () => {
    const rng = createRng(31);
    const p = problemOf(40, randomGraph(rng, 40, 0.15, () => 1 + rng.int(3)), { kind: 'maxcut' });
    const d = getSolver('rqaoa');
    const r = await d.solve(p, d.parseSettings({ stopAt: 10, refine: false }), { seed: 1, timeLimitSeconds: 60 });
    const log = r.recursion!.roundLog!;
    const picked = r.recursion!.eliminations.filter((e) => e.correlation !== 0);
    expect(log.filter((e) => e.from > 0)).toHaveLength(r.recursion!.rounds);
    for (const e of log) {
      const mine = picked.filter((x) => x.round === e.from);
      expect(e.to).toBe(e.from);
      expect(e.eliminated).toBe(mine.length);
      expect(e.same).toBe(mine.filter((x) => x.sign > 0).length);
      expect(e.opposite).toBe(mine.filter((x) => x.sign < 0).length);
      if (mine.length) {
        expect(e.strongest).toBeCloseTo(Math.max(...mine.map((x) => Math.abs(x.correlation))), 12);
        expect(e.weakest).toBeCloseTo(Math.min(...mine.map((x) => Math.abs(x.correlation))), 12);
      }
    }
    expect(log.reduce((a, e) => a + e.eliminated + e.dropped, 0)).toBe(r.recursion!.eliminationsTotal);
    // Spins left fall by what each round eliminated (one per round below 300 depots, as in Bravyi et al. 2020).
    const rounds = log.filter((e) => e.from > 0);
    expect(rounds[0].spins).toBe(40);
    const first = rounds[0];
    expect([first.gamma, first.beta]).toEqual(r.params);
  });

  test('long recursions are merged into at most ROUND_LOG_CAP groups, totals kept', () => {
    const rounds = Array.from({ length: 700 }, (_, i) => ({ round: i + 1, spins: 20000 - 20 * i, gamma: 0.3, beta: 0.1 }));
    const steps = rounds.flatMap((r) => Array.from({ length: 3 }, (_, k) => ({ round: r.round, sign: (k === 0 ? -1 : 1) as 1 | -1, correlation: (k + 1) * 0.1 + r.round * 1e-4 })));
    const log = roundLog(rounds, steps);
    expect(log.length).toBeLessThanOrEqual(ROUND_LOG_CAP);
    expect(log[0].from).toBe(1);
    expect(log[log.length - 1].to).toBe(700);
    expect(log.reduce((a, e) => a + e.eliminated, 0)).toBe(2100);
    expect(log.reduce((a, e) => a + e.opposite, 0)).toBe(700);
    for (let i = 1; i < log.length; i++) expect(log[i].from).toBe(log[i - 1].to + 1);
    expect(log[log.length - 1].strongest).toBeCloseTo(0.3 + 0.07, 12);
    expect(log[0].weakest).toBeCloseTo(0.1 + 1e-4, 12);
  });
});
