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
  const conflicts: number[][] = Array.from({ length: T }, () => []);
  for (let i = 0; i < T; i++) {
    for (let j = i + 1; j < T; j++) {
      if (!qubitWiseCommute(p.terms[i].letters, p.terms[j].letters)) {
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
