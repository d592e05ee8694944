/**
 * What the partition view shows about one answer, computed with the engine's own rules
 * (shared/engine/problem/evaluate.ts) so the app never re-defines crossing weight or balance.
 */
import { buildCompactNetwork } from '../../shared/engine/network/build';
import type { NetworkDocument } from '../../shared/engine/network/types';
import { bindProblem } from '../../shared/engine/problem/bind';
import { crossingWeight, isBalanced, maxPartWeight, partWeights } from '../../shared/engine/problem/evaluate';
import type { Problem } from '../../shared/engine/problem/types';
import { partName, partWord } from '../../shared/runs/regions';
import type { RunProblem } from './types';

export interface RegionTotal {
  region: number;
  depots: number;
  /** Sum of depot weights (demand) in the region. */
  weight: number;
  /** Lane weight with both ends inside the region. */
  internalLaneWeight: number;
}

export interface PartitionSummary {
  regions: RegionTotal[];
  /** Lane weight between regions (the cut for max-cut, the crossing for splits). */
  crossing: number;
  /** Document lane indices whose ends lie in different regions (drawn emphasised). */
  crossingLanes: Set<number>;
  balanced: boolean;
  /** The heaviest region may weigh at most this (null for max-cut, which has no balance rule). */
  limit: number | null;
  heaviest: number;
  /** Regions without a depot (never for max-cut, whose two sides are not regions to fill). */
  emptyRegions: number[];
}

/** The question bound to the version's document (for evaluation only; no solving happens here). */
export function boundProblem(doc: Pick<NetworkDocument, 'depots' | 'lanes'>, problem: RunProblem): Problem {
  return bindProblem(buildCompactNetwork({ depots: doc.depots, lanes: doc.lanes }), { kind: problem.kind, k: problem.kind === 'kway' ? problem.k : undefined, pins: problem.pins, tolerance: problem.tolerance });
}

/** Regions per depot (document order) → totals, crossing lanes and the balance verdict. */
export function summarisePartition(doc: Pick<NetworkDocument, 'depots' | 'lanes'>, problem: RunProblem, assignment: readonly number[]): PartitionSummary {
  const bound = boundProblem(doc, problem);
  const k = bound.k;
  const index = new Map(doc.depots.map((d, i) => [d.id, i]));
  const regions: RegionTotal[] = Array.from({ length: k }, (_, region) => ({ region, depots: 0, weight: 0, internalLaneWeight: 0 }));
  const weights = partWeights(bound, assignment);
  for (let i = 0; i < doc.depots.length; i++) regions[assignment[i]].depots++;
  for (let r = 0; r < k; r++) regions[r].weight = weights[r];
  const crossingLanes = new Set<number>();
  doc.lanes.forEach((lane, e) => {
    const a = index.get(lane.from), b = index.get(lane.to);
    if (a === undefined || b === undefined) return;
    if (assignment[a] !== assignment[b]) crossingLanes.add(e);
    else regions[assignment[a]].internalLaneWeight += lane.weight;
  });
  return {
    regions,
    crossing: crossingWeight(bound, assignment),
    crossingLanes,
    balanced: isBalanced(bound, assignment),
    limit: problem.kind === 'maxcut' ? null : maxPartWeight(bound),
    heaviest: Math.max(...Array.from(weights)),
    emptyRegions: problem.kind === 'maxcut' ? [] : regions.filter((r) => r.depots === 0).map((r) => r.region),
  };
}

/**
 * Why a region can be empty, in words: the balance rule caps a region's demand and sets no
 * minimum (shared/engine/problem/evaluate.ts, as the METIS-style cap), so when the others may
 * take its depots a solver leaves it empty if that crosses less volume. Null when none is empty.
 */
export function emptyRegionNote(kind: RunProblem['kind'], emptyRegions: readonly number[]): string | null {
  if (emptyRegions.length === 0) return null;
  const names = emptyRegions.map((r) => partName(kind, r));
  const list = names.length === 1 ? `${names[0]} has` : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]} have`;
  const word = partWord(kind);
  return `${list} no depots: the balance rule caps each ${word}'s demand but sets no minimum, so a solver may leave a ${word} empty (fewer ${word}s usually cross less volume). Lower the balance tolerance to use every ${word}.`;
}
