/**
 * Max-cut tabu moves per CPU second on G-set instances, over a fixed budget of ticks (one every
 * 1024 moves), so the run makes the same moves whatever the machine's speed: the printed cut,
 * a hash of the final sides and the next random number must not change when only the speed of
 * the move structures changes. One tabu run, default settings, seed 1; nothing is written.
 *
 *   npx tsx tests/bench/tabu-rate.ts G14,G32 [ticks, default 10000]
 */
import { compactFromEdges } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import type { ProblemSpec } from '../../shared/engine/problem/types';
import { createRng } from '../../shared/engine/random';
import { tabuMaxcut, tabuMaxcutDefaults } from '../../shared/engine/classical/tabu-maxcut';
import { randomSides } from '../../shared/engine/classical/balance';
import { readInstance } from '../data/load';
import type { RunControl } from '../../shared/engine/classical/run-control';
async function main() {
  for (const inst of (process.argv[2] ?? 'G14').split(',')) {
    const { n, edges } = readInstance('gset', inst);
    const problem = bindProblem(compactFromEdges(n, edges), { kind: 'maxcut' } as ProblemSpec);
    const rng = createRng(1);
    let ticks = 0; const limit = Number(process.argv[3] ?? 10000);
    const control: RunControl = { elapsed: () => 0, shouldStop: () => ticks > limit, fraction: () => 0, tick: async () => ++ticks > limit };
    const c0 = process.cpuUsage();
    const run = await tabuMaxcut(problem, randomSides(problem, rng), { ...tabuMaxcutDefaults }, rng, control);
    const u = process.cpuUsage(c0); const s = (u.user + u.system) / 1e6;
    let h = 0; for (let i = 0; i < n; i++) h = (h * 31 + run.side[i]) >>> 0;
    console.log(inst, 'cut', run.cut, 'moves', run.moves, 'hash', h, 'cpu', s.toFixed(2), 'M/s', (run.moves / s / 1e6).toFixed(2), 'rng', rng.next());
  }
}
void main();
