import type { CompactNetwork } from '../network/types';
import type { Rng } from '../random';
import { mirrorToward } from './mirror';

/**
 * Partition crossover for max-cut (after the partition crossover of Whitley, Hains & Howe 2009
 * for the travelling salesman, and Tinós, Whitley & Chicano 2015, "Partition crossover for
 * pseudo-Boolean optimization", FOGA XIII [details from memory]; on 2D spin glasses the same
 * cut-and-paste of regions where two states differ is the cluster move of Houdayer 2001, "A
 * cluster Monte Carlo algorithm for 2-dimensional spin glasses").
 * Two assignments a and b differ on a set D of depots. D falls apart into components (connected
 * through lanes with both ends in D). A lane from a component C leaves D, where a and b agree, so
 * copying b's sides onto a within C changes the cut by a gain that depends on C alone, and the
 * components can be chosen independently: the child takes b's sides exactly on the components
 * where that gains (ties at random), which is the best of all 2^components mixes of the parents,
 * never worse than a and never worse than b. Useful where D breaks into many pieces (sparse
 * networks, parents close to each other); on a dense network D is one piece and the child is
 * simply the better parent.
 * b is mirrored first when that makes D smaller (mirror.ts).
 * a, b, out: Int8Array // 0/1 per depot; depots outside `free` keep a's value
 */
export interface CrossoverResult {
  /** Depots in D (after mirroring). */
  distance: number;
  /** Connected pieces of D. */
  components: number;
  /** Cut of `out` minus cut of a (≥ 0). */
  gain: number;
}

export interface PartitionCrossover {
  cross(a: Int8Array, b: Int8Array, out: Int8Array, rng: Rng): CrossoverResult;
}

/** Work arrays sized for `net` once, reused by every crossing (no allocation per call). */
export function createPartitionCrossover(net: CompactNetwork, free: Int32Array, mirrorable: boolean): PartitionCrossover {
  const n = net.n;
  const { adjStart, adjIndex, adjWeight } = net;
  const component = new Int32Array(n); // −1 = not in D, else the component's index
  const queue = new Int32Array(n);
  // Per component: its gain, and whether the child takes b's sides there (grown together).
  let gains = new Float64Array(64);
  let take = new Uint8Array(64);
  return {
    cross(a, b, out, rng) {
      const mirror = mirrorToward(a, b, free, mirrorable);
      out.set(a);
      component.fill(-1);
      const inD = 1 << 30; // marks "in D, not yet visited"
      let distance = 0;
      for (let t = 0; t < free.length; t++) {
        const v = free[t];
        if (a[v] !== (b[v] ^ mirror)) {
          component[v] = inD;
          distance++;
        }
      }
      let components = 0;
      for (let t = 0; t < free.length; t++) {
        const root = free[t];
        if (component[root] !== inD) continue;
        if (components === gains.length) {
          const grownGains = new Float64Array(2 * gains.length);
          grownGains.set(gains);
          gains = grownGains;
          take = new Uint8Array(2 * take.length);
        }
        const c = components++;
        let gain = 0, head = 0, tail = 0;
        component[root] = c;
        queue[tail++] = root;
        while (head < tail) {
          const u = queue[head++];
          for (let p = adjStart[u]; p < adjStart[u + 1]; p++) {
            const x = adjIndex[p];
            const cx = component[x];
            if (cx === inD) {
              component[x] = c;
              queue[tail++] = x;
            } else if (cx < 0) {
              // A lane leaving D: copying b's side of u flips whether it is cut.
              gain += a[u] === a[x] ? adjWeight[p] : -adjWeight[p];
            }
          }
        }
        gains[c] = gain;
      }
      let total = 0;
      for (let c = 0; c < components; c++) {
        const g = gains[c];
        take[c] = g > 1e-9 || (g > -1e-9 && rng.int(2) === 1) ? 1 : 0;
        if (take[c] === 1 && g > 0) total += g;
      }
      for (let t = 0; t < free.length; t++) {
        const v = free[t];
        const c = component[v];
        if (c >= 0 && take[c] === 1) out[v] = b[v] ^ mirror;
      }
      return { distance, components, gain: total };
    },
  };
}
