/**
 * The simulator's WebAssembly kernels: assembled from the text source server/wasm/sim-kernels.wat
 * by `wabt` (the WebAssembly Binary Toolkit's wat2wasm, compiled to JS, from the npm registry)
 * into server/wasm/sim-kernels.wasm (git-ignored; built by `npm test` / `npm start` through
 * server/scripts/build-wasm.ts). The engine never reads files: callers load the module here and
 * pass it to createWasmBackend (shared/engine/statevector/wasm-kernels.ts).
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { LayerBackend } from '../../shared/engine/statevector/backend';
import { createParallelWasmBackend } from '../../shared/engine/statevector/parallel-wasm';

export const SIM_WAT_PATH = path.resolve(__dirname, '../wasm/sim-kernels.wat');
export const SIM_WASM_PATH = path.resolve(__dirname, '../wasm/sim-kernels.wasm');

/** Features the kernels use: 128-bit SIMD, shared memory (threads), memory.copy (bulk memory). */
const FEATURES = { simd: true, threads: true, bulk_memory: true };

/** wat2wasm of the source text (async: wabt initialises its own WebAssembly first). */
export async function assembleSimKernels(watText: string = fs.readFileSync(SIM_WAT_PATH, 'utf8')): Promise<Uint8Array<ArrayBuffer>> {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const wabt = await (require('wabt') as () => Promise<{
    parseWat(name: string, text: string, features: object): { validate(f: object): void; toBinary(o: object): { buffer: Uint8Array }; destroy(): void };
  }>)();
  const mod = wabt.parseWat('sim-kernels.wat', watText, FEATURES);
  try {
    mod.validate(FEATURES);
    return Uint8Array.from(mod.toBinary({}).buffer);
  } finally {
    mod.destroy();
  }
}

/** Writes the .wasm when it is missing or older than the .wat; returns whether it built. */
export async function buildSimKernelsIfStale(): Promise<boolean> {
  const src = fs.statSync(SIM_WAT_PATH).mtimeMs;
  if (fs.existsSync(SIM_WASM_PATH) && fs.statSync(SIM_WASM_PATH).mtimeMs >= src) return false;
  const bytes = await assembleSimKernels();
  const tmp = `${SIM_WASM_PATH}.${process.pid}.tmp`;
  fs.writeFileSync(tmp, bytes);
  fs.renameSync(tmp, SIM_WASM_PATH);
  return true;
}

/**
 * The compiled module from the built file (synchronous, so worker threads can use it at start-up),
 * or null when it is missing or stale or this runtime lacks WebAssembly SIMD — callers then keep
 * the JavaScript kernels.
 */
export function loadSimKernels(): WebAssembly.Module | null {
  try {
    if (fs.statSync(SIM_WASM_PATH).mtimeMs < fs.statSync(SIM_WAT_PATH).mtimeMs) return null;
    return new WebAssembly.Module(fs.readFileSync(SIM_WASM_PATH));
  } catch {
    return null;
  }
}

/** Threads per statevector layer when the host does not say: the product's machines have two cores. */
export const DEFAULT_SIM_THREADS = 2;

let backend: LayerBackend | null | undefined;
/**
 * One backend per process (thread) over the built module, or undefined (JS kernels) when it is
 * missing. Each layer of a state of 16 qubits or more is split over `threads` threads (the
 * caller plus worker threads started on first use: parallel-wasm.ts); the first call fixes it.
 */
export function simKernelsBackend(threads: number = DEFAULT_SIM_THREADS): LayerBackend | undefined {
  if (backend === undefined) {
    const m = loadSimKernels();
    backend = m ? createParallelWasmBackend(m, { threads }) : null;
  }
  return backend ?? undefined;
}
