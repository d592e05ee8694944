/**
 * The network model shared by every solver: depots (vertices) and lanes (weighted edges).
 *
 * Two forms exist:
 * - `NetworkDocument`: what users, files and the API speak — depot ids are strings.
 * - `CompactNetwork`: what solvers read — depots are 0…n−1 in document order, lanes are
 *   parallel typed arrays. Parallel lanes are already merged, self-loops rejected.
 */

export interface Depot {
  id: string;
  name?: string;
  lat?: number;
  lon?: number;
  /** Node weight such as demand; used by balance constraints. Defaults to 1. */
  weight?: number;
}

export interface Lane {
  from: string;
  to: string;
  weight: number;
}

export interface NetworkDocument {
  name?: string;
  depots: Depot[];
  lanes: Lane[];
}

export interface CompactNetwork {
  /** Number of depots. */
  n: number;
  /** Depot ids in input order; index i of every array below refers to depotIds[i]. */
  depotIds: string[];
  /** Number of merged lanes. */
  m: number;
  /** Lane endpoints, length m, with laneFrom[e] < laneTo[e]. */
  laneFrom: Int32Array;
  laneTo: Int32Array;
  /** Lane weights, length m (may be negative: signed max-cut instances use ±1). */
  laneWeight: Float64Array;
  /** Depot weights, length n (all 1 when the document gives none). */
  depotWeight: Float64Array;
  /** CSR adjacency: neighbours of i are adjIndex[adjStart[i] … adjStart[i+1]−1]. */
  adjStart: Int32Array;
  adjIndex: Int32Array;
  /** Weight of the lane behind each adjacency entry, same length as adjIndex. */
  adjWeight: Float64Array;
}

/** One problem found while reading a network; `row` is 1-based within depots or lanes. */
export interface NetworkIssue {
  where: 'depots' | 'lanes';
  row: number;
  message: string;
}
