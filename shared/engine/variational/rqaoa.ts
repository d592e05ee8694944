import type { IsingOperator } from '../operators/types';
import { isingDiagonal } from '../statevector/diagonal';
import { eliminateSpins, type SpinRelation } from './ising-eliminate';
import { level1Coefficients, level1Correlations } from './level1';
import { bestBeta, optimiseLevel1Angles } from './level1-angles';
import { level1Graph, type Level1Graph } from './level1-graph';

/**
 * Recursive QAOA at level 1 (Bravyi, Kliesch, Koenig & Tang, "Obstacles to variational quantum
 * optimization from symmetry protection", PRL 125, 260505 (2020)) on any Ising operator.
 *
 * Each round optimises (γ, β) on the closed form, reads ⟨Z_uZ_v⟩ for every coupling (and ⟨Z_u⟩
 * when fields are present), imposes the strongest one — s_u = sign⟨Z_uZ_v⟩·s_v or s_u = sign⟨Z_u⟩
 * — and eliminates u, until at most `stopAt` spins remain; those are solved exactly (2^stopAt
 * diagonal) and the relations are replayed backwards. Spins without any term left are fixed to
 * +1 on the way (they no longer change the energy). Only couplings of the current operator are
 * candidates (correlations of uncoupled pairs are not read), the usual reading of the method.
 *
 * Several eliminations per round (large operators): candidates are taken by decreasing |corr|;
 * one is taken only when neither of its spins lies in the light cone — the spins and their
 * neighbours — of one taken before in the round. Level-1 correlations depend only on the terms
 * at those spins, so each taken correlation is exactly what a one-per-round run would read at
 * the round's angles; what batching gives up is re-optimising the angles between them. Later
 * rounds warm-start γ from the previous round.
 */
export interface RqaoaOptions {
  /** Stop recursing at this many spins and solve the rest exactly (1…20). */
  stopAt: number;
  /**
   * Eliminations per round: max(1, ceil(batchFraction · spins left)), within the light-cone
   * rule. 0 = one per round, as in the paper.
   */
  batchFraction: number;
  /**
   * Checked between rounds; true makes every later round take a quarter of the spins left (no
   * cone rule) and reuse the previous round's γ (one pass over the graph instead of an angle
   * search: the reduced operator densifies as spins merge, so searches get dearer late).
   */
  hurry?: () => boolean;
  /** Checked between rounds; true (time is up or the run was cancelled): take every relation one pass allows. */
  overdue?: () => boolean;
  onRound?: (round: RqaoaRound) => void;
}

export interface RqaoaElimination {
  /** Qubit of the ORIGINAL operator that was eliminated. */
  qubit: number;
  /** Original qubit it follows, or −1 when fixed to `sign`. */
  partner: number;
  sign: 1 | -1;
  /** The correlation read (⟨Z_uZ_v⟩ or ⟨Z_u⟩); 0 for spins dropped without terms. */
  correlation: number;
  round: number;
}

export interface RqaoaRound {
  round: number;
  spins: number;
  gamma: number;
  beta: number;
  energy: number;
  eliminated: number;
}

export interface RqaoaOutcome {
  /** Spin per original qubit, ±1. */
  spins: Int8Array;
  /** Energy of `spins` on the original operator. */
  energy: number;
  /** First round (whole operator): angles [γ, β] and ⟨H⟩ there. */
  firstParams: [number, number];
  firstEnergy: number;
  rounds: number;
  eliminations: RqaoaElimination[];
  /** Closed-form passes over the graph in all rounds. */
  evaluations: number;
  /** Spins solved exactly at the end. */
  remainder: number;
}

/** Largest exact remainder (a 2^20 diagonal is 8 MiB). */
export const RQAOA_MAX_REMAINDER = 20;

/**
 * The batching rule both rqaoa and the block merge use: one elimination per round up to 300
 * spins (as in the paper), 1 % of the spins left per round above (measured on G11 and G14,
 * 800 depots: 1 % per round costs 0.2–1.1 % of the cut against one per round at about a fifth of the
 * time; docs/benchmarks.md).
 */
export function defaultBatchFraction(spins: number): number {
  return spins <= 300 ? 0 : 0.01;
}

/** Spins (±1) → bits (s = −1 ⇔ bit 1), as encodings decode them. */
export function bitsOfSpins(spins: ArrayLike<number>): Uint8Array {
  return Uint8Array.from(spins as ArrayLike<number>, (s) => (s < 0 ? 1 : 0));
}

/** H(s) for a spin assignment. */
export function isingEnergy(op: IsingOperator, s: ArrayLike<number>): number {
  let e = op.offset;
  for (let q = 0; q < op.numQubits; q++) e += op.linear[q] * s[q];
  for (let t = 0; t < op.quadCoeff.length; t++) e += op.quadCoeff[t] * s[op.quadI[t]] * s[op.quadJ[t]];
  return e;
}

