import type { IsingOperator } from '../../../shared/engine/operators/types';

/** Max-cut operator of an unweighted graph: H = Σ_(ij∈E) (Z_i Z_j − 1)/2 (J = ½ per edge). */
export function maxcutOperator(n: number, edges: [number, number][], linear?: number[]): IsingOperator {
  return {
    numQubits: n,
    offset: -edges.length / 2,
    linear: Float64Array.from(linear ?? new Array(n).fill(0)),
    quadI: Int32Array.from(edges.map((e) => e[0])),
    quadJ: Int32Array.from(edges.map((e) => e[1])),
    quadCoeff: new Float64Array(edges.length).fill(0.5),
  };
}

export const path = (n: number): [number, number][] => Array.from({ length: n - 1 }, (_, i) => [i, i + 1]);
export const ring = (n: number): [number, number][] => [...path(n), [0, n - 1]];
export function complete(n: number): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) out.push([i, j]);
  return out;
}
