/**
 * Optional faster layer kernels injected through StateOptions.kernels (e.g. the WebAssembly
 * ones of wasm-kernels.ts, whose bytes the server/CLI/tests load and pass in: the engine does no
 * I/O). A backend allocates the states it can work on; for any other state, or any call it
 * cannot serve, it returns false and the caller runs the JavaScript kernels (gates.ts), which
 * stay the reference. Shapes: amps = 2·2ⁿ interleaved re,im (state.ts).
 */
import type { DiagonalLevels } from './layer-kernels';

export interface LayerBackend {
  readonly name: string;
  /** Amplitudes (zeroed) for an n-qubit state where the kernels reach them, or null (then ordinary allocation). */
  allocate(numQubits: number): Float64Array | null;
  /** exp(−iβΣX)·exp(−iγ·diag) on s; false when s was not allocated here (caller falls back). */
  applyQaoaLayer(s: { numQubits: number; amps: Float64Array }, diag: Float64Array | DiagonalLevels, gamma: number, beta: number): boolean;
  /** exp(−iβΣX) on s; false as above. */
  applyTransverseMixer(s: { numQubits: number; amps: Float64Array }, beta: number): boolean;
}