interface Candidate { strength: number; corr: number; u: number; v: number }

/** Strongest correlations first, thinned by the light-cone rule (see the file comment). */
function pickRelations(g: Level1Graph, z: Float64Array, zz: Float64Array, want: number, coneRule: boolean): (SpinRelation & { correlation: number })[] {
  const { n, op, start, nbr } = g;
  const cands: Candidate[] = [];
  for (let t = 0; t < zz.length; t++) cands.push({ strength: Math.abs(zz[t]), corr: zz[t], u: op.quadI[t], v: op.quadJ[t] });
  for (let u = 0; u < n; u++) if (op.linear[u] !== 0) cands.push({ strength: Math.abs(z[u]), corr: z[u], u, v: -1 });
  cands.sort((a, b) => b.strength - a.strength || a.u - b.u || a.v - b.v);
  const blocked = new Uint8Array(n), used = new Uint8Array(n);
  const deg = (u: number) => start[u + 1] - start[u];
  const out: (SpinRelation & { correlation: number })[] = [];
  for (const c of cands) {
    if (out.length >= want) break;
    if (used[c.u] || (c.v >= 0 && used[c.v])) continue;
    if (coneRule && (blocked[c.u] || (c.v >= 0 && blocked[c.v]))) continue;
    // Eliminate the end with fewer couplings (cheaper substitution); the other stays.
    let q = c.u, partner = c.v;
    if (partner >= 0 && deg(partner) < deg(q)) { q = c.v; partner = c.u; }
    out.push({ qubit: q, partner, sign: c.corr < 0 ? -1 : 1, correlation: c.corr });
    used[q] = 1;
    if (partner >= 0) used[partner] = 1;
    for (const x of partner >= 0 ? [c.u, c.v] : [c.u]) {
      blocked[x] = 1;
      for (let y = start[x]; y < start[x + 1]; y++) blocked[nbr[y]] = 1;
    }
  }
  return out;
}

/**
 * Overdue (time is up): impose the strongest correlations along a maximum-|correlation| spanning
 * forest (Kruskal; ⟨Z_u⟩ ties a spin to a virtual fixed spin), so one pass settles every spin
 * but one per component. Each relation is re-rooted onto its component's root (or fixed), so no
 * relation chains: eliminateSpins takes them in one call.
 */
function forestRelations(g: Level1Graph, z: Float64Array, zz: Float64Array): (SpinRelation & { correlation: number })[] {
  const { n, op } = g;
  const ground = n;
  const parent = Int32Array.from({ length: n + 1 }, (_, i) => i);
  const parity = new Int8Array(n + 1).fill(1); // sign of a spin relative to its parent
  const find = (u: number): number => {
    let root = u, sgn = 1;
    while (parent[root] !== root) { sgn *= parity[root]; root = parent[root]; }
    // Path compression keeping each spin's sign relative to the root.
    for (let x = u, sx = sgn; parent[x] !== x; ) { const next = parent[x], sn = sx * parity[x]; parent[x] = root; parity[x] = sx as 1 | -1; x = next; sx = sn; }
    return root;
  };
  const signToRoot = (u: number) => { find(u); return u === parent[u] ? 1 : parity[u]; };
  const cands: Candidate[] = [];
  for (let t = 0; t < zz.length; t++) cands.push({ strength: Math.abs(zz[t]), corr: zz[t], u: op.quadI[t], v: op.quadJ[t] });
  for (let u = 0; u < n; u++) if (op.linear[u] !== 0) cands.push({ strength: Math.abs(z[u]), corr: z[u], u, v: ground });
  cands.sort((a, b) => b.strength - a.strength || a.u - b.u || a.v - b.v);
  const used = new Map<number, number>(); // spin → the correlation that settled it
  for (const c of cands) {
    const ru = find(c.u), rv = find(c.v);
    if (ru === rv) continue;
    // s_u = sign·s_v ⇒ root_u = sign·(s_u/root_u)·(s_v/root_v)·root_v; the ground stays a root.
    const rel = ((c.corr < 0 ? -1 : 1) * signToRoot(c.u) * signToRoot(c.v)) as 1 | -1;
    if (ru === ground) { parent[rv] = ru; parity[rv] = rel; used.set(rv, c.corr); }
    else { parent[ru] = rv; parity[ru] = rel; used.set(ru, c.corr); }
  }
  const out: (SpinRelation & { correlation: number })[] = [];
  for (let u = 0; u < n; u++) {
    const root = find(u);
    if (root === u) continue;
    const sgn = signToRoot(u) as 1 | -1;
    out.push({ qubit: u, partner: root === ground ? -1 : root, sign: sgn, correlation: used.get(u) ?? 0 });
  }
  return out;
}

