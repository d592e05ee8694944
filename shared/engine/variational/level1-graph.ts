import type { IsingOperator } from '../operators/types';

/**
 * The interaction graph of an Ising operator as the level-1 QAOA closed form reads it
 * (shared/engine/variational/level1.ts). Structure only — nothing here depends on the angles.
 *
 * Shapes (n = numQubits, T = number of quadratic terms):
 * - start: Int32Array(n + 1), CSR offsets; the couplings of qubit u are entries
 *   start[u] … start[u+1]−1 of `nbr` (the other qubit) and `term` (index into op.quad*).
 * - triStart: Int32Array(T + 1); for term t = (u, v) the common neighbours k of u and v are
 *   listed in triA/triB[triStart[t] … triStart[t+1]−1] as the terms (u, k) and (v, k)
 *   (in either order — the closed form only uses J_uk ± J_vk under a cosine, which is even).
 *
 * Common neighbours are listed once per triangle by the degree-ordered method (each lane is
 * handled by its higher-degree end, which walks the lower-degree end's list): O(m·√m) at
 * worst, O(Σ min(deg u, deg v)) in general — common practice for triangle listing.
 */
export interface Level1Graph {
  n: number;
  op: IsingOperator;
  start: Int32Array;
  nbr: Int32Array;
  term: Int32Array;
  triStart: Int32Array;
  triA: Int32Array;
  triB: Int32Array;
}

export function level1Graph(op: IsingOperator): Level1Graph {
  const n = op.numQubits, T = op.quadCoeff.length;
  const start = new Int32Array(n + 1);
  for (let t = 0; t < T; t++) {
    const i = op.quadI[t], j = op.quadJ[t];
    if (i === j || i < 0 || j < 0 || i >= n || j >= n) throw new RangeError(`quadratic term ${t} couples ${i} and ${j}; need two different qubits in 0…${n - 1}`);
    start[i + 1]++;
    start[j + 1]++;
  }
  for (let u = 0; u < n; u++) start[u + 1] += start[u];
  const fill = start.slice(0, n);
  const nbr = new Int32Array(2 * T), term = new Int32Array(2 * T);
  for (let t = 0; t < T; t++) {
    const i = op.quadI[t], j = op.quadJ[t];
    nbr[fill[i]] = j; term[fill[i]++] = t;
    nbr[fill[j]] = i; term[fill[j]++] = t;
  }
  const deg = (u: number) => start[u + 1] - start[u];
  // mark[k] = term (owner, k) + 1 while `owner` is being processed, else stale.
  const markTerm = new Int32Array(n), markOwner = new Int32Array(n).fill(-1);
  const hits: number[] = []; // triples (t, a, b)
  for (let owner = 0; owner < n; owner++) {
    for (let x = start[owner]; x < start[owner + 1]; x++) { markOwner[nbr[x]] = owner; markTerm[nbr[x]] = term[x]; }
    for (let x = start[owner]; x < start[owner + 1]; x++) {
      const v = nbr[x];
      if (deg(v) > deg(owner) || (deg(v) === deg(owner) && v > owner)) continue; // the other end owns it
      for (let y = start[v]; y < start[v + 1]; y++) {
        const k = nbr[y];
        if (k !== owner && markOwner[k] === owner) hits.push(term[x], markTerm[k], term[y]);
      }
    }
  }
  const triStart = new Int32Array(T + 1);
  for (let h = 0; h < hits.length; h += 3) triStart[hits[h] + 1]++;
  for (let t = 0; t < T; t++) triStart[t + 1] += triStart[t];
  const at = triStart.slice(0, T);
  const triA = new Int32Array(hits.length / 3), triB = new Int32Array(hits.length / 3);
  for (let h = 0; h < hits.length; h += 3) { triA[at[hits[h]]] = hits[h + 1]; triB[at[hits[h]]++] = hits[h + 2]; }
  return { n, op, start, nbr, term, triStart, triA, triB };
}
