import { maxPartWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';

/**
 * Mixed-integer models of the three questions, written as CPLEX-LP text for HiGHS.
 *
 * Columns: x<i> (binary side of depot i) or x<i>_<p> (binary "depot i in region p"), and one
 * continuous y<e> ∈ [0, 1] per lane that stands for "lane e crosses". Only the constraints the
 * objective pushes against are written (common practice):
 *  - y must be pushed DOWN to stay honest where the objective wants it large
 *    (max-cut with w > 0, or min kinds with w < 0): y ≤ x_u + x_v, y ≤ 2 − x_u − x_v;
 *  - y must be pushed UP where the objective wants it small
 *    (max-cut with w < 0, or min kinds with w > 0): y ≥ x_u − x_v, y ≥ x_v − x_u.
 * k-way uses the same per region p, with Σ_p x_ip = 1. Balance: every part weighs at most
 * maxPartWeight (the one rule in problem/evaluate.ts).
 */
export interface MilpModel {
  lp: string;
  /** Column names in the order the solution is read back (depot side/region columns). */
  depotColumns: string[][];
  /** Crossing columns y<e> with their lane ends (for MIP starts). */
  crossingColumns: Array<{ name: string; from: number; to: number }>;
  /** True when all lane weights are integers (the optimum and the bound are integers). */
  integral: boolean;
  /** Number of columns and rows written. */
  columns: number;
  rows: number;
}

const num = (v: number): string => (Number.isInteger(v) ? String(v) : v.toPrecision(17));

/** Write terms "+ 3 y0 - 2 y1 …" wrapped over lines (the LP reader dislikes huge lines). */
function terms(parts: Array<[number, string]>): string {
  const out: string[] = [];
  let line = '';
  for (const [c, name] of parts) {
    const t = `${c < 0 ? '-' : '+'} ${num(Math.abs(c))} ${name}`;
    if (line.length + t.length > 200) {
      out.push(line);
      line = '';
    }
    line += (line ? ' ' : '') + t;
  }
  out.push(line || '0 x0');
  return out.join('\n  ');
}

export function buildMilp(problem: Problem): MilpModel {
  const { n, m, laneFrom, laneTo, laneWeight, depotWeight } = problem.network;
  const kind = problem.kind;
  const k = kind === 'kway' ? problem.k : 2;
  const maximise = kind === 'maxcut';
  const rows: string[] = [];
  const bounds: string[] = [];
  const binaries: string[] = [];
  const objective: Array<[number, string]> = [];
  const depotColumns: string[][] = [];
  const crossingColumns: MilpModel['crossingColumns'] = [];
  let integral = true;
  const unpinned = problem.pins.every((p) => p < 0);

  if (k === 2) {
    for (let i = 0; i < n; i++) {
      depotColumns.push([`x${i}`]);
      binaries.push(`x${i}`);
      const pin = problem.pins[i] >= 0 ? problem.pins[i] : unpinned && i === 0 ? 0 : -1;
      if (pin >= 0) rows.push(`pin${i}: x${i} = ${pin}`);
    }
  } else {
    for (let i = 0; i < n; i++) {
      const cols: string[] = [];
      for (let p = 0; p < k; p++) {
        cols.push(`x${i}_${p}`);
        binaries.push(`x${i}_${p}`);
      }
      depotColumns.push(cols);
      rows.push(`one${i}: ${cols.join(' + ')} = 1`);
      const pin = problem.pins[i] >= 0 ? problem.pins[i] : unpinned && i === 0 ? 0 : -1;
      if (pin >= 0) rows.push(`pin${i}: x${i}_${pin} = 1`);
    }
  }

  for (let e = 0; e < m; e++) {
    const w = laneWeight[e];
    if (w === 0) continue;
    if (!Number.isInteger(w)) integral = false;
    const u = laneFrom[e], v = laneTo[e];
    const y = `y${e}`;
    objective.push([w, y]);
    crossingColumns.push({ name: y, from: u, to: v });
    bounds.push(`0 <= ${y} <= 1`);
    const pushDown = maximise ? w > 0 : w < 0;
    if (k === 2) {
      if (pushDown) {
        rows.push(`a${e}: ${y} - x${u} - x${v} <= 0`);
        rows.push(`b${e}: ${y} + x${u} + x${v} <= 2`);
      } else {
        rows.push(`a${e}: ${y} - x${u} + x${v} >= 0`);
        rows.push(`b${e}: ${y} + x${u} - x${v} >= 0`);
      }
    } else {
      for (let p = 0; p < k; p++) {
        if (pushDown) rows.push(`s${e}_${p}: ${y} + x${u}_${p} + x${v}_${p} <= 2`);
        else {
          rows.push(`a${e}_${p}: ${y} - x${u}_${p} + x${v}_${p} >= 0`);
          rows.push(`b${e}_${p}: ${y} + x${u}_${p} - x${v}_${p} >= 0`);
        }
      }
    }
  }

  if (kind !== 'maxcut') {
    let total = 0;
    for (let i = 0; i < n; i++) total += depotWeight[i];
    const limit = maxPartWeight(problem);
    if (k === 2) {
      const side1: Array<[number, string]> = [];
      for (let i = 0; i < n; i++) if (depotWeight[i] !== 0) side1.push([depotWeight[i], `x${i}`]);
      if (side1.length > 0) {
        rows.push(`heavy: ${terms(side1)} <= ${num(limit)}`);
        rows.push(`light: ${terms(side1)} >= ${num(total - limit)}`);
      }
    } else {
      for (let p = 0; p < k; p++) {
        const part: Array<[number, string]> = [];
        for (let i = 0; i < n; i++) if (depotWeight[i] !== 0) part.push([depotWeight[i], `x${i}_${p}`]);
        if (part.length > 0) rows.push(`load${p}: ${terms(part)} <= ${num(limit)}`);
      }
    }
  }

  const lp = [
    maximise ? 'Maximize' : 'Minimize',
    ` obj: ${objective.length > 0 ? terms(objective) : '0 ' + binaries[0]}`,
    'Subject To',
    ...rows.map((r) => ` ${r}`),
    ...(rows.length === 0 ? [` none: ${binaries[0]} >= 0`] : []),
    'Bounds',
    ...bounds.map((b) => ` ${b}`),
    'Binary',
    ...binaries.map((b) => ` ${b}`),
    'End',
  ].join('\n');
  return { lp, depotColumns, crossingColumns, integral, columns: binaries.length + objective.length, rows: rows.length };
}

/** Read an assignment from column values looked up by name. */
export function readAssignment(model: MilpModel, valueOf: (name: string) => number): Int8Array {
  const out = new Int8Array(model.depotColumns.length);
  model.depotColumns.forEach((cols, i) => {
    if (cols.length === 1) out[i] = valueOf(cols[0]) > 0.5 ? 1 : 0;
    else {
      let bestP = 0, bestV = -Infinity;
      cols.forEach((c, p) => {
        const v = valueOf(c);
        if (v > bestV) { bestV = v; bestP = p; }
      });
      out[i] = bestP;
    }
  });
  return out;
}
