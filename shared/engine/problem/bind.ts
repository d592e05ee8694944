import type { CompactNetwork } from '../network/types';
import { isRegionCount, MAX_REGIONS, MIN_REGIONS } from './limits';
import type { Problem, ProblemSpec } from './types';

export { MAX_REGIONS, MIN_REGIONS };

export class ProblemError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ProblemError';
  }
}

/** Bind a user's question to a network: checks k, pins and tolerance, turns pins into indices. */
export function bindProblem(network: CompactNetwork, spec: ProblemSpec): Problem {
  const k = spec.kind === 'kway' ? spec.k ?? MIN_REGIONS : 2;
  if (spec.kind === 'kway' && !isRegionCount(k)) {
    throw new ProblemError(`k must be a whole number from ${MIN_REGIONS} to ${MAX_REGIONS} for k regions (got ${spec.k})`);
  }
  const tolerance = spec.tolerance ?? 0;
  if (!Number.isFinite(tolerance) || tolerance < 0 || tolerance >= 1) {
    throw new ProblemError(`tolerance must lie in 0 ≤ t < 1 (share of total depot weight); got ${spec.tolerance}`);
  }
  if (spec.kind !== 'maxcut' && network.n < k) {
    throw new ProblemError(`the network has ${network.n} depots; splitting into ${k} regions needs at least ${k}`);
  }
  const pins = new Int32Array(network.n).fill(-1);
  const index = new Map(network.depotIds.map((id, i) => [id, i]));
  for (const [id, part] of Object.entries(spec.pins ?? {})) {
    const i = index.get(id);
    if (i === undefined) throw new ProblemError(`pinned depot "${id}" is not in the network`);
    if (!Number.isInteger(part) || part < 0 || part >= k) throw new ProblemError(`depot "${id}" is pinned to ${part}; use 0…${k - 1}`);
    pins[i] = part;
  }
  return { kind: spec.kind, k, network, pins, tolerance };
}
