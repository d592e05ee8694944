/**
 * Partitioning benchmark against METIS as the peer: `npx tsx tests/bench/partition.ts`
 * (npm run bench:partition). Writes the `## Partitioning vs METIS` section of docs/benchmarks.md.
 *
 *   npx tsx tests/bench/partition.ts [--seconds 10] [--ks 4,8,16,32] [--instances G22] [--no-write]
 *
 * Peer: METIS 5.1 (Karypis & Kumar, SIAM J. Sci. Comput. 20(1) 1998), Debian package `metis`,
 * installed by this script when `gpmetis` is missing (tests/bench/metis-peer.ts); the product never
 * uses it. Per k: gpmetis -ptype=kway -objtype=cut -ufactor=30 -ncuts=10 for seeds 1…5, best cut
 * of the 50 tries; cut and part weights recomputed here from its partition file.
 *
 * Ours: the `fm` solver as the product runs it (solver definition, seed 1), stopped by this
 * process's CPU time (user + system) through its cancel token, so the shared cores count the same
 * for both; its progress reports (about every 50 ms) give the best cut after 1 CPU s and after the
 * full budget from one run. A report comes after the cycle that found the cut, so the time read
 * is never earlier than the real one.
 *
 * Balance: METIS's -ufactor=30 allows a part up to 1.03 × the average part weight. Our rule
 * (problem/evaluate.ts maxPartWeight) is (1 + t)·W/k + d_max·(k − 1)/k; the benchmark sets
 * t = 0.03 − d_max·(k − 1)/W, which makes our limit exactly 1.03·W/k — the same bound (METIS
 * adds a tiny allowance of its own, so ours is the same or stricter). Both answers' heaviest parts
 * are printed. Bisection is `kind: bisection` with the same limit, against METIS's k = 2.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { compactFromEdges } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import { crossingWeight, isFeasible, maxPartWeight, partWeights } from '../../shared/engine/problem/evaluate';
import { fmSolver } from '../../shared/engine/solvers/fm';
import { readInstance, type Edge } from '../data/load';
import { cutAndMaxPart, ensureMetis, runMetis, writeMetisGraph } from './metis-peer';

const DOC = path.join(__dirname, '../../docs/benchmarks.md');
const HEADING = '## Partitioning vs METIS';
const args = process.argv.slice(2);
const opt = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const budget = Number(opt('--seconds') ?? 10);
const ks = (opt('--ks') ?? '2,4,8,16,32').split(',').map(Number);
const instances = (opt('--instances') ?? 'G22').split(',');
const write = !args.includes('--no-write');
const SEEDS = [1, 2, 3, 4, 5];
const NCUTS = 10;
const UFACTOR = 30;

const cpuSeconds = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};

interface OurRun { at1: number; atEnd: number; firstBelowPeer: number | null; cpu: number; maxPart: number; feasible: boolean; cycles: number }

/** The fm solver on one question, stopped at `budget` CPU seconds; best cut after 1 s and at the end. */
async function ours(n: number, edges: Edge[], k: number, peerBest: number): Promise<OurRun> {
  const W = n; // G-set depots weigh 1
  const tolerance = 0.03 - (k - 1) / W;
  const problem = bindProblem(compactFromEdges(n, edges), k === 2 ? { kind: 'bisection', tolerance } : { kind: 'kway', k, tolerance });
  if (Math.abs(maxPartWeight(problem) - (1.03 * W) / k) > 1e-6 * W) throw new Error('balance limits differ');
  const cancel = { cancelled: false };
  const trace: Array<{ cpu: number; cut: number }> = [];
  const t0 = cpuSeconds();
  const r = await fmSolver.solve(problem, fmSolver.parseSettings({ cycles: 1e6 }), {
    seed: 1,
    timeLimitSeconds: 30 * budget, // wall limit far away: the CPU budget below stops the run
    cancel,
    onProgress: (p) => {
      const cpu = cpuSeconds() - t0;
      if (typeof p.bestValue === 'number' && Number.isFinite(p.bestValue)) trace.push({ cpu, cut: p.bestValue });
      if (cpu >= budget) cancel.cancelled = true;
    },
  });
  const cpu = cpuSeconds() - t0;
  const value = crossingWeight(problem, r.assignment);
  if (Math.abs(value - r.value) > 1e-9) throw new Error(`reported ${r.value}, recomputed ${value}`);
  const within = (s: number) => trace.filter((t) => t.cpu <= s).reduce((b, t) => Math.min(b, t.cut), Infinity);
  const below = trace.find((t) => t.cut <= peerBest);
  return {
    at1: within(1),
    atEnd: value,
    firstBelowPeer: below ? below.cpu : value <= peerBest ? cpu : null,
    cpu,
    maxPart: Math.max(...partWeights(problem, r.assignment)),
    feasible: isFeasible(problem, r.assignment),
    cycles: r.evaluations,
  };
}

function machine(): string {
  const cpu = os.cpus()[0]?.model ?? 'unknown';
  return `${cpu}, ${os.cpus().length} cores, ${(os.totalmem() / 2 ** 30).toFixed(1)} GiB, Node ${process.version}, ${os.type()} ${os.release()}`;
}

const fmtRatio = (x: number) => (Number.isFinite(x) ? x.toFixed(4) : '—');

