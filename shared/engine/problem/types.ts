import type { CompactNetwork } from '../network/types';

export type ProblemKind = 'maxcut' | 'bisection' | 'kway';

/** The splitting question as users ask it (depot ids, not indices). */
export interface ProblemSpec {
  kind: ProblemKind;
  /** Number of regions for kway (MIN_REGIONS…MAX_REGIONS in limits.ts: 3…32); 2 for the other kinds. */
  k?: number;
  /** Depot id → side (0/1) or region (0…k−1) that the depot must take. */
  pins?: Record<string, number>;
  /** Allowed imbalance as a fraction of total depot weight (0 = as even as possible). */
  tolerance?: number;
}

/** The question bound to a compact network, as solvers receive it. */
export interface Problem {
  kind: ProblemKind;
  /** 2 for maxcut and bisection. */
  k: number;
  network: CompactNetwork;
  /** Length n: the pinned part of depot i, or −1 when free. */
  pins: Int32Array;
  tolerance: number;
}

/** max for maxcut (cut weight), min for bisection / kway (crossing weight). */
export type Sense = 'max' | 'min';

export const senseOf = (kind: ProblemKind): Sense => (kind === 'maxcut' ? 'max' : 'min');
