import type { DecompositionReport } from '../solvers/types';

/**
 * What a qaoa-blocks result tells the run screen about its blocks: count, depots per block,
 * the block of each depot (to colour the drawing) and how orientations were chosen.
 * `blockOf` holds block ids 0…blocks−1, one per depot in input order.
 */
export function decompositionReport(outcome: { blockOf: Int32Array; blocks: readonly { qubits: number }[]; merge: { method: DecompositionReport['merge']; blocks: number } }): DecompositionReport {
  const sizes = new Array<number>(outcome.merge.blocks).fill(0);
  for (let i = 0; i < outcome.blockOf.length; i++) sizes[outcome.blockOf[i]]++;
  return {
    blocks: outcome.merge.blocks,
    sizes,
    blockOf: Array.from(outcome.blockOf),
    largestQubits: outcome.blocks.reduce((q, b) => Math.max(q, b.qubits), 0),
    merge: outcome.merge.method,
  };
}
