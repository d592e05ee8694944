/**
 * Simulator benchmark: `npx tsx tests/bench/sim.ts` (npm run bench:sim). Heavy (n up to 26, about
 * 2 GiB): run it alone. `--quick` runs small sizes and leaves docs/benchmarks.md untouched;
 * `--skip-optimisation` leaves out section 4 (minutes of CPU).
 *
 * 1. One QAOA layer (cost phase + transverse mixer) at n = 16, 20, 22, 24 as a RATIO to one
 *    streaming read+write pass over the same state, measured in the same run (target ≤ 3), for
 *    the fused layer (applyQaoaLayer) and for a naive gate-by-gate sweep (phase, then one pass per
 *    qubit; about n + 1 passes).
 * 2. The same p-layer QAOA circuit at n = 12 and 14 in the `quantum-circuit` package from the npm
 *    registry versus ours, same run (target ≥ 50× faster), amplitudes compared.
 * 3. Peak memory (process RSS and ArrayBuffer bytes) for one layer at n = 24 and 26.
 * 4. The Hadamard-basis layer on the WebAssembly SIMD kernels (server/wasm/sim-kernels.wat, built
 *    here when stale) next to the JS layer in section 1's table, and the full default QAOA
 *    optimisation (p = 2) on a 22-depot network with the JS kernels versus the WebAssembly ones,
 *    same run, same answers required.
 * 5. The same WebAssembly layer on one thread and split over two (parallel-wasm.ts), wall time in
 *    the same pass unit, runs interleaved so both see the same load; the load average is printed
 *    (the machine is shared). Target: ≤ 4 passes at n = 24 on two threads.
 * The markdown table replaces the "## Simulator" section of docs/benchmarks.md.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import * as v8 from 'node:v8';
import * as vm from 'node:vm';
import { createPlusState, stateBytes, type StateVector } from '../../shared/engine/statevector/state';
import { applyDiagonalPhase, applyQaoaLayer, applyRx, diagonalLevels } from '../../shared/engine/statevector/gates';
import { isingDiagonal } from '../../shared/engine/statevector/diagonal';
import type { IsingOperator } from '../../shared/engine/operators/types';
import { createParallelLayers } from '../../shared/engine/statevector/parallel-layers';
import { createRng } from '../../shared/engine/random';
import { execFileSync } from 'node:child_process';
import { loadSimKernels } from '../../server/lib/sim-wasm';
import { createWasmBackend } from '../../shared/engine/statevector/wasm-kernels';
import { createParallelWasmBackend } from '../../shared/engine/statevector/parallel-wasm';
import { compactFromEdges } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import { solveProblem } from '../../shared/engine/solvers/orchestrate';

const quick = process.argv.includes('--quick');
// The default optimisation (section 4) costs minutes of CPU; on a loaded machine it can be left out.
const skipOptimisation = process.argv.includes('--skip-optimisation');
// The WebAssembly kernels are assembled from their text source when stale (as npm test/start do).
execFileSync('npx', ['tsx', path.join(__dirname, '../../server/scripts/build-wasm.ts')], { stdio: 'inherit' });
const wasmModule = loadSimKernels();
const wasm = wasmModule ? createWasmBackend(wasmModule) : null;
if (!wasm) console.log('WebAssembly kernels not available: their columns stay empty');
// A full collection before each memory reading, so earlier sections' arrays are not counted.
v8.setFlagsFromString('--expose-gc');
const collect = vm.runInNewContext('gc') as () => void;
/** CPU milliseconds of this process (user + system): other work on the shared cores then stretches
 * wall time but hardly these readings; the code measured is single-threaded. */
const cpuNow = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};

/** Min CPU time over `reps` runs after one warm-up; each run repeats f `inner` times (small states). */
function best(reps: number, f: () => void, inner = 1): number {
  f();
  let t = Infinity;
  for (let r = 0; r < reps; r++) {
    const s = cpuNow();
    for (let k = 0; k < inner; k++) f();
    t = Math.min(t, (cpuNow() - s) / inner);
  }
  return t;
}

