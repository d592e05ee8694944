import type { IsingOperator } from '../operators/types';
import type { Level1Graph } from './level1-graph';

/**
 * Exact one-layer QAOA expectations for any size, without a statevector.
 *
 * State (the engine's convention, shared/engine/ansatz/qaoa.ts): |γ,β⟩ = e^{−iβΣX} e^{−iγC}|+⟩ⁿ
 * with C = −H and H = offset + Σ h_u Z_u + Σ J_uv Z_u Z_v (the encoding's operator). Then
 *   ⟨Z_u⟩     = −sin2β · sin(2γh_u) · Π_{k≠u} cos(2γJ_uk)
 *   ⟨Z_uZ_v⟩  = −½ sin4β · sin(2γJ_uv) · [cos(2γh_u) P_u + cos(2γh_v) P_v]
 *               −½ sin²2β · [cos(2γ(h_u+h_v)) P₊ − cos(2γ(h_u−h_v)) P₋]
 * with P_u = Π_{k≠u,v} cos(2γJ_uk) and P± = Π_{k≠u,v} cos(2γ(J_uk ± J_vk)) (Ozaeta, van Dam &
 * McMahon, "Expectation values from the single-layer quantum approximate optimization algorithm
 * on Ising problems", Quantum Sci. Technol. 7, 045036 (2022); without fields and weights it is
 * Wang, Hadfield, Jiang & Rieffel, PRA 97, 022304 (2018); signs written here for C = −H and
 * checked against the statevector in tests/unit/variational/level1.test.ts).
 *
 * So for a fixed γ every expectation is  sin2β·S + sin4β·T + sin²2β·Q  with S, T, Q depending
 * on γ only: `level1Coefficients` computes them once per γ and β costs O(1) per term after.
 *
 * Products are taken in log-magnitude with a sign count, so P_u without one factor and P± (a
 * product over N(u) ∪ N(v) where only the common neighbours differ from the P_u·P_v factors)
 * cost O(1) per lane plus O(1) per triangle: O(m + triangles) per γ instead of O(Σ deg²).
 */
export interface Level1Coefficients {
  gamma: number;
  /** ⟨Z_u⟩ = sin2β · zS[u]; length n. */
  zS: Float64Array;
  /** ⟨Z_uZ_v⟩ of term t = sin4β · zzT[t] + sin²2β · zzQ[t]; length T. */
  zzT: Float64Array;
  zzQ: Float64Array;
  /** ⟨H⟩ = offset + a·sin2β + b·sin4β + c·sin²2β. */
  offset: number;
  a: number;
  b: number;
  c: number;
}

/** Magnitudes below this count as this (a cosine is never exactly 0 in floating point anyway). */
const TINY = 1e-300;

export function level1Coefficients(g: Level1Graph, gamma: number): Level1Coefficients {
  const { n, op, start, term, triStart, triA, triB } = g;
  const T = op.quadCoeff.length;
  const J = op.quadCoeff, h = op.linear;
  const logAbs = new Float64Array(T), neg = new Uint8Array(T);
  for (let t = 0; t < T; t++) {
    const c = Math.cos(2 * gamma * J[t]);
    logAbs[t] = Math.log(Math.max(Math.abs(c), TINY));
    neg[t] = c < 0 ? 1 : 0;
  }
  const L = new Float64Array(n), N = new Int32Array(n);
  for (let u = 0; u < n; u++) {
    let s = 0, k = 0;
    for (let x = start[u]; x < start[u + 1]; x++) { s += logAbs[term[x]]; k += neg[term[x]]; }
    L[u] = s; N[u] = k;
  }
  const prod = (logSum: number, negCount: number) => ((negCount & 1) ? -1 : 1) * Math.exp(logSum);
  const zS = new Float64Array(n);
  let a = 0;
  for (let u = 0; u < n; u++) {
    if (h[u] === 0) continue;
    zS[u] = -Math.sin(2 * gamma * h[u]) * prod(L[u], N[u]);
    a += h[u] * zS[u];
  }
  const zzT = new Float64Array(T), zzQ = new Float64Array(T);
  let b = 0, c = 0;
  for (let t = 0; t < T; t++) {
    const u = op.quadI[t], v = op.quadJ[t];
    const lu = L[u] - logAbs[t], lv = L[v] - logAbs[t];
    const nu = N[u] - neg[t], nv = N[v] - neg[t];
    const pu = prod(lu, nu), pv = prod(lv, nv);
    zzT[t] = -0.5 * Math.sin(2 * gamma * J[t]) * (Math.cos(2 * gamma * h[u]) * pu + Math.cos(2 * gamma * h[v]) * pv);
    let lp = lu + lv, np = nu + nv, lm = lp, nm = np;
    for (let y = triStart[t]; y < triStart[t + 1]; y++) {
      const ta = triA[y], tb = triB[y];
      const base = logAbs[ta] + logAbs[tb], baseNeg = neg[ta] + neg[tb];
      const cp = Math.cos(2 * gamma * (J[ta] + J[tb])), cm = Math.cos(2 * gamma * (J[ta] - J[tb]));
      lp += Math.log(Math.max(Math.abs(cp), TINY)) - base; np += (cp < 0 ? 1 : 0) - baseNeg;
      lm += Math.log(Math.max(Math.abs(cm), TINY)) - base; nm += (cm < 0 ? 1 : 0) - baseNeg;
    }
    zzQ[t] = -0.5 * (Math.cos(2 * gamma * (h[u] + h[v])) * prod(lp, np) - Math.cos(2 * gamma * (h[u] - h[v])) * prod(lm, nm));
    b += J[t] * zzT[t];
    c += J[t] * zzQ[t];
  }
  return { gamma, zS, zzT, zzQ, offset: op.offset, a, b, c };
}

