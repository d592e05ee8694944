/**
 * The Hadamard-basis QAOA layer (hadamard-mixer.ts: same pass plan, same arithmetic) on the
 * WebAssembly SIMD kernels of server/wasm/sim-kernels.wat. The caller compiles the module and
 * passes it in (the engine does no I/O); without it the JavaScript kernels run.
 *
 * Each allocated state gets its own shared WebAssembly memory (so worker threads can map it):
 *   [0, 1 KiB)       weight phase table, 32 bytes per Hamming weight: (c, c, s, −s)·2^{−n}
 *   [1 KiB, 2 MiB)   tile scratch, 256 KiB per thread (the plan needs ≤ 256 KiB with WASM_BLOCKING
 *                    and DEFAULT_BLOCKING), so up to 7 threads can share one state (parallel-wasm.ts)
 *   [2 MiB, 4 MiB)   cost level table, 32 bytes per level (≤ 65536 levels)
 *   [4 MiB, …)       the state (16·2ⁿ bytes), then the level index of the last diagonal used
 *                    (2 or 4 bytes per basis state, copied in once per diagonal).
 * wasm32 addresses reach 4 GiB, so states up to 2^27 amplitudes fit (the engine's limit is 26
 * qubits); when the memory cannot be had allocate() returns null and the JS kernels are used.
 */
import type { LayerBackend } from './backend';
import { phaseTables, type LayerBlocking } from './gates';
import { hadamardMixerPlan, planScratchDoubles, weightPhaseTable } from './hadamard-mixer';
import { phaseRange, tileCount, type DiagonalLevels } from './layer-kernels';

const WTAB = 0;
const SCRATCH = 1024;
/** Tile scratch per thread: thread t of a split pass uses [SCRATCH + t·SCRATCH_SLOT, …). */
export const SCRATCH_SLOT = 256 << 10;
const TAB = 2 << 20;
const STATE = 4 << 20;
const PAGE = 65536;
const MAX_LEVELS = 65536;
/** Threads whose scratch fits below the level table. */
export const MAX_PASS_THREADS = Math.floor((TAB - SCRATCH) / SCRATCH_SLOT);

export interface WasmKernelExports {
  lowSweep(s: number, low: number, wtab: number, idx: number, wide: number, tab: number, from: number, to: number): void;
  highSweep(s: number, lo: number, hi: number, run: number, wtab: number, scratch: number, from: number, to: number): void;
}
type Exports = WasmKernelExports;

/**
 * One pass of the plan as a kernel call: args are the kernel's first six parameters (for
 * highSweep the sixth is thread 0's scratch), then items [0, count) — blocks or tiles, each
 * independent of the others within the pass.
 */
export interface WasmPass {
  kernel: 'lowSweep' | 'highSweep';
  args: [number, number, number, number, number, number];
  count: number;
}
/**
 * Runs one pass to completion on the state's memory (the default: all items on this thread).
 * A splitter (parallel-wasm.ts) may spread the items over threads that share `memory`; it must
 * return only when every item is done, and give thread t the scratch at args[5] + t·SCRATCH_SLOT.
 */
export type WasmPassRunner = (memory: WebAssembly.Memory, k: WasmKernelExports, pass: WasmPass) => void;

const runHere: WasmPassRunner = (_memory, k, p) => {
  if (p.kernel === 'lowSweep') k.lowSweep(...p.args, 0, p.count);
  else k.highSweep(...p.args, 0, p.count);
};

interface Slot {
  memory: WebAssembly.Memory;
  k: Exports;
  n: number;
  /** The diagonal whose index sits after the state, and where. */
  indexOf: DiagonalLevels | null;
  wide: number;
}

/**
 * The WebAssembly plan's blocking: 256 KiB low blocks (L2-resident) and tiles of 2^10 rows × 4
 * amplitudes (one 64-byte cache line per row, 256 KiB of scratch), so one tile sweep covers ten
 * high qubits: 3 passes from n = 15 to 24 instead of DEFAULT_BLOCKING's 5. The SIMD kernels are
 * fast enough for the passes to count (measured in tests/bench/sim.ts: about 15 % less time at
 * n = 22 and 24 than with DEFAULT_BLOCKING, same run; the scalar JS kernels are compute-bound).
 */
export const WASM_BLOCKING: LayerBlocking = { lowBits: 14, runBits: 4, tileBits: 14 };

export interface WasmBackendOptions {
  /** Largest state (qubits) to put in WebAssembly memory; larger ones use the JS kernels. Default 26. */
  maxQubits?: number;
  /** Pass plan's blocking (default WASM_BLOCKING); its tile scratch must fit SCRATCH_SLOT. */
  blocking?: LayerBlocking;
  /** How each pass runs (default: on the calling thread). */
  runPass?: WasmPassRunner;
}