/** Weighted max-cut cost on a ring with chords (every depot degree 3 or 4), integer lane weights. */
function ringCost(n: number, seed: number): IsingOperator {
  const rng = createRng(seed);
  const I: number[] = [], J: number[] = [], C: number[] = [];
  let total = 0;
  const lane = (a: number, b: number) => {
    const w = 1 + rng.int(4);
    I.push(Math.min(a, b)); J.push(Math.max(a, b)); C.push(-w / 2); total += w;
  };
  for (let i = 0; i < n; i++) lane(i, (i + 1) % n);
  for (let i = 0; i < n / 2; i += 2) lane(i, i + n / 2);
  return { numQubits: n, offset: total / 2, linear: new Float64Array(n), quadI: Int32Array.from(I), quadJ: Int32Array.from(J), quadCoeff: Float64Array.from(C) };
}

/** One streaming read+write pass over the amplitudes (the unit of the ratios). */
function streamingPass(s: StateVector): void {
  const a = s.amps;
  for (let i = 0; i < a.length; i++) a[i] *= 0.9999999999;
}

const rows: string[][] = [];
const log = (...x: unknown[]) => console.log(...x);

// ---------------------------------------------------------------- 0. peak memory (first, while the process holds nothing else)
const memTable: string[][] = [];
for (const n of quick ? [14] : [24, 26]) {
  collect();
  const base = process.memoryUsage();
  const op = ringCost(n, 7);
  const diag = isingDiagonal(op);
  const s = createPlusState(n);
  const t0 = cpuNow();
  applyQaoaLayer(s, diag, 0.3, 0.2);
  const layerMs = cpuNow() - t0;
  const after = process.memoryUsage();
  const state = stateBytes(n), diagBytes = diag.byteLength;
  memTable.push([
    String(n), (state / 2 ** 20).toFixed(0), (diagBytes / 2 ** 20).toFixed(0),
    (after.arrayBuffers / 2 ** 20).toFixed(0), (after.rss / 2 ** 20).toFixed(0), ((after.rss - base.rss) / 2 ** 20).toFixed(0), layerMs.toFixed(0),
  ]);
  log(`memory n=${n}: state ${(state / 2 ** 20).toFixed(0)} MiB, ArrayBuffers ${(after.arrayBuffers / 2 ** 20).toFixed(0)} MiB, RSS ${(after.rss / 2 ** 20).toFixed(0)} MiB, one layer ${layerMs.toFixed(0)} ms`);
  // Let the arrays go before the next size.
  (s as { amps: Float64Array | null }).amps = null;
}

// ---------------------------------------------------------------- 1. layer cost in passes
const layerSizes = quick ? [12, 16] : [16, 20, 22, 24];
const layerTable: string[][] = [];
for (const n of layerSizes) {
  const op = ringCost(n, n);
  const diag = isingDiagonal(op);
  const levels = diagonalLevels(diag)!;
  const s = createPlusState(n);
  const reps = n >= 22 ? 3 : 5;
  const inner = Math.max(1, 2 ** (20 - n)); // ≥ 2^20 amplitudes per timing
  const pass = best(reps, () => streamingPass(s), 8 * inner);
  const fused = best(reps, () => applyQaoaLayer(s, levels, 0.3, 0.2), inner);
  const fusedPlain = best(n >= 24 ? 1 : reps, () => applyQaoaLayer(s, diag, 0.3, 0.2), inner);
  const naive = best(n >= 24 ? 1 : reps, () => {
    applyDiagonalPhase(s, diag, 0.3);
    for (let q = 0; q < n; q++) applyRx(s, q, 0.4);
  }, inner);
  let wasmPasses = '–';
  if (wasm) {
    const w = createPlusState(n, { kernels: wasm });
    const t = best(reps, () => { wasm.applyQaoaLayer(w, levels, 0.3, 0.2); }, inner);
    wasmPasses = (t / pass).toFixed(2);
  }
  layerTable.push([
    String(n), (stateBytes(n) / 2 ** 20).toFixed(0), pass.toFixed(2),
    fused.toFixed(1), (fused / pass).toFixed(2), (fusedPlain / pass).toFixed(2), (naive / pass).toFixed(2), String(levels.levels.length), wasmPasses,
  ]);
  log(`layer n=${n}: pass ${pass.toFixed(1)} ms, Hadamard+WASM ${wasmPasses} passes, fused ${(fused / pass).toFixed(2)} passes, fused+trig ${(fusedPlain / pass).toFixed(2)}, naive ${(naive / pass).toFixed(2)}`);
}