/** ⟨H⟩ at (γ of the coefficients, β). */
export function level1Energy(co: Level1Coefficients, beta: number): number {
  const s2 = Math.sin(2 * beta);
  return co.offset + co.a * s2 + co.b * Math.sin(4 * beta) + co.c * s2 * s2;
}

/** ⟨Z_u⟩ per qubit and ⟨Z_uZ_v⟩ per quadratic term at (γ of the coefficients, β). */
export function level1Correlations(co: Level1Coefficients, beta: number): { z: Float64Array; zz: Float64Array } {
  const s2 = Math.sin(2 * beta), s4 = Math.sin(4 * beta), sq = s2 * s2;
  const z = new Float64Array(co.zS.length), zz = new Float64Array(co.zzT.length);
  for (let u = 0; u < z.length; u++) z[u] = s2 * co.zS[u];
  for (let t = 0; t < zz.length; t++) zz[t] = s4 * co.zzT[t] + sq * co.zzQ[t];
  return { z, zz };
}

/** ⟨Z_uZ_v⟩ for a pair without a coupling (J_uv = 0: only the sin²2β part), O(deg u + deg v). */
export function uncoupledCorrelation(g: Level1Graph, gamma: number, beta: number, u: number, v: number): number {
  const { op, start, nbr, term } = g;
  const J = op.quadCoeff, h = op.linear;
  const ju = new Map<number, number>();
  for (let x = start[u]; x < start[u + 1]; x++) ju.set(nbr[x], J[term[x]]);
  let pp = 1, pm = 1;
  for (let x = start[v]; x < start[v + 1]; x++) {
    const k = nbr[x], a = ju.get(k) ?? 0, b = J[term[x]];
    ju.delete(k);
    pp *= Math.cos(2 * gamma * (a + b));
    pm *= Math.cos(2 * gamma * (a - b));
  }
  for (const a of ju.values()) { pp *= Math.cos(2 * gamma * a); pm *= Math.cos(2 * gamma * a); }
  const s2 = Math.sin(2 * beta);
  return -0.5 * s2 * s2 * (Math.cos(2 * gamma * (h[u] + h[v])) * pp - Math.cos(2 * gamma * (h[u] - h[v])) * pm);
}

/**
 * ⟨K⟩ in the same level-1 state for another diagonal operator K on the same qubits whose
 * (e.g. an encoding's value operator beside its energy); pairs without a coupling in the graph
 * are read by uncoupledCorrelation.
 */
export function level1ExpectationOf(g: Level1Graph, co: Level1Coefficients, beta: number, other: IsingOperator): number {
  const { z, zz } = level1Correlations(co, beta);
  const n = g.n, op = g.op;
  const termOf = new Map<number, number>();
  for (let t = 0; t < op.quadCoeff.length; t++) termOf.set(Math.min(op.quadI[t], op.quadJ[t]) * n + Math.max(op.quadI[t], op.quadJ[t]), t);
  let e = other.offset;
  for (let u = 0; u < n; u++) e += other.linear[u] * z[u];
  for (let t = 0; t < other.quadCoeff.length; t++) {
    if (other.quadCoeff[t] === 0) continue;
    const key = Math.min(other.quadI[t], other.quadJ[t]) * n + Math.max(other.quadI[t], other.quadJ[t]);
    const at = termOf.get(key);
    e += other.quadCoeff[t] * (at === undefined ? uncoupledCorrelation(g, co.gamma, beta, other.quadI[t], other.quadJ[t]) : zz[at]);
  }
  return e;
}
