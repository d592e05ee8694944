/**
 * Seeded pseudo-random numbers (one generator for the whole engine so every run is
 * reproducible from its seed). xoshiro128** (Blackman & Vigna, "Scrambled linear
 * pseudorandom number generators", ACM TOMS 2021), seeded through splitmix32.
 */
export interface Rng {
  /** Uniform in [0, 1). */
  next(): number;
  /** Uniform integer in [0, n). */
  int(n: number): number;
  /** Standard normal (Box–Muller). */
  normal(): number;
  /** A new independent generator derived from this one (for worker threads, restarts). */
  fork(): Rng;
}

function splitmix32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

export function createRng(seed: number): Rng {
  const init = splitmix32(Math.floor(seed) >>> 0);
  let a = init(), b = init(), c = init(), d = init();
  if ((a | b | c | d) === 0) a = 1;
  const nextU32 = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
    const t = (b << 9) >>> 0;
    c ^= a; d ^= b; b ^= c; a ^= d; c ^= t;
    d = rotl(d, 11);
    return result;
  };
  let spare: number | null = null;
  const rng: Rng = {
    next: () => nextU32() / 4294967296,
    int: (n: number) => Math.floor((nextU32() / 4294967296) * n),
    normal: () => {
      if (spare !== null) {
        const s = spare;
        spare = null;
        return s;
      }
      let u = 0;
      while (u === 0) u = rng.next();
      const v = rng.next();
      const r = Math.sqrt(-2 * Math.log(u));
      spare = r * Math.sin(2 * Math.PI * v);
      return r * Math.cos(2 * Math.PI * v);
    },
    fork: () => createRng(nextU32()),
  };
  return rng;
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}

/**
 * A seed for one part of a seeded computation (e.g. block b of stage s): each part gets its own
 * independent stream that does not depend on the order the parts run in, nor on the process.
 */
export function deriveSeed(seed: number, ...parts: number[]): number {
  let h = Math.floor(seed) >>> 0;
  for (const p of parts) h = splitmix32((h ^ Math.imul((Math.floor(p) + 1) >>> 0, 0x9e3779b9)) >>> 0)();
  return h;
}
