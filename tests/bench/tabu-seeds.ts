/**
 * Max-cut tabu on chosen G-set instances over several seeds, at a CPU-second limit per run (the
 * hard instances decide by seed, so one seed says little). Prints cuts by seed, mean gap to best
 * known and how many runs matched it; nothing is written.
 *
 *   npx tsx tests/bench/tabu-seeds.ts --instances G14,G18 [--seeds 1,2,3] [--limit 20] [--opts '{"eliteSize":8}']
 *
 * Best-known values: Benlic & Hao, "Breakout local search for the max-cut problem",
 * Eng. Appl. AI 26(3) (2013), via tests/data/gset/best-known.csv.
 */
import * as os from 'node:os';
import { compactFromEdges } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import type { ProblemSpec } from '../../shared/engine/problem/types';
import { createRng } from '../../shared/engine/random';
import { crossingWeight } from '../../shared/engine/problem/evaluate';
import { tabuMaxcutDefaults } from '../../shared/engine/classical/tabu-maxcut';
import { relinkDefaults, relinkMaxcut } from '../../shared/engine/classical/relink-maxcut';
import { randomSides } from '../../shared/engine/classical/balance';
import { gsetTable, readInstance } from '../data/load';
import { cpuControl } from './cpu-control';

const args = process.argv.slice(2);
const opt = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const limit = Number(opt('--limit') ?? 20);
const seeds = (opt('--seeds') ?? '1,2,3').split(',').map(Number);
const only = opt('--instances')?.split(',').map((s) => s.trim());
const extra = JSON.parse(opt('--opts') ?? '{}');

async function main(): Promise<void> {
  const rows = gsetTable().filter((r) => !only || only.includes(r.instance));
  console.log(`tabu, ${limit} CPU s, seeds ${seeds.join(',')}, options ${JSON.stringify(extra)}, load ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}, ${new Date().toISOString()}`);
  console.log('| instance | best known | cuts by seed | CPU s to best | tabu runs (crossover rounds) | mean gap | matched |');
  console.log('|---|---:|---|---|---|---:|---:|');
  let gapSum = 0, runs = 0, matched = 0;
  for (const row of rows) {
    const { n, edges } = readInstance('gset', row.instance);
    const problem = bindProblem(compactFromEdges(n, edges), { kind: 'maxcut' } as ProblemSpec);
    const cuts: number[] = [], times: string[] = [], rounds: string[] = [];
    for (const seed of seeds) {
      const rng = createRng(seed);
      const run = await relinkMaxcut(problem, randomSides(problem, rng), { ...tabuMaxcutDefaults, ...relinkDefaults, ...extra }, rng, cpuControl(limit), row.best_known);
      cuts.push(crossingWeight(problem, run.side));
      times.push(run.bestAt.toFixed(1));
      rounds.push(`${run.runs} (${run.crossed})`);
    }
    const gaps = cuts.map((c) => (row.best_known - c) / row.best_known);
    gapSum += gaps.reduce((a, b) => a + b, 0);
    runs += cuts.length;
    const m = cuts.filter((c) => c >= row.best_known).length;
    matched += m;
    const meanGap = gaps.reduce((a, b) => a + b, 0) / gaps.length;
    console.log(`| ${row.instance} | ${row.best_known} | ${cuts.join(', ')} | ${times.join(', ')} | ${rounds.join(', ')} | ${(100 * meanGap).toFixed(3)} % | ${m} of ${cuts.length} |`);
  }
  console.log(`mean gap ${(100 * gapSum / Math.max(1, runs)).toFixed(3)} % over ${runs} runs; matched ${matched} of ${runs}; load ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}, ${new Date().toISOString()}`);
}

void main();
