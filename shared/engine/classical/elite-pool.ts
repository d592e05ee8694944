import type { Rng } from '../random';
import { mirrorToward } from './mirror';

/**
 * A small pool of good, distinct two-sided assignments and their recombination, for restarting
 * a local search from a mix of good solutions instead of a random jump (the memetic idea of
 * Wu & Hao 2012, "A memetic approach for the max-cut problem", PPSN XII [venue from memory]:
 * tabu search improves children of a pool's members). Our crossover: keep every depot both
 * parents put on the same side, draw the others at random. A cut and its mirror image (every
 * side swapped) are the same cut, so without pinned depots the second parent is mirrored first
 * when that makes the two agree on more depots.
 * With `minDistance` the pool also keeps its members apart (the quality-and-distance idea of
 * memetic max-cut searches, Wu & Hao 2012): a solution closer than that to a member may only
 * replace that member, and only when it is better, so one good region cannot fill the pool.
 * side: Int8Array // 0/1 per depot
 */
export interface ElitePool {
  /** Offers a solution: kept when the pool has room or it beats the worst member; duplicates (or mirrors) are refused. */
  admit(side: Int8Array, cut: number): void;
  readonly size: number;
  /** Member k's assignment (k < size; read-only for callers) and its cut. */
  member(k: number): Int8Array;
  cutOf(k: number): number;
  /** Writes a child of two distinct random members into `out` (free depots only; pinned ones keep out's value). False with < 2 members. */
  child(rng: Rng, free: Int32Array, mirrorable: boolean, out: Int8Array): boolean;
}

export function createElitePool(capacity: number, n: number, minDistance = 0): ElitePool {
  const sides: Int8Array[] = [];
  const cuts: number[] = [];
  /** Depots on different sides, or on the same side after mirroring one, whichever is fewer. */
  const distance = (a: Int8Array, b: Int8Array): number => {
    let d = 0;
    for (let i = 0; i < n; i++) if (a[i] !== b[i]) d++;
    return Math.min(d, n - d);
  };
  /** 0 = equal, 1 = mirror images, 2 = neither. */
  const relation = (a: Int8Array, b: Int8Array): number => {
    let same = true, mirror = true;
    for (let i = 0; i < n && (same || mirror); i++) {
      if (a[i] === b[i]) mirror = false;
      else same = false;
    }
    return same ? 0 : mirror ? 1 : 2;
  };
  return {
    get size() {
      return sides.length;
    },
    member: (k) => sides[k],
    cutOf: (k) => cuts[k],
    admit(side, cut) {
      if (!Number.isFinite(cut)) return;
      if (minDistance > 0) {
        let near = -1, nearest = Infinity;
        for (let k = 0; k < sides.length; k++) {
          const d = distance(sides[k], side);
          if (d < nearest) { nearest = d; near = k; }
        }
        if (nearest < minDistance) {
          if (cut > cuts[near]) {
            sides[near].set(side);
            cuts[near] = cut;
          }
          return;
        }
      }
      let worst = -1;
      for (let k = 0; k < sides.length; k++) {
        if (cuts[k] === cut && relation(sides[k], side) < 2) return;
        if (worst < 0 || cuts[k] < cuts[worst]) worst = k;
      }
      if (sides.length < capacity) {
        sides.push(side.slice());
        cuts.push(cut);
      } else if (worst >= 0 && cut > cuts[worst]) {
        sides[worst].set(side);
        cuts[worst] = cut;
      }
    },
    child(rng, free, mirrorable, out) {
      if (sides.length < 2) return false;
      const ia = rng.int(sides.length);
      let ib = rng.int(sides.length - 1);
      if (ib >= ia) ib++;
      const a = sides[ia], b = sides[ib];
      const flipB = mirrorToward(a, b, free, mirrorable);
      for (let t = 0; t < free.length; t++) {
        const v = free[t], bv = b[v] ^ flipB;
        out[v] = a[v] === bv ? a[v] : rng.int(2);
      }
      return true;
    },
  };
}
