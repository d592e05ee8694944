/**
 * The transverse mixer exp(−iβ Σ_j X_j) and the QAOA layer built on it, applied in the Hadamard
 * basis (kernels and the derivation in hadamard-kernels.ts): transform, weight phase, transform.
 * Pass plan with lowBits = L and g = tileBits − runBits high qubits per tile sweep:
 *   1. low sweep: cost phase (QAOA layer) + transform on qubits 0…L−1;
 *   2. tile sweeps over the high groups G1 … Gm−1: transform;
 *   3. tile sweep over Gm: transform, weight phase, transform;
 *   4. tile sweeps over Gm−1 … G1, then the low sweep: transform.
 * 2m + 1 passes (m = ⌈(n − L)/g⌉; 5 at n = 19…24 with the defaults, 1 for n ≤ L); each pass is
 * a handful of adds per double instead of the rotation layer's complex products per qubit.
 * Equal to gates.applyTransverseMixer / applyQaoaLayer up to round-off (the test oracle).
 */
import type { StateVector } from './state';
import { checkDiagonal, DEFAULT_BLOCKING, phaseTables, type Diagonal, type LayerBlocking } from './gates';
import { phaseRange, tileCount } from './layer-kernels';
import { whtHighSweep, whtLowSweep } from './hadamard-kernels';

/** One pass of the plan: a low sweep or a tile sweep over qubits lo…hi−1; `middle` = with the weight phase. */
export type MixerPass =
  | { kind: 'low'; low: number; middle: boolean; phase: boolean }
  | { kind: 'high'; lo: number; hi: number; run: number; middle: boolean };

export function hadamardMixerPlan(n: number, blocking: LayerBlocking = DEFAULT_BLOCKING): MixerPass[] {
  const low = Math.min(n, blocking.lowBits);
  if (low === n) return [{ kind: 'low', low, middle: true, phase: true }];
  const run = Math.min(blocking.runBits, low);
  const g = Math.max(1, blocking.tileBits - run);
  const groups: [number, number][] = [];
  for (let lo = low; lo < n; lo += g) groups.push([lo, Math.min(n, lo + g)]);
  const plan: MixerPass[] = [{ kind: 'low', low, middle: false, phase: true }];
  groups.forEach(([lo, hi], k) => plan.push({ kind: 'high', lo, hi, run, middle: k === groups.length - 1 }));
  for (let k = groups.length - 2; k >= 0; k--) plan.push({ kind: 'high', lo: groups[k][0], hi: groups[k][1], run, middle: false });
  plan.push({ kind: 'low', low, middle: false, phase: false });
  return plan;
}

/** wtab[2w], wtab[2w+1] = 2^{−n}·cos(β(n−2w)), 2^{−n}·sin(β(n−2w)) for w = 0…n. */
export function weightPhaseTable(n: number, beta: number): Float64Array {
  const t = new Float64Array(2 * (n + 1)), scale = 2 ** -n;
  for (let w = 0; w <= n; w++) {
    t[2 * w] = scale * Math.cos(beta * (n - 2 * w));
    t[2 * w + 1] = scale * Math.sin(beta * (n - 2 * w));
  }
  return t;
}

/** Largest scratch (doubles) any tile sweep of the plan needs. */
export function planScratchDoubles(plan: MixerPass[]): number {
  let need = 0;
  for (const p of plan) if (p.kind === 'high') need = Math.max(need, 2 * 2 ** (p.run + p.hi - p.lo));
  return need;
}

function mixer(s: StateVector, beta: number, phase: { diag: Diagonal; gamma: number } | null, blocking: LayerBlocking): void {
  const a = s.amps, n = s.numQubits, dim = a.length >> 1;
  const wtab = weightPhaseTable(n, beta);
  const plan = hadamardMixerPlan(n, blocking);
  const table = phase ? phaseTables(phase.diag, phase.gamma) : null;
  const pre = phase ? (start: number, end: number) => phaseRange(a, phase.diag, phase.gamma, start, end, table) : null;
  const scratch = new Float64Array(planScratchDoubles(plan));
  for (const p of plan) {
    if (p.kind === 'low') whtLowSweep(a, p.low, p.middle ? wtab : null, p.phase ? pre : null, 0, dim / 2 ** p.low);
    else whtHighSweep(a, n, p.lo, p.hi, p.run, p.middle ? wtab : null, scratch, 0, tileCount(n, p.lo, p.hi, p.run));
  }
}

/** exp(−iβ Σ_j X_j) in the Hadamard basis (same result as gates.applyTransverseMixer). */
export function applyTransverseMixerHadamard(s: StateVector, beta: number, blocking: LayerBlocking = DEFAULT_BLOCKING): void {
  mixer(s, beta, null, blocking);
}

/** One QAOA layer e^{−iβΣX} e^{−iγ·diag}, cost phase fused into the first pass (same result as gates.applyQaoaLayer). */
export function applyQaoaLayerHadamard(
  s: StateVector, diag: Diagonal, gamma: number, beta: number, blocking: LayerBlocking = DEFAULT_BLOCKING,
): void {
  checkDiagonal(s, diag);
  mixer(s, beta, { diag, gamma }, blocking);
}
