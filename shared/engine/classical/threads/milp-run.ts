/**
 * Runs a MILP model through HiGHS (WebAssembly). `solve` is synchronous and blocks its
 * thread, so this file is meant for worker threads (classical-worker.ts).
 * Reads the incumbent, the MIP dual bound and the model status through the persistent API
 * (the one-shot API does not return the dual bound).
 */
import type { MilpModel } from '../milp-model';
import { readAssignment } from '../milp-model';

export interface MilpRunOptions {
  timeLimitSeconds: number;
  seed: number;
  /** Optional starting assignment (side or region per depot) handed to HiGHS as a MIP start. */
  start?: ArrayLike<number> | null;
}

export interface MilpRunResult {
  /** HiGHS model status name: optimal, time-limit, infeasible, … */
  status: string;
  assignment: number[] | null;
  objective: number | null;
  /** MIP dual bound (upper for maximise, lower for minimise), or null. */
  dualBound: number | null;
  mipGap: number | null;
  nodes: number | null;
  seconds: number;
}

const statusNames: Record<number, string> = {
  0: 'not-set', 1: 'load-error', 2: 'model-error', 3: 'presolve-error', 4: 'solve-error', 5: 'postsolve-error',
  6: 'empty', 7: 'optimal', 8: 'infeasible', 9: 'infeasible-or-unbounded', 10: 'unbounded', 11: 'objective-bound',
  12: 'objective-target', 13: 'time-limit', 14: 'iteration-limit', 15: 'unknown', 16: 'solution-limit', 17: 'interrupt',
};

type HighsModule = {
  createModel(input: { format: 'lp'; data: string }): {
    options: { set(o: Record<string, unknown>): unknown };
    run(): unknown;
    getModelStatus(): number;
    getObjectiveValue(): number;
    getSolution(): { colValue: Float64Array };
    getColByName(name: string): number;
    getDimensions(): { numCols: number };
    setSolution(s: { colValue: Float64Array }): unknown;
    info: { get(name: string): unknown };
    dispose(): void;
  };
};

let highsPromise: Promise<HighsModule> | null = null;
function loadHighs(): Promise<HighsModule> {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  if (!highsPromise) highsPromise = (require('highs') as () => Promise<HighsModule>)();
  return highsPromise;
}

export async function runMilp(model: MilpModel, opts: MilpRunOptions): Promise<MilpRunResult> {
  const t0 = Date.now();
  const highs = await loadHighs();
  const hm = highs.createModel({ format: 'lp', data: model.lp });
  try {
    hm.options.set({
      output_flag: false,
      time_limit: Math.max(0.05, opts.timeLimitSeconds),
      random_seed: Math.abs(opts.seed | 0) % 2147483647,
      // Integer objectives: a gap below 1 already proves optimality; otherwise ask for (almost) zero.
      mip_rel_gap: model.integral ? 1e-9 : 1e-9,
      mip_abs_gap: model.integral ? 0.999 : 1e-7,
    });
    if (opts.start) {
      const start = opts.start;
      const colValue = new Float64Array(hm.getDimensions().numCols);
      const set = (name: string, v: number): void => {
        const c = hm.getColByName(name);
        if (c >= 0) colValue[c] = v;
      };
      model.depotColumns.forEach((cols, i) => {
        if (cols.length === 1) set(cols[0], start[i]);
        else set(cols[start[i]], 1);
      });
      for (const y of model.crossingColumns) set(y.name, start[y.from] !== start[y.to] ? 1 : 0);
      // HiGHS checks the start itself; a rejected start only costs the hint.
      try { hm.setSolution({ colValue }); } catch { /* ignored */ }
    }
    hm.run();
    const code = hm.getModelStatus();
    const status = statusNames[code] ?? `status-${code}`;
    const colValue = hm.getSolution().colValue;
    const info = (name: string): number | null => {
      try {
        const v = Number(hm.info.get(name));
        return Number.isFinite(v) ? v : null;
      } catch {
        return null;
      }
    };
    const hasSolution = (info('primal_solution_status') ?? 0) >= 2 || code === 7;
    const assignment = hasSolution && colValue.length > 0 ? Array.from(readAssignment(model, (name) => colValue[hm.getColByName(name)])) : null;
    let dualBound = info('mip_dual_bound');
    if (code === 7 && hasSolution) dualBound = dualBound ?? hm.getObjectiveValue();
    return {
      status,
      assignment,
      objective: hasSolution ? hm.getObjectiveValue() : null,
      dualBound,
      mipGap: info('mip_gap'),
      nodes: info('mip_node_count'),
      seconds: (Date.now() - t0) / 1000,
    };
  } finally {
    hm.dispose();
  }
}