/** Interleaved (c, s) pairs → the kernels' 32-byte entries (c, c, s, −s). */
function writeTable(view: Float64Array, at: number, pairs: Float64Array): void {
  for (let k = 0; 2 * k < pairs.length; k++) {
    const c = pairs[2 * k], s = pairs[2 * k + 1], o = at / 8 + 4 * k;
    view[o] = c; view[o + 1] = c; view[o + 2] = s; view[o + 3] = -s;
  }
}

export function createWasmBackend(module: WebAssembly.Module, opts: WasmBackendOptions = {}): LayerBackend {
  const maxQubits = Math.min(26, opts.maxQubits ?? 26);
  const runPass = opts.runPass ?? runHere;
  const blocking = opts.blocking ?? WASM_BLOCKING;
  const slots = new WeakMap<ArrayBufferLike, Slot>();
  if (planScratchDoubles(hadamardMixerPlan(maxQubits, blocking)) * 8 > SCRATCH_SLOT) throw new RangeError('tile scratch does not fit');

  const slotOf = (s: { numQubits: number; amps: Float64Array }): Slot | null => {
    const slot = slots.get(s.amps.buffer);
    return slot && s.amps.byteOffset === STATE && slot.n === s.numQubits ? slot : null;
  };

  /** Copies diag's level index after the state (growing the memory) unless it is already there. */
  const placeIndex = (slot: Slot, diag: DiagonalLevels): void => {
    if (slot.indexOf === diag) return;
    const bytes = diag.index.byteLength, at = STATE + 16 * 2 ** slot.n;
    const have = slot.memory.buffer.byteLength;
    if (at + bytes > have) slot.memory.grow(Math.ceil((at + bytes - have) / PAGE));
    const buf = slot.memory.buffer;
    if (diag.index instanceof Uint32Array) new Uint32Array(buf, at, diag.index.length).set(diag.index);
    else new Uint16Array(buf, at, diag.index.length).set(diag.index);
    slot.indexOf = diag;
    slot.wide = diag.index instanceof Uint32Array ? 1 : 0;
  };

  const run = (s: { numQubits: number; amps: Float64Array }, diag: Float64Array | DiagonalLevels | null, gamma: number, beta: number): boolean => {
    const slot = slotOf(s);
    if (!slot) return false;
    const n = slot.n, dim = 2 ** n;
    const heap = new Float64Array(slot.memory.buffer, 0, STATE / 8);
    writeTable(heap, WTAB, weightPhaseTable(n, beta));
    let idx = -1;
    if (diag instanceof Float64Array) {
      // Too many distinct energies for a table: the phase in JS, one extra pass.
      phaseRange(s.amps, diag, gamma, 0, dim, null);
    } else if (diag) {
      if (diag.levels.length > MAX_LEVELS) return false;
      placeIndex(slot, diag);
      writeTable(heap, TAB, phaseTables(diag, gamma)!);
      idx = STATE + 16 * dim;
    }
    for (const p of hadamardMixerPlan(n, blocking)) {
      if (p.kind === 'low') {
        runPass(slot.memory, slot.k, { kernel: 'lowSweep', args: [STATE, p.low, p.middle ? WTAB : -1, p.phase ? idx : -1, slot.wide, TAB], count: dim / 2 ** p.low });
      } else {
        runPass(slot.memory, slot.k, { kernel: 'highSweep', args: [STATE, p.lo, p.hi, p.run, p.middle ? WTAB : -1, SCRATCH], count: tileCount(n, p.lo, p.hi, p.run) });
      }
    }
    return true;
  };

  return {
    name: 'wasm-simd',
    allocate(numQubits) {
      if (numQubits > maxQubits) return null;
      const bytes = STATE + 16 * 2 ** numQubits;
      // Room for the state plus a 4-byte index per basis state (grown into on first use).
      const maxPages = Math.ceil((bytes + 4 * 2 ** numQubits) / PAGE);
      let memory: WebAssembly.Memory;
      try {
        memory = new WebAssembly.Memory({ initial: Math.ceil(bytes / PAGE), maximum: maxPages, shared: true });
      } catch {
        return null;
      }
      const inst = new WebAssembly.Instance(module, { env: { memory } });
      const amps = new Float64Array(memory.buffer, STATE, 2 * 2 ** numQubits);
      slots.set(memory.buffer, { memory, k: inst.exports as unknown as Exports, n: numQubits, indexOf: null, wide: 0 });
      return amps;
    },
    applyQaoaLayer: (s, diag, gamma, beta) => run(s, diag, gamma, beta),
    applyTransverseMixer: (s, beta) => run(s, null, 0, beta),
  };
}