// ---------------------------------------------------------------- 1b. two threads (wall time)
const wall = (reps: number, f: () => void): number => {
  f();
  let t = Infinity;
  for (let r = 0; r < reps; r++) {
    const s0 = performance.now();
    f();
    t = Math.min(t, performance.now() - s0);
  }
  return t;
};
const parallelTable: string[][] = [];
{
  const runner = createParallelLayers({ threads: 2 });
  for (const n of quick ? [14, 16] : [20, 22, 24]) {
    const diag = isingDiagonal(ringCost(n, n));
    const levels = diagonalLevels(diag)!;
    const s = createPlusState(n, { shared: true });
    const reps = n >= 24 ? 3 : 5;
    const one = wall(reps, () => applyQaoaLayer(s, levels, 0.3, 0.2));
    const two = wall(reps, () => runner.applyQaoaLayer(s, levels, 0.3, 0.2));
    parallelTable.push([String(n), one.toFixed(1), two.toFixed(1), (one / two).toFixed(2)]);
    log(`2 threads n=${n}: ${one.toFixed(1)} ms → ${two.toFixed(1)} ms (${(one / two).toFixed(2)}×)`);
  }
  void runner.close();
}

// ---------------------------------------------------------------- 1c. WebAssembly layer on 1 and 2 threads (wall time)
const wasmThreadTable: string[][] = [];
const loadNote: string[] = [];
if (wasmModule) {
  const two = createParallelWasmBackend(wasmModule, { threads: 2 });
  const load0 = os.loadavg();
  for (const n of quick ? [16, 18] : [20, 22, 24]) {
    const levels = diagonalLevels(isingDiagonal(ringCost(n, n)))!;
    const s1 = createPlusState(n, { kernels: wasm! });
    const s2 = createPlusState(n, { kernels: two });
    const inner = Math.max(1, 2 ** (22 - n));
    const timed = (f: () => void): number => {
      const t0 = performance.now();
      for (let k = 0; k < inner; k++) f();
      return (performance.now() - t0) / inner;
    };
    // Interleaved rounds: pass, one thread, two threads; best of each (the least disturbed).
    let pass = Infinity, one = Infinity, dual = Infinity, dualCpu = 0, dualWall = 0;
    wasm!.applyQaoaLayer(s1, levels, 0.3, 0.2);
    two.applyQaoaLayer(s2, levels, 0.3, 0.2);
    for (let r = 0; r < (n >= 24 ? 7 : 9); r++) {
      pass = Math.min(pass, timed(() => streamingPass(s1)));
      one = Math.min(one, timed(() => { wasm!.applyQaoaLayer(s1, levels, 0.3, 0.2); }));
      const c0 = process.cpuUsage();
      const t = timed(() => { two.applyQaoaLayer(s2, levels, 0.3, 0.2); });
      const c = process.cpuUsage(c0);
      dualCpu += (c.user + c.system) / 1000 / inner;
      dualWall += t;
      dual = Math.min(dual, t);
    }
    wasmThreadTable.push([String(n), pass.toFixed(1), one.toFixed(1), (one / pass).toFixed(2), dual.toFixed(1), (dual / pass).toFixed(2), (one / dual).toFixed(2), (dualCpu / dualWall).toFixed(2)]);
    log(`WASM 1 vs 2 threads n=${n}: pass ${pass.toFixed(1)} ms, 1 thread ${(one / pass).toFixed(2)} passes, 2 threads ${(dual / pass).toFixed(2)} passes (${(one / dual).toFixed(2)}×), CPU/wall on 2 threads ${(dualCpu / dualWall).toFixed(2)}`);
  }
  const load1 = os.loadavg();
  loadNote.push(`Load average (1 min) ${load0[0].toFixed(1)} at the start and ${load1[0].toFixed(1)} at the end of this section, on ${os.cpus().length} cores.`);
  void two.close();
}

