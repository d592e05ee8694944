/**
 * METIS as the benchmark's peer for balanced k-way partitioning (Karypis & Kumar, "A fast and
 * high quality multilevel scheme for partitioning irregular graphs", SIAM J. Sci. Comput. 20(1)
 * 1998; the Debian package `metis`, program `gpmetis`, version 5.1). Only the benchmark uses it:
 * the product never does. When `gpmetis` is missing the benchmark installs the Debian package.
 *
 * Like with like: the graph is written in METIS's plain graph format (1-based adjacency lists
 * with lane weights) into a folder inside the project (.data/bench-metis, git-ignored); the cut
 * and part weights are recomputed here from the partition file METIS writes, not read from its
 * report. Time is the child process's CPU seconds (user + system, from the shell's `times`),
 * so the shared cores count the same for both sides.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { Edge } from '../data/load';

export const METIS_DIR = path.join(__dirname, '../../.data/bench-metis');

const onPath = (cmd: string): boolean => spawnSync('bash', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;

/** gpmetis available (installing the Debian package `metis` when missing); the reason when not. */
export function ensureMetis(): { ok: true; version: string } | { ok: false; reason: string } {
  if (!onPath('gpmetis')) {
    const r = spawnSync('bash', ['-c', '(apt-get install -y metis || (apt-get update && apt-get install -y metis)) >/dev/null 2>&1'], { stdio: 'ignore' });
    if (r.status !== 0 || !onPath('gpmetis')) return { ok: false, reason: 'gpmetis is missing and `apt-get install -y metis` failed' };
  }
  const v = spawnSync('bash', ['-c', "dpkg-query -W -f='${Version}' metis 2>/dev/null"], { encoding: 'utf8' });
  return { ok: true, version: v.stdout.trim() || 'unknown version' };
}

/** Writes the graph in METIS's format (fmt 001: lane weights; parallel lanes merged). */
export function writeMetisGraph(name: string, n: number, edges: Edge[]): string {
  fs.mkdirSync(METIS_DIR, { recursive: true });
  const adj: Array<Map<number, number>> = Array.from({ length: n }, () => new Map());
  for (const [a, b, w] of edges) {
    if (a === b) continue;
    if (!Number.isInteger(w) || w <= 0) throw new Error(`METIS needs positive whole lane weights (got ${w})`);
    adj[a].set(b, (adj[a].get(b) ?? 0) + w);
    adj[b].set(a, (adj[b].get(a) ?? 0) + w);
  }
  const m = adj.reduce((s, x) => s + x.size, 0) / 2;
  const lines = [`${n} ${m} 001`];
  for (let i = 0; i < n; i++) lines.push([...adj[i]].map(([j, w]) => `${j + 1} ${w}`).join(' '));
  const file = path.join(METIS_DIR, `${name}.graph`);
  fs.writeFileSync(file, lines.join('\n') + '\n');
  return file;
}

export interface MetisRun {
  part: Int32Array;
  cpuSeconds: number;
}

/** One gpmetis run: k parts, imbalance 1 + ufactor/1000, `ncuts` tries inside, one seed. */
export function runMetis(graphFile: string, k: number, opts: { ufactor: number; seed: number; ncuts: number }): MetisRun {
  const out = `${graphFile}.part.${k}`;
  if (fs.existsSync(out)) fs.unlinkSync(out);
  const cmd = `gpmetis -ptype=kway -objtype=cut -ufactor=${opts.ufactor} -ncuts=${opts.ncuts} -seed=${opts.seed} '${graphFile}' ${k} >/dev/null; status=$?; times; exit $status`;
  const text = execFileSync('bash', ['-c', cmd], { encoding: 'utf8' });
  // `times` prints the shell's own times, then its children's: "0m0.050s 0m0.004s".
  const lines = text.trim().split('\n');
  const child = lines[lines.length - 1].trim().split(/\s+/).map((t) => {
    const mm = /^(\d+)m([\d.]+)s$/.exec(t);
    return mm ? 60 * Number(mm[1]) + Number(mm[2]) : NaN;
  });
  const part = Int32Array.from(fs.readFileSync(out, 'utf8').trim().split(/\s+/).map(Number));
  return { part, cpuSeconds: child[0] + child[1] };
}

/** Crossing weight and heaviest part of an assignment (unit depot weights), computed here. */
export function cutAndMaxPart(n: number, edges: Edge[], part: ArrayLike<number>, k: number): { cut: number; maxPart: number } {
  if (part.length !== n) throw new Error(`partition has ${part.length} entries for ${n} depots`);
  let cut = 0;
  for (const [a, b, w] of edges) if (part[a] !== part[b]) cut += w;
  const load = new Float64Array(k);
  for (let i = 0; i < n; i++) load[part[i]]++;
  return { cut, maxPart: Math.max(...load) };
}