/** Lowest-energy state of a small operator by its full diagonal (spins, ±1). */
function solveExactly(op: IsingOperator): Int8Array {
  const s = new Int8Array(op.numQubits).fill(1);
  if (op.numQubits === 0) return s;
  const diag = isingDiagonal(op);
  let best = 0;
  for (let x = 1; x < diag.length; x++) if (diag[x] < diag[best]) best = x;
  for (let q = 0; q < op.numQubits; q++) s[q] = (best >>> q) & 1 ? -1 : 1;
  return s;
}

export function runRqaoa(original: IsingOperator, opts: RqaoaOptions): RqaoaOutcome {
  if (!(opts.stopAt >= 1 && opts.stopAt <= RQAOA_MAX_REMAINDER)) throw new RangeError(`stopAt must be 1…${RQAOA_MAX_REMAINDER} spins (got ${opts.stopAt})`);
  let op = original;
  let orig: Int32Array = Int32Array.from({ length: original.numQubits }, (_, i) => i); // current index → original
  const eliminations: RqaoaElimination[] = [];
  let round = 0, evaluations = 0, gammaPrev: number | undefined;
  // The first round's angles on the whole operator are reported even when no round is needed.
  const first = original.numQubits > 0 ? optimiseLevel1Angles(level1Graph(original)) : null;
  if (first) evaluations += first.evaluations;
  const firstParams: [number, number] = first ? [first.gamma, first.beta] : [0, 0];
  const firstEnergy = first ? first.energy : original.offset;
  for (;;) {
    const g = level1Graph(op);
    // Spins with no term left cannot change the energy: fix them and go on.
    const idle: SpinRelation[] = [];
    for (let u = 0; u < op.numQubits; u++) if (g.start[u + 1] === g.start[u] && op.linear[u] === 0) idle.push({ qubit: u, partner: -1, sign: 1 });
    if (idle.length > 0 && op.numQubits > opts.stopAt) {
      for (const r of idle) eliminations.push({ qubit: orig[r.qubit], partner: -1, sign: 1, correlation: 0, round });
      const red = eliminateSpins(op, idle);
      orig = remap(orig, red.newIndex, red.op.numQubits);
      op = red.op;
      continue;
    }
    if (op.numQubits <= opts.stopAt) break;
    round++;
    const hurry = opts.hurry?.() ?? false;
    const overdue = opts.overdue?.() ?? false;
    // Round 1 on an operator that lost only idle spins has the same closed form as the whole.
    const reuse = round === 1 && first !== null && op.quadCoeff.length === original.quadCoeff.length;
    const angles = reuse ? { ...first, coefficients: level1Coefficients(g, first.gamma) }
      : hurry && gammaPrev !== undefined ? atGamma(g, gammaPrev)
        : optimiseLevel1Angles(g, gammaPrev === undefined ? {} : { aroundGamma: gammaPrev });
    evaluations += reuse ? 1 : angles.evaluations;
    gammaPrev = angles.gamma;
    const { z, zz } = level1Correlations(angles.coefficients, angles.beta);
    const room = op.numQubits - opts.stopAt;
    const want = Math.min(room, overdue ? room : hurry ? Math.max(1, Math.ceil(op.numQubits / 4)) : Math.max(1, Math.ceil(opts.batchFraction * op.numQubits)));
    const picked = overdue ? forestRelations(g, z, zz) : pickRelations(g, z, zz, want, !hurry);
    for (const r of picked) eliminations.push({ qubit: orig[r.qubit], partner: r.partner >= 0 ? orig[r.partner] : -1, sign: r.sign, correlation: r.correlation, round });
    opts.onRound?.({ round, spins: op.numQubits, gamma: angles.gamma, beta: angles.beta, energy: angles.energy, eliminated: picked.length });
    const red = eliminateSpins(op, picked);
    orig = remap(orig, red.newIndex, red.op.numQubits);
    op = red.op;
  }
  const spins = new Int8Array(original.numQubits);
  const rest = solveExactly(op);
  for (let q = 0; q < op.numQubits; q++) spins[orig[q]] = rest[q];
  for (let i = eliminations.length - 1; i >= 0; i--) {
    const e = eliminations[i];
    spins[e.qubit] = e.partner < 0 ? e.sign : e.sign * spins[e.partner];
  }
  return { spins, energy: isingEnergy(original, spins), firstParams, firstEnergy, rounds: round, eliminations, evaluations, remainder: op.numQubits };
}

/** One pass at a given γ with its best β (late rounds in a hurry). */
function atGamma(g: Level1Graph, gamma: number) {
  const coefficients = level1Coefficients(g, gamma);
  const { beta, energy } = bestBeta(coefficients);
  return { gamma, beta, energy, coefficients, evaluations: 1 };
}

function remap(orig: Int32Array, newIndex: Int32Array, size: number): Int32Array {
  const out = new Int32Array(size);
  for (let q = 0; q < newIndex.length; q++) if (newIndex[q] >= 0) out[newIndex[q]] = orig[q];
  return out;
}
