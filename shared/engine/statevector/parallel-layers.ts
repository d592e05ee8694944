/**
 * Worker-thread runner for the fused layers: the blocks of sweep 1 and the tiles of each
 * high-qubit sweep are split between the calling thread and `threads − 1` workers over a
 * SharedArrayBuffer state, with a barrier between sweeps (tiles of one sweep are independent,
 * sweeps are not). Results are bit-for-bit those of the single-thread functions in gates.ts:
 * every amplitude sees the same operations in the same order.
 *
 * This file uses node:worker_threads; pure engine code never imports it (server/worker/CLI may).
 * The workers run the source text of the self-contained kernels in layer-kernels.ts, so nothing
 * has to be compiled for them. Calls are synchronous (the caller blocks on Atomics.wait).
 */
import { Worker } from 'node:worker_threads';
import type { StateVector } from './state';
import { DEFAULT_BLOCKING, type LayerBlocking } from './gates';
import * as K from './layer-kernels';
import type { DiagonalLevels } from './layer-kernels';

export interface ParallelLayers {
  threads: number;
  /** Same as gates.applyQaoaLayer; s must live on a SharedArrayBuffer (createPlusState(n, { shared: true })). */
  applyQaoaLayer(s: StateVector, diag: Float64Array | DiagonalLevels, gamma: number, beta: number, blocking?: LayerBlocking): void;
  /** Same as gates.applyTransverseMixer, split across threads. */
  applyTransverseMixer(s: StateVector, beta: number, blocking?: LayerBlocking): void;
  /** Stops the workers. */
  close(): Promise<void>;
}

/** Worker body (plain JS, appended after the kernels' source). */
const WORKER_MAIN = `
const { workerData, receiveMessageOnPort } = require('node:worker_threads');
const ctl = workerData.ctl, port = workerData.port;
let gen = 0, amps = null, index = null, diagF = null, scratch = new Float64Array(0);
for (;;) {
  Atomics.wait(ctl, 0, gen);
  gen = Atomics.load(ctl, 0);
  let msg;
  while (!(msg = receiveMessageOnPort(port))) {} // posted before the generation bump
  const t = msg.message;
  if (t.kind === 'stop') break;
  if (t.amps) amps = new Float64Array(t.amps);
  if (t.index) index = t.indexWide ? new Uint32Array(t.index) : new Uint16Array(t.index);
  if (t.diagF) diagF = new Float64Array(t.diagF);
  const coef = Float64Array.of(t.c, t.s);
  if (t.kind === 'low') {
    const diag = t.phase === 'levels' ? { levels: new Float64Array(0), index } : t.phase === 'float' ? diagF : null;
    const table = t.phase === 'levels' ? new Float64Array(t.table) : null;
    lowSweep(amps, t.low, true, coef, diag, t.gamma, table, t.from, t.to);
  } else {
    const need = 2 * 2 ** (t.run + t.hi - t.lo);
    if (scratch.length < need) scratch = new Float64Array(need);
    highSweep(amps, t.n, t.lo, t.hi, t.run, true, coef, scratch, t.from, t.to);
  }
  Atomics.add(ctl, 1, 1);
  Atomics.notify(ctl, 1);
}
`;

function workerSource(): string {
  const parts = [K.pairRx, K.quadRx, K.pairGeneral, K.quadGeneral, K.phaseRange, K.lowSweep, K.highSweep].map((f) => f.toString());
  return parts.join('\n') + '\n' + WORKER_MAIN;
}

