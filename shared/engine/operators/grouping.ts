/**
 * Qubit-wise commuting (QWC) groups: strings that agree letter by letter wherever both act
 * (I matches anything) share one measurement basis, so one batch of shots serves them all.
 * Groups come from a greedy colouring of the "does not commute qubit-wise" graph, largest
 * degree first (Welsh & Powell order) — common practice for measurement reduction.
 */
import type { PauliSum } from './types';

/** True when a and b carry the same letter on every qubit where neither is I. */
export function qubitWiseCommute(a: string, b: string): boolean {
  if (a.length !== b.length) throw new RangeError(`Pauli strings "${a}" and "${b}" have different lengths`);
  for (let q = 0; q < a.length; q++) {
    const x = a.charCodeAt(q), y = b.charCodeAt(q);
    if (x !== y && x !== 73 /* I */ && y !== 73) return false;
  }
  return true;
}

export interface QubitWiseGroups {
  /** Term indices (into p.terms) per group; every term lies in exactly one group. */
  groups: number[][];
  /** Per group: the measurement letter per qubit, I where no term of the group acts. */
  basis: string[];
}

export function groupQubitWise(p: PauliSum): QubitWiseGroups {
  const T = p.terms.length;
  // Strings as bit masks (n ≤ 30): x = qubits with X or Y, z = qubits with Z or Y. Two strings
  // clash qubit-wise where both act and the letters differ: (a.x|a.z) & (b.x|b.z) & ((a.x^b.x)|(a.z^b.z)).
  const useMasks = p.numQubits <= 30;
  const xs = new Int32Array(T), zs = new Int32Array(T);
  let allDiagonal = true;
  for (let k = 0; k < T; k++) {
    const s = p.terms[k].letters;
    if (s.length !== p.numQubits) throw new RangeError(`Pauli string "${s}" must have ${p.numQubits} letters`);
    if (!useMasks) continue;
    for (let q = 0; q < s.length; q++) {
      const c = s[q];
      if (c === 'X' || c === 'Y') xs[k] |= 1 << q;
      if (c === 'Z' || c === 'Y') zs[k] |= 1 << q;
    }
    if (xs[k] !== 0) allDiagonal = false;
  }
  if (useMasks && allDiagonal) {
    // Only I and Z: everything is measured in the Z basis at once.
    if (T === 0) return { groups: [], basis: [] };
    let support = 0;
    for (let k = 0; k < T; k++) support |= zs[k];
    let basis = '';
    for (let q = 0; q < p.numQubits; q++) basis += (support >>> q) & 1 ? 'Z' : 'I';
    return { groups: [Array.from({ length: T }, (_, i) => i)], basis: [basis] };
  }
  const conflicts: number[][] = Array.from({ length: T }, () => []);
  for (let i = 0; i < T; i++) {
    for (let j = i + 1; j < T; j++) {
      const clash = useMasks
        ? ((xs[i] | zs[i]) & (xs[j] | zs[j]) & ((xs[i] ^ xs[j]) | (zs[i] ^ zs[j]))) !== 0
        : !qubitWiseCommute(p.terms[i].letters, p.terms[j].letters);
      if (clash) {
        conflicts[i].push(j);
        conflicts[j].push(i);
      }
    }
  }
  const order = Array.from({ length: T }, (_, i) => i).sort((a, b) => conflicts[b].length - conflicts[a].length || a - b);
  const colour = new Int32Array(T).fill(-1);
  let colours = 0;
  const used: number[] = [];
  for (const v of order) {
    for (const u of conflicts[v]) if (colour[u] >= 0) used[colour[u]] = v + 1; // mark with v+1: no clearing needed
    let c = 0;
    while (c < colours && used[c] === v + 1) c++;
    colour[v] = c;
    if (c === colours) colours++;
  }
  const groups: number[][] = Array.from({ length: colours }, () => []);
  for (let i = 0; i < T; i++) groups[colour[i]].push(i);
  const basis = groups.map((g) => {
    const letters = 'I'.repeat(p.numQubits).split('');
    for (const k of g) {
      const s = p.terms[k].letters;
      for (let q = 0; q < s.length; q++) if (s[q] !== 'I') letters[q] = s[q];
    }
    return letters.join('');
  });
  return { groups, basis };
}
