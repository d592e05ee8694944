import { applyCzChain, applyRotationLayer, applyX } from '../statevector/gates';
import type { StateOptions } from '../statevector/state';
import { resetToZero } from './reset';
import type { Ansatz } from './types';

export interface LadderAnsatzOptions {
  numQubits: number;
  /** Entangling layers (rungs); each is preceded by a rotation layer, one more closes it. */
  layers: number;
  /** CZ between neighbours on a line (q, q+1) or a ring (adds (n−1, 0)). Default 'ring'. */
  entangler?: 'line' | 'ring';
  /** Start from this basis state instead of |0…0⟩ (bit q set ⇒ X on qubit q). */
  initialBits?: ArrayLike<number>;
  stateOptions?: StateOptions;
}

/**
 * "Ladder": the hardware-efficient layered circuit — per rung a rotation layer R_Y(θ)
 * then R_Z(φ) on every qubit and a CZ on every neighbouring pair, and one final rotation layer.
 * Parameters: rung by rung, [θ_0 … θ_(n−1), φ_0 … φ_(n−1)], 2n(layers + 1) in all. Each
 * parameter drives one rotation e^{−iθσ/2}, so the parameter-shift rule is exact for all.
 */
export function createLadderAnsatz(opts: LadderAnsatzOptions): Ansatz {
  const { numQubits: n, layers } = opts;
  const ring = (opts.entangler ?? 'ring') === 'ring' && n > 2;
  const pairList: number[] = [];
  for (let q = 0; q + 1 < n; q++) pairList.push(q, q + 1);
  if (ring) pairList.push(n - 1, 0);
  const pairs = Int32Array.from(pairList);
  const numParams = 2 * n * (layers + 1);
  const names: string[] = [];
  for (let l = 0; l <= layers; l++) {
    for (let q = 0; q < n; q++) names.push(`θ${l}.${q}`);
    for (let q = 0; q < n; q++) names.push(`φ${l}.${q}`);
  }
  const angles = new Float64Array(n);
  return {
    name: 'ladder',
    numQubits: n,
    numParams,
    paramNames: names,
    gradientRule: names.map(() => 'shift' as const),
    prepare(params, into) {
      const s = resetToZero(n, into, opts.stateOptions);
      if (opts.initialBits) for (let q = 0; q < n; q++) if (opts.initialBits[q]) applyX(s, q);
      for (let l = 0; l <= layers; l++) {
        const base = 2 * n * l;
        for (let q = 0; q < n; q++) angles[q] = params[base + q];
        applyRotationLayer(s, 'y', angles);
        for (let q = 0; q < n; q++) angles[q] = params[base + n + q];
        applyRotationLayer(s, 'z', angles);
        if (l < layers && pairs.length > 0) applyCzChain(s, pairs);
      }
      return s;
    },
  };
}