export function createParallelLayers(opts: { threads?: number } = {}): ParallelLayers {
  const threads = Math.max(1, Math.floor(opts.threads ?? 2));
  const ctl = new Int32Array(new SharedArrayBuffer(8));
  const src = workerSource();
  const workers: { w: Worker; port: import('node:worker_threads').MessagePort }[] = [];
  for (let k = 0; k < threads - 1; k++) {
    const { port1, port2 } = new (require('node:worker_threads') as typeof import('node:worker_threads')).MessageChannel();
    const w = new Worker(src, { eval: true, workerData: { ctl, port: port2 }, transferList: [port2] });
    w.unref();
    port1.unref();
    workers.push({ w, port: port1 });
  }
  // What each worker has already received (buffers are sent once, then reused).
  let sentAmps: ArrayBufferLike | null = null;
  let sentIndex: ArrayBufferLike | null = null;
  let sentDiagF: ArrayBufferLike | null = null;
  const sharedCopies = new WeakMap<object, Uint16Array | Uint32Array | Float64Array>();

  const toShared = <T extends Uint16Array | Uint32Array | Float64Array>(arr: T): T => {
    if (arr.buffer instanceof SharedArrayBuffer) return arr;
    const cached = sharedCopies.get(arr);
    if (cached) return cached as T;
    const Ctor = arr.constructor as new (b: SharedArrayBuffer) => T;
    const copy = new Ctor(new SharedArrayBuffer(arr.byteLength));
    copy.set(arr as never);
    sharedCopies.set(arr, copy);
    return copy;
  };

  /** Run one sweep: items 0…count−1 split evenly; the caller takes the last share. */
  const round = (count: number, task: Record<string, unknown>, own: (from: number, to: number) => void): void => {
    const parts = workers.length + 1;
    Atomics.store(ctl, 1, 0);
    workers.forEach((wk, k) => {
      wk.port.postMessage({ ...task, from: Math.floor((k * count) / parts), to: Math.floor(((k + 1) * count) / parts) });
    });
    if (workers.length > 0) {
      Atomics.add(ctl, 0, 1);
      Atomics.notify(ctl, 0);
    }
    own(Math.floor((workers.length * count) / parts), count);
    for (let done = Atomics.load(ctl, 1); done < workers.length; done = Atomics.load(ctl, 1)) Atomics.wait(ctl, 1, done);
  };

  const layer = (s: StateVector, diag: Float64Array | DiagonalLevels | null, gamma: number, beta: number, blocking: LayerBlocking): void => {
    if (!(s.amps.buffer instanceof SharedArrayBuffer)) {
      throw new TypeError('parallel layers need a state on a SharedArrayBuffer: create it with { shared: true }');
    }
    const a = s.amps, n = s.numQubits, dim = a.length >> 1;
    if (diag) {
      const len = diag instanceof Float64Array ? diag.length : diag.index.length;
      if (len !== dim) throw new RangeError(`diagonal has ${len} entries, the ${n}-qubit state needs ${dim}`);
    }
    const c = Math.cos(beta), sn = Math.sin(beta);
    const coef = Float64Array.of(c, sn);
    const base: Record<string, unknown> = { c, s: sn };
    if (sentAmps !== a.buffer) {
      base.amps = a.buffer;
      sentAmps = a.buffer;
    }
    const low = Math.min(n, blocking.lowBits);
    // Sweep 1 with the phase.
    let table: Float64Array | null = null;
    let phase: 'levels' | 'float' | null = null;
    let ownDiag: Float64Array | DiagonalLevels | null = null;
    if (diag && !(diag instanceof Float64Array)) {
      phase = 'levels';
      const idx = toShared(diag.index);
      if (sentIndex !== idx.buffer) {
        base.index = idx.buffer;
        base.indexWide = idx instanceof Uint32Array;
        sentIndex = idx.buffer;
      }
      table = new Float64Array(2 * diag.levels.length);
      for (let k = 0; k < diag.levels.length; k++) {
        table[2 * k] = Math.cos(gamma * diag.levels[k]);
        table[2 * k + 1] = Math.sin(gamma * diag.levels[k]);
      }
      ownDiag = diag;
    } else if (diag) {
      phase = 'float';
      const d = toShared(diag);
      if (sentDiagF !== d.buffer) {
        base.diagF = d.buffer;
        sentDiagF = d.buffer;
      }
      ownDiag = diag;
    }
    round(dim / 2 ** low, { ...base, kind: 'low', low, phase, gamma, table: table ?? undefined }, (from, to) =>
      K.lowSweep(a, low, true, coef, ownDiag, gamma, table, from, to),
    );
    const run = Math.min(blocking.runBits, low);
    const g = Math.max(1, blocking.tileBits - run);
    let scratch: Float64Array | null = null;
    for (let lo = low; lo < n; lo += g) {
      const hi = Math.min(n, lo + g);
      const need = 2 * 2 ** (run + hi - lo);
      if (!scratch || scratch.length < need) scratch = new Float64Array(need);
      const sc = scratch;
      round(K.tileCount(n, lo, hi, run), { c, s: sn, kind: 'high', n, lo, hi, run }, (from, to) =>
        K.highSweep(a, n, lo, hi, run, true, coef, sc, from, to),
      );
    }
  };

  return {
    threads,
    applyQaoaLayer: (s, diag, gamma, beta, blocking = DEFAULT_BLOCKING) => layer(s, diag, gamma, beta, blocking),
    applyTransverseMixer: (s, beta, blocking = DEFAULT_BLOCKING) => layer(s, null, 0, beta, blocking),
    close: async () => {
      // Drop our references to the last state and diagonal right away (not when the workers exit).
      sentAmps = sentIndex = sentDiagF = null;
      for (const wk of workers) wk.port.postMessage({ kind: 'stop' });
      if (workers.length > 0) {
        Atomics.add(ctl, 0, 1);
        Atomics.notify(ctl, 0);
      }
      await Promise.all(workers.map((wk) => new Promise<void>((resolve) => { wk.w.once('exit', () => resolve()); })));
    },
  };
}