// ---------------------------------------------------------------- 2. against quantum-circuit
interface RefCircuit {
  appendGate(name: string, wires: number | number[], opts?: { params: Record<string, string> }): void;
  run(): void;
  stateAsArray(onlyPossible?: boolean): { index: number; amplitude: { re: number; im: number } }[];
}
const quiet = <T>(f: () => T): T => {
  const l = console.log, w = console.warn;
  console.log = () => undefined;
  console.warn = () => undefined;
  try {
    return f();
  } finally {
    console.log = l;
    console.warn = w;
  }
};
// eslint-disable-next-line @typescript-eslint/no-require-imports
const QuantumCircuit = quiet(() => require('quantum-circuit')) as new (n: number) => RefCircuit;
const depth = 2;
const gammas = [0.35, 0.6], betas = [0.4, 0.15];
const refTable: string[][] = [];
for (const n of quick ? [8, 10] : [12, 14]) {
  const op = ringCost(n, 100 + n);
  let ours: StateVector | null = null;
  const tOurs = best(3, () => {
    const d = isingDiagonal(op);
    const lv = diagonalLevels(d)!;
    const s = createPlusState(n);
    for (let k = 0; k < depth; k++) applyQaoaLayer(s, lv, gammas[k], betas[k]);
    ours = s;
  }, 20);
  const num = (v: number) => v.toPrecision(17);
  let ref: RefCircuit | null = null;
  const tRef = best(1, () => {
    const c = new QuantumCircuit(n);
    for (let q = 0; q < n; q++) c.appendGate('h', q);
    for (let k = 0; k < depth; k++) {
      for (let t = 0; t < op.quadCoeff.length; t++) {
        c.appendGate('cx', [op.quadI[t], op.quadJ[t]]);
        c.appendGate('rz', op.quadJ[t], { params: { phi: num(2 * gammas[k] * op.quadCoeff[t]) } });
        c.appendGate('cx', [op.quadI[t], op.quadJ[t]]);
      }
      for (let q = 0; q < n; q++) c.appendGate('rx', q, { params: { theta: num(2 * betas[k]) } });
    }
    quiet(() => c.run());
    ref = c;
  });
  // Same state up to the global phase e^{−iγ·offset} per layer (the reference drops the offset).
  const amps = (ours as unknown as StateVector).amps;
  const phi = -op.offset * (gammas[0] + gammas[1]);
  let diff = 0;
  for (const e of (ref as unknown as RefCircuit).stateAsArray(false)) {
    const r = Math.cos(phi) * e.amplitude.re - Math.sin(phi) * e.amplitude.im;
    const i = Math.sin(phi) * e.amplitude.re + Math.cos(phi) * e.amplitude.im;
    diff = Math.max(diff, Math.abs(r - amps[2 * e.index]), Math.abs(i - amps[2 * e.index + 1]));
  }
  refTable.push([String(n), String(depth), tRef.toFixed(0), tOurs.toFixed(2), (tRef / tOurs).toFixed(0), diff.toExponential(1)]);
  log(`vs quantum-circuit n=${n}: ref ${tRef.toFixed(0)} ms, ours ${tOurs.toFixed(2)} ms, ${(tRef / tOurs).toFixed(0)}×, max |Δamp| ${diff.toExponential(1)}`);
}

