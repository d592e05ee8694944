/**
 * Transverse-field Ising chain, periodic: H = −J Σ_i Z_iZ_{i+1} − h Σ_i X_i, and its ground energy
 * in closed form from Pfeuty, "The one-dimensional Ising model with a transverse field",
 * Ann. Phys. 57, 79 (1970): E0 = −Σ_k √(J² + h² − 2Jh cos k) over the even-parity momenta
 * k = ±π(2m−1)/N, m = 1…N/2 (as given in docs/references.md).
 */
import type { PauliSum } from '../../../shared/engine/operators/types';

export function tfimChain(N: number, J: number, h: number): PauliSum {
  const terms = [];
  for (let i = 0; i < N; i++) {
    const zz = 'I'.repeat(N).split('');
    zz[i] = 'Z';
    zz[(i + 1) % N] = 'Z';
    terms.push({ letters: zz.join(''), coeff: -J });
    const x = 'I'.repeat(N).split('');
    x[i] = 'X';
    terms.push({ letters: x.join(''), coeff: -h });
  }
  return { numQubits: N, offset: 0, terms };
}

export function pfeutyGroundEnergy(N: number, J: number, h: number): number {
  let e = 0;
  for (let m = 1; m <= N / 2; m++) {
    const k = (Math.PI * (2 * m - 1)) / N;
    e -= 2 * Math.sqrt(J * J + h * h - 2 * J * h * Math.cos(k)); // ±k give the same term
  }
  return e;
}
