/**
 * The WebAssembly layer backend (wasm-kernels.ts) with each pass split over the calling thread
 * and `threads − 1` worker threads, all running the same kernels on the state's shared
 * WebAssembly memory. Why this is sound: within one pass the items (low-sweep blocks, tile-sweep
 * tiles) touch disjoint amplitudes, and every pass ends at a barrier, so the next pass — whose
 * tiles cut across the previous pass's halves, which is how the transform's high qubits mix the
 * two halves of the state — reads only finished amplitudes. Atomics on the control block order
 * the plain memory accesses (JS/WebAssembly memory model: a store before Atomics.add is seen by
 * a thread after its Atomics.load of that value). Each thread has its own tile scratch.
 * Every amplitude sees the same operations in the same order as on one thread: bit-for-bit the
 * one-thread backend.
 *
 * Like parallel-layers.ts (the same runner pattern for the JS kernels) this file uses
 * node:worker_threads: server, CLI, bench and tests import it, pure engine code never does.
 * Calls are synchronous (the caller blocks on Atomics.wait while the workers run their share).
 */
import { Worker, MessageChannel, type MessagePort } from 'node:worker_threads';
import type { LayerBackend } from './backend';
import type { LayerBlocking } from './gates';
import { createWasmBackend, MAX_PASS_THREADS, SCRATCH_SLOT, type WasmKernelExports, type WasmPass } from './wasm-kernels';

export interface ParallelWasmOptions {
  /** Threads in all, the caller included (default 2, at most 7: the scratch slots). */
  threads?: number;
  /** Smaller states run on the calling thread only (the barrier costs more than it saves). Default 16. */
  minQubits?: number;
  /** As in createWasmBackend. */
  maxQubits?: number;
  blocking?: LayerBlocking;
}

export interface ParallelWasmBackend extends LayerBackend {
  readonly threads: number;
  /** Stops the workers (the backend then runs every pass on the calling thread). */
  close(): Promise<void>;
}

// Control block (Int32Array on a SharedArrayBuffer):
//   [0] generation (bumped to start a pass), [1] workers done with it,
//   then per worker w at 2 + 10w: op, six kernel args, from, to, (unused).
const OP_LOW = 0, OP_HIGH = 1, OP_MEMORY = 2, OP_STOP = 3;
const PER = 10;

/** Worker body (plain JS run with eval: nothing to compile for it). */
const WORKER_MAIN = `
const { workerData, receiveMessageOnPort } = require('node:worker_threads');
const { ctl, port, module, w } = workerData;
const at = 2 + ${PER} * w;
let gen = 0, k = null;
for (;;) {
  Atomics.wait(ctl, 0, gen);
  gen = Atomics.load(ctl, 0);
  const op = ctl[at];
  if (op === ${OP_STOP}) break;
  if (op === ${OP_MEMORY}) {
    let msg;
    while (!(msg = receiveMessageOnPort(port))) {} // posted before the generation bump
    k = null; // let the previous state's memory go first
    k = new WebAssembly.Instance(module, { env: { memory: msg.message } }).exports;
  } else if (ctl[at + 7] < ctl[at + 8]) {
    const a = [ctl[at + 1], ctl[at + 2], ctl[at + 3], ctl[at + 4], ctl[at + 5], ctl[at + 6], ctl[at + 7], ctl[at + 8]];
    if (op === ${OP_LOW}) k.lowSweep(...a); else k.highSweep(...a);
  }
  Atomics.add(ctl, 1, 1);
  Atomics.notify(ctl, 1);
}
`;

/** The state's qubit count from a pass: count items of 2^low amplitudes, or tiles of 2^(run + hi − lo). */
function qubitsOf(p: WasmPass): number {
  const [, a1, a2, a3] = p.args;
  return Math.log2(p.count) + (p.kernel === 'lowSweep' ? a1 : a3 + a2 - a1);
}