async function main(): Promise<void> {
  const metis = ensureMetis();
  const when = new Date().toISOString().slice(0, 16).replace('T', ' ');
  const load0 = os.loadavg();
  const lines: string[] = [
    `Written by \`npx tsx tests/bench/partition.ts\` on ${when} UTC — ${machine()}; load average ${load0.map((l) => l.toFixed(1)).join(' / ')} at the start (the 2 cores are shared with other work, so both sides are timed in CPU seconds of their own process).`,
    '',
    `Peer: METIS ${metis.ok ? metis.version : '(unavailable)'} (Karypis & Kumar 1998), \`gpmetis -ptype=kway -objtype=cut -ufactor=${UFACTOR} -ncuts=${NCUTS}\` with seeds ${SEEDS.join(', ')}: best of ${SEEDS.length * NCUTS} tries; its CPU s are per run of ${NCUTS} tries (mean) and for all ${SEEDS.length} runs. Ours: the \`fm\` solver (recursive multilevel bisection, direct k-way FM, iterated V-cycles; seed 1), one run stopped at ${budget} CPU s; "at 1 s" is its best cut reported within the first CPU second of that run. Balance: every part ≤ 1.03 × W/k on both sides (ours set to exactly that bound; METIS's own allowance is the same or looser). Cuts of both are recomputed here from the assignments. Ratio = ours / METIS best (below 1: ours cuts less).`,
    '',
  ];
  if (!metis.ok) {
    lines.push(`METIS could not be run: ${metis.reason}. No ratios this time.`, '');
  } else {
    for (const name of instances) {
      const { n, edges } = readInstance('gset', name);
      const file = writeMetisGraph(name, n, edges);
      lines.push(`### ${name} (${n} depots, ${edges.length} lanes, unit weights), ${budget} CPU s for ours`, '');
      lines.push('| k | METIS best of 50 | METIS CPU s per run of 10 (all 50) | METIS heaviest part | ours at 1 s | ours at ' + budget + ' s | ours CPU s to reach METIS best | ours heaviest part | limit | ratio at 1 s | ratio at ' + budget + ' s | beats METIS at 1 s / ' + budget + ' s? |');
      lines.push('|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---|');
      for (const k of ks) {
        let best = Infinity, cpuAll = 0, heaviest = 0;
        for (const seed of SEEDS) {
          const run = runMetis(file, k, { ufactor: UFACTOR, seed, ncuts: NCUTS });
          const { cut, maxPart } = cutAndMaxPart(n, edges, run.part, k);
          cpuAll += run.cpuSeconds;
          if (cut < best) { best = cut; heaviest = maxPart; }
        }
        const o = await ours(n, edges, k, best);
        const limit = (1.03 * n) / k;
        const r1 = o.at1 / best, rEnd = o.atEnd / best;
        const line = `| ${k === 2 ? '2 (bisection)' : k} | ${best} | ${(cpuAll / SEEDS.length).toFixed(2)} (${cpuAll.toFixed(2)}) | ${heaviest} | ${Number.isFinite(o.at1) ? o.at1 : '—'} | ${o.atEnd}${o.feasible ? '' : ' (unbalanced!)'} | ${o.firstBelowPeer === null ? 'not reached' : o.firstBelowPeer.toFixed(2)} | ${o.maxPart} | ${limit.toFixed(2)} | ${fmtRatio(r1)} | ${fmtRatio(rEnd)} | ${r1 <= 1 ? 'yes' : 'no'} / ${rEnd <= 1 ? 'yes' : 'no'} |`;
        lines.push(line);
        console.log(line);
      }
      lines.push('');
    }
  }
  lines.push(
    'Before this work (as measured when issue 17 was filed, METIS 5.1 as the peer, best of 10 cuts × 5 seeds; not re-run): G22 bisection 6,817 (fm, within 0.3 s) against METIS 6,874;',
    'G22 k = 8 at 3 %: 13,272 after 1 s and 13,232 after 10 s against METIS 13,180 in about 0.05 s (recursive bisection with greedy moves only); k was limited to 8.',
    '',
  );
  lines.push('The search is seeded but stopped by CPU time, so how many cycles fit in the first second (and so the "at 1 s" cut) varies with the load on the shared cores; the margins at k = 16 and 32 are a few tenths of a percent.', '');
  const load1 = os.loadavg();
  lines.push(`Load average when it ended: ${load1.map((l) => l.toFixed(1)).join(' / ')}.`, '');
  const text = lines.join('\n');
  console.log(`\n${HEADING}\n\n${text}`);
  if (write) rewriteSection(text);
}

function rewriteSection(body: string): void {
  const doc = fs.existsSync(DOC) ? fs.readFileSync(DOC, 'utf8') : '# Benchmarks\n';
  const section = `${HEADING}\n\n${body.trim()}\n`;
  const start = doc.indexOf(`${HEADING}\n`);
  let next: string;
  if (start < 0) next = `${doc.trimEnd()}\n\n${section}`;
  else {
    const after = doc.indexOf('\n## ', start + HEADING.length);
    next = doc.slice(0, start) + section + (after >= 0 ? doc.slice(after) : '');
  }
  fs.writeFileSync(DOC, next.endsWith('\n') ? next : next + '\n');
}

void main();