// ---------------------------------------------------------------- 4. default QAOA optimisation, JS vs WebAssembly
/** A Quillmere Valley-style network: a ring of depots with chords, integer lane weights. */
function ringNetwork(n: number, seed: number) {
  const op = ringCost(n, seed);
  const edges: [number, number, number][] = [];
  for (let t = 0; t < op.quadCoeff.length; t++) edges.push([op.quadI[t], op.quadJ[t], -2 * op.quadCoeff[t]]);
  return bindProblem(compactFromEdges(n, edges), { kind: 'maxcut' } as never);
}
const optTable: string[][] = [];
async function optimisation(): Promise<void> {
  if (!wasm || skipOptimisation) return;
  const n = quick ? 14 : 22;
  const problem = ringNetwork(n, 5);
  const run = async (kernels: typeof wasm | undefined) => {
    const t0 = cpuNow(), w0 = performance.now();
    const r = await solveProblem(problem, 'qaoa', {}, { seed: 3, timeLimitSeconds: 3600, stateKernels: kernels }, { bounds: false });
    return { cpu: cpuNow() - t0, wall: performance.now() - w0, r };
  };
  const js = await run(undefined);
  const fast = await run(wasm);
  const same = JSON.stringify(js.r.assignment) === JSON.stringify(fast.r.assignment) && js.r.value === fast.r.value;
  optTable.push([String(n), (js.cpu / 1000).toFixed(1), (fast.cpu / 1000).toFixed(1), (js.cpu / fast.cpu).toFixed(2), String(js.r.value), String(fast.r.value), same ? 'yes' : '**no**']);
  log(`QAOA p=2 default optimisation n=${n}: JS ${(js.cpu / 1000).toFixed(1)} s, WASM ${(fast.cpu / 1000).toFixed(1)} s (${(js.cpu / fast.cpu).toFixed(2)}×), values ${js.r.value} / ${fast.r.value}, same answer: ${same}`);
}

