/**
 * A cut and its mirror image (every side swapped) are the same cut. When two assignments are
 * compared depot by depot (relinking paths, crossovers), the second one is mirrored first if that
 * makes them agree on more free depots — only without pinned depots, where mirroring is allowed.
 * a, b: Int8Array // 0/1 per depot
 */
export function mirrorToward(a: Int8Array, b: Int8Array, free: Int32Array, mirrorable: boolean): 0 | 1 {
  if (!mirrorable) return 0;
  let differ = 0;
  for (let t = 0; t < free.length; t++) if (a[free[t]] !== b[free[t]]) differ++;
  return 2 * differ > free.length ? 1 : 0;
}
