import { factorsOf } from '../operators/format';
import { groupQubitWise } from '../operators/grouping';
import { planShotBudget } from '../operators/budget';
import type { PauliSum } from '../operators/types';
import { isDiagonal } from './ground';

export interface OperatorInspection {
  qubits: number;
  terms: number;
  offset: number;
  diagonal: boolean;
  coefficientNorm: number;
  /** Qubit-wise commuting groups: one measurement setting each (greedy colouring). */
  groups: { basis: string; terms: number }[];
  precision: number;
  /** Shots for the precision: uniform over groups, and weighted by each group's bound (Wecker et al. 2015). */
  shots: { uniformPerGroup: number; uniformTotal: number; weightedTotal: number };
  /** The largest terms by |coefficient|, as "Z0 Z3" text. */
  largest: { coeff: number; factors: string }[];
}

/** What an analyst sees before running a custom operator. */
export function inspectOperator(p: PauliSum, precision?: number, show = 40): OperatorInspection {
  const norm = p.terms.reduce((s, t) => s + Math.abs(t.coeff), 0);
  const eps = precision ?? 0.01 * Math.max(norm, 1e-12);
  const grouping = groupQubitWise(p);
  const budget = p.terms.length > 0 ? planShotBudget(p, eps, { grouping }) : null;
  return {
    qubits: p.numQubits,
    terms: p.terms.length,
    offset: p.offset,
    diagonal: isDiagonal(p),
    coefficientNorm: norm,
    groups: grouping.groups.map((members, g) => ({ basis: grouping.basis[g], terms: members.length })),
    precision: eps,
    shots: budget ? { uniformPerGroup: budget.uniform.perGroup, uniformTotal: budget.uniform.total, weightedTotal: budget.weighted.total } : { uniformPerGroup: 0, uniformTotal: 0, weightedTotal: 0 },
    largest: [...p.terms].sort((a, b) => Math.abs(b.coeff) - Math.abs(a.coeff)).slice(0, show).map((t) => ({ coeff: t.coeff, factors: factorsOf(t.letters) })),
  };
}
