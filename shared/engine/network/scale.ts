import type { CompactNetwork } from './types';

/**
 * Linear algebra on lane weights (eigenvalues, Lanczos norms, SDP gradients) squares them, so
 * weights near 1e300 overflow although every cut value stays finite. Cuts, eigenvalue bounds
 * and SDP vectors scale linearly with the weights, so such code may work on weights divided by
 * a factor and multiply its results back.
 *
 * The factor is a power of two (dividing by one is exact in binary floating point) and is 1
 * while the largest |weight| lies in 2^-200…2^200, where squares and their sums stay finite;
 * ordinary networks therefore keep every digit they had.
 */
export function laneScale(net: CompactNetwork): number {
  let max = 0;
  for (let e = 0; e < net.m; e++) max = Math.max(max, Math.abs(net.laneWeight[e]));
  if (max === 0 || (max <= 2 ** 200 && max >= 2 ** -200)) return 1;
  return 2 ** Math.round(Math.log2(max));
}

/** The same network with every lane weight divided by `factor` (a power of two from laneScale). */
export function scaleLanes(net: CompactNetwork, factor: number): CompactNetwork {
  if (factor === 1) return net;
  const laneWeight = net.laneWeight.map((w) => w / factor);
  const adjWeight = net.adjWeight.map((w) => w / factor);
  return { ...net, laneWeight, adjWeight };
}