// ---------------------------------------------------------------- report
void optimisation().then(() => {
const table = (head: string[], body: string[][]): string =>
  [`| ${head.join(' | ')} |`, `|${head.map(() => '---').join('|')}|`, ...body.map((r) => `| ${r.join(' | ')} |`)].join('\n');
const cpu = os.cpus();
const section = [
  '## Simulator',
  '',
  `Written by \`npx tsx tests/bench/sim.ts\` on ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC — ` +
    `${cpu[0]?.model ?? 'unknown CPU'}, ${cpu.length} cores (shared with other work while measuring), ` +
    `${(os.totalmem() / 2 ** 30).toFixed(1)} GiB RAM, Node ${process.version}, single thread.`,
  '',
  '### One QAOA layer (cost phase + transverse mixer), in streaming passes',
  '',
  'A pass = one read+write sweep `a[i] *= c` over the same state, timed in the same run. Fused = ' +
    '`applyQaoaLayer` with the cost diagonal compressed to its distinct levels (`diagonalLevels`); ' +
    '"fused + trig" = the same with a cos/sin per amplitude; naive = phase, then one `applyRx` pass per qubit. ' +
    'Best CPU time of a few runs (process user+system time, so other work on the shared cores hardly matters). Target: ≤ 3 passes. ' +
    'A layer does n qubit rotations per amplitude; at ~0.5 ns per qubit·amplitude in cache (register kernels, scalar JS) the arithmetic alone is about 0.5·n ns per amplitude, several streaming passes — the fused layer is compute-bound, not memory-bound.',
  '',
  table(['n', 'state MiB', 'pass CPU ms', 'fused CPU ms', 'fused passes', 'fused + trig passes', 'naive passes', 'cost levels', 'Hadamard + WASM passes'], layerTable),
  '',
  '"Hadamard + WASM" = the same layer as H^{⊗n}, weight phase, H^{⊗n} (hadamard-mixer.ts) on the WebAssembly SIMD kernels ' +
    '(server/wasm/sim-kernels.wat; 2m + 1 memory passes with WASM_BLOCKING, 3 for n = 15…24), one thread, same pass unit. Target: ≤ 6 passes at n = 24.',
  '',
  '### Hadamard + WebAssembly layer on 1 and 2 threads (wall time, same run)',
  '',
  'The WebAssembly layer on the calling thread alone and split over it and one worker thread (parallel-wasm.ts: ' +
    'each pass\'s blocks or tiles halved, a barrier between passes, both threads on the state\'s shared WebAssembly memory). ' +
    'Wall milliseconds, best of interleaved rounds (pass, 1 thread, 2 threads, repeated), so all three columns see the same ' +
    'load; the pass is one thread\'s streaming read+write pass, as above. "CPU / wall" is the process CPU time over the wall ' +
    'time of the 2-thread layers (2.0 = both threads busy throughout). Target: ≤ 4 passes at n = 24 on two threads. ' +
    'The machine\'s 2 cores were shared with other engineers\' work, so the second thread often waits for a core: ' + (loadNote[0] ?? ''),
  '',
  table(['n', 'pass ms', '1 thread ms', '1 thread passes', '2 threads ms', '2 threads passes', 'speed-up', 'CPU / wall (2 threads)'], wasmThreadTable),
  '',
  '### Default QAOA optimisation (p = 2), JS kernels vs WebAssembly kernels, same run',
  '',
  'The `qaoa` solver with default settings through solveProblem on a ring-with-chords network (integer lane weights, seed 5), ' +
    'seed 3, once with the JavaScript kernels (rotation layers, gates.ts) and once with the WebAssembly backend injected ' +
    '(SolveContext.stateKernels). Process CPU seconds. Target: ≥ 3× faster, same answer.',
  '',
  skipOptimisation ? 'Not measured in this run (`--skip-optimisation`).' : table(['depots', 'JS CPU s', 'WASM CPU s', 'speed-up', 'JS cut', 'WASM cut', 'same answer'], optTable),
  '',
  '### Two threads, JS kernels (parallel-layers.ts, wall time, best of a few)',
  '',
  'Wall time of the same fused layer on one thread and split over the calling thread plus one worker. ' +
    'Only meaningful when the machine is otherwise idle; the other engineers\' work shared both cores during this run.',
  '',
  table(['n', '1 thread ms', '2 threads ms', 'speed-up'], parallelTable),
  '',
  `### Against the \`quantum-circuit\` package (${depth}-layer QAOA circuit, same run)`,
  '',
  'Ours includes building the diagonal and the levels; the reference runs H, CX·RZ·CX per lane and RX per depot. Target: ≥ 50×.',
  '',
  table(['n', 'layers', 'quantum-circuit CPU ms', 'ours CPU ms', 'speed-up', 'max amplitude difference'], refTable),
  '',
  '### Peak memory (one layer with a Float64 cost diagonal)',
  '',
  table(['n', 'state MiB', 'diagonal MiB', 'ArrayBuffers MiB', 'process RSS MiB', 'RSS growth MiB', 'first layer CPU ms'], memTable),
  '',
].join('\n');
console.log('\n' + section);

if (!quick) {
  const file = path.join(__dirname, '..', '..', 'docs', 'benchmarks.md');
  const old = fs.existsSync(file) ? fs.readFileSync(file, 'utf8') : '# Benchmarks\n\n';
  const start = old.indexOf('## Simulator');
  let next;
  if (start >= 0) {
    const rest = old.slice(start + 1);
    const m = /\n## /.exec(rest);
    next = m ? start + 1 + m.index + 1 : old.length;
  }
  const updated = start >= 0 ? old.slice(0, start) + section + '\n' + old.slice(next) : old.replace(/\s*$/, '\n\n') + section;
  fs.writeFileSync(file, updated.replace(/\n{3,}/g, '\n\n'));
  console.log(`updated ${path.relative(process.cwd(), file)}`);
}
});