export function createParallelWasmBackend(module: WebAssembly.Module, opts: ParallelWasmOptions = {}): ParallelWasmBackend {
  const threads = Math.max(1, Math.min(MAX_PASS_THREADS, Math.floor(opts.threads ?? 2)));
  const minQubits = opts.minQubits ?? 16;
  const ctl = new Int32Array(new SharedArrayBuffer(4 * (2 + PER * threads)));
  // Started on the first pass worth splitting (a host that never simulates a large state pays nothing).
  const workers: { w: Worker; port: MessagePort }[] = [];
  const start = (): void => {
    for (let w = 0; w < threads - 1; w++) {
      const { port1, port2 } = new MessageChannel();
      const worker = new Worker(WORKER_MAIN, { eval: true, workerData: { ctl, port: port2, module, w }, transferList: [port2] });
      worker.unref();
      port1.unref();
      workers.push({ w: worker, port: port1 });
    }
  };
  let open = threads > 1;
  /** The memory the workers have instantiated the kernels on. */
  let workerMemory: WebAssembly.Memory | null = null;

  /** Everyone runs their slot of the control block; returns when all workers are done. */
  const broadcast = (): void => {
    Atomics.store(ctl, 1, 0);
    Atomics.add(ctl, 0, 1);
    Atomics.notify(ctl, 0);
  };
  const awaitWorkers = (): void => {
    for (let done = Atomics.load(ctl, 1); done < workers.length; done = Atomics.load(ctl, 1)) Atomics.wait(ctl, 1, done);
  };

  const runPass = (memory: WebAssembly.Memory, k: WasmKernelExports, p: WasmPass): void => {
    if (!open || p.count < threads || qubitsOf(p) < minQubits) {
      if (p.kernel === 'lowSweep') k.lowSweep(...p.args, 0, p.count);
      else k.highSweep(...p.args, 0, p.count);
      return;
    }
    if (workers.length === 0) start();
    if (workerMemory !== memory) {
      for (let w = 0; w < workers.length; w++) {
        workers[w].port.postMessage(memory);
        ctl[2 + PER * w] = OP_MEMORY;
      }
      broadcast();
      awaitWorkers();
      workerMemory = memory;
    }
    const op = p.kernel === 'lowSweep' ? OP_LOW : OP_HIGH;
    for (let w = 0; w < workers.length; w++) {
      const at = 2 + PER * w;
      ctl[at] = op;
      for (let j = 0; j < 6; j++) ctl[at + 1 + j] = p.args[j];
      // Worker w takes share w + 1; its own scratch slot.
      if (op === OP_HIGH) ctl[at + 6] = p.args[5] + (w + 1) * SCRATCH_SLOT;
      ctl[at + 7] = Math.floor(((w + 1) * p.count) / threads);
      ctl[at + 8] = Math.floor(((w + 2) * p.count) / threads);
    }
    broadcast();
    const mine = Math.floor(p.count / threads);
    if (p.kernel === 'lowSweep') k.lowSweep(...p.args, 0, mine);
    else k.highSweep(...p.args, 0, mine);
    awaitWorkers();
  };

  const inner = createWasmBackend(module, { maxQubits: opts.maxQubits, blocking: opts.blocking, runPass });
  return {
    name: threads > 1 ? `wasm-simd×${threads}` : 'wasm-simd',
    threads,
    allocate: (n) => inner.allocate(n),
    applyQaoaLayer: (s, diag, gamma, beta) => inner.applyQaoaLayer(s, diag, gamma, beta),
    applyTransverseMixer: (s, beta) => inner.applyTransverseMixer(s, beta),
    close: async () => {
      if (!open) return;
      open = false;
      if (workers.length === 0) return;
      workerMemory = null;
      for (let w = 0; w < workers.length; w++) ctl[2 + PER * w] = OP_STOP;
      broadcast();
      await Promise.all(workers.map((wk) => new Promise<void>((resolve) => { wk.w.once('exit', () => resolve()); })));
    },
  };
}
