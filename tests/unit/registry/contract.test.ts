/**
 * The solver contract: every solver is made by defineSolver and answers for itself — settings
 * (zod), refusal, and the qubits it will simulate — and run planning, prices and plan limits use
 * only that answer. The reproduction: k regions with the default solvers on the 12-depot demo
 * network "Quillmere Valley — core" on the Team plan was quoted €322,122,548.40 from the one-hot
 * count (52 qubits) while QAOA/VQE run recursive bisection (one split of 12 depots at a time).
 */
import { buildCompactNetwork } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { describeEncoding, solveProblem } from '../../../shared/engine/solvers/orchestrate';
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bestOf } from '../../../shared/engine/problem/compare';
import { isFeasible } from '../../../shared/engine/problem/evaluate';
import { getSolver, listSolvers, solverRegistry } from '../../../shared/engine/solvers/registry';
import { encodeBisection } from '../../../shared/engine/encodings/bisection';
import { firstBisectionStep } from '../../../shared/engine/variational/recursive-bisection';
import { PLAN_IDS, priceOfRun, runLimits, runPriceCeiling, runSizeRefusal } from '../../../shared/plans';
import { defaultSolvers } from '../../../shared/runs/default-solvers';
import { OPTIMIZER_LABELS } from '../../../shared/engine/variational/optimize';
import { DEMO_NETWORKS } from '../../../server/services/demo-networks';
import { planSolvers, runSizeOf } from '../../../server/services/runs/planning';

const core = DEMO_NETWORKS.find((d) => d.key === 'quillmere-core')!;
// The run-setup screen's defaults for k regions: k = 3, tolerance 5 %.
const kway = bindProblem(buildCompactNetwork(core.document), { kind: 'kway', k: 3, tolerance: 0.05 });

describe('every solver answers the same questions', () => {
  test.each(solverRegistry.names)('%s: zod settings with defaults, qubits 0 for classical and > 0 for circuits it runs', (name) => {
    const d = getSolver(name);
    expect(d.settingsSchema.safeParse({}).success).toBe(true);
    expect(() => d.parseSettings({ noSuchSetting: 1 })).toThrow(/noSuchSetting: unknown setting/);
    const kind = d.kinds[0];
    const p = bindProblem(buildCompactNetwork(core.document), kind === 'kway' ? { kind, k: 3 } : { kind });
    const q = d.qubits(p, d.parseSettings({}));
    if (d.family === 'variational') expect(q).toBeGreaterThan(0);
    else expect(q).toBe(0);
  });
});

describe('k regions with the default solvers on the 12-depot demo network (Team plan)', () => {
  test('the one-hot encoding has n·k qubits and more, but QAOA and VQE simulate the first bisection only', () => {
    const oneHot = describeEncoding(kway).qubits; // what the API and the price used to count
    expect(oneHot).toBeGreaterThanOrEqual(12 * 3);
    const step = firstBisectionStep(kway);
    const split = encodeBisection(step.problem, { imbalanceWindow: step.imbalanceWindow }).numQubits;
    expect(split).toBeGreaterThanOrEqual(12);
    expect(split).toBeLessThanOrEqual(12 + 5); // 12 depot qubits plus at most 5 slack qubits
    for (const name of ['qaoa', 'vqe']) expect(getSolver(name).qubits(kway, getSolver(name).parseSettings({}))).toBe(split);
  });

  test('planning prices what the solvers simulate: free on the Team plan, not €322,122,548.40', () => {
    const listing = listSolvers('kway').map((s) => ({ ...s, qubits: getSolver(s.name).qubits(kway, getSolver(s.name).parseSettings({})) }));
    const defaults = defaultSolvers({ kind: 'kway', depots: 12, k: 3 }, listing, { maxQubits: runLimits('team').maxQubits });
    expect(defaults).toEqual(expect.arrayContaining(['qaoa', 'vqe']));
    const { solvers, fields } = planSolvers(kway, defaults.map((solver) => ({ solver })));
    expect(fields).toEqual({});
    const size = runSizeOf(kway, solvers, 10);
    expect(size.solvers.filter((s) => s.family === 'variational').every((s) => (s.qubits ?? 0) <= 17)).toBe(true);
    expect(runSizeRefusal('team', size)).toBeNull();
    expect(priceOfRun('team', { ...size, runsThisMonth: 0 })).toBeNull();
    expect(priceOfRun('free', { ...size, runsThisMonth: 0 })).toBeNull(); // within the free plan's 16 qubits too
    // The old count, for contrast: the one-hot width is beyond every plan — now refused, never priced.
    const oneHot = describeEncoding(kway).qubits;
    const old = { ...size, solvers: [{ name: 'qaoa', family: 'variational', qubits: oneHot }, { name: 'vqe', family: 'variational', qubits: oneHot }] };
    expect(runSizeRefusal('team', old)).toMatchObject({ limit: 'qubits', message: expect.stringMatching(new RegExp(`qaoa would simulate ${oneHot} qubits`)) });
    expect(() => priceOfRun('team', old)).toThrow(RangeError);
  });
});

describe('a quote is a finite price under the stated ceiling, or a refusal', () => {
  test.each([...PLAN_IDS])('%s plan: every size up to 60 qubits, 30 000 depots and 2 h', (plan) => {
    const ceiling = runPriceCeiling(plan);
    expect(Number.isFinite(ceiling) && ceiling > 0).toBe(true);
    let priced = 0, refused = 0;
    for (const qubits of [0, 10, 16, 17, 22, 23, 24, 25, 40, 60]) {
      for (const depots of [10, 200, 201, 2000, 2001, 20000, 30000]) {
        for (const secondsPerSolver of [10, 60, 61, 600, 3600, 7200]) {
          for (const count of [1, 2, 8]) {
            const size = { depots, secondsPerSolver, solvers: Array.from({ length: count }, () => ({ family: 'variational', qubits })), runsThisMonth: 1e9 };
            if (runSizeRefusal(plan, size)) { refused++; continue; }
            const price = priceOfRun(plan, size)!;
            expect(Number.isInteger(price.amount)).toBe(true);
            expect(price.amount).toBeGreaterThan(0);
            expect(price.amount).toBeLessThanOrEqual(ceiling);
            priced++;
          }
        }
      }
    }
    expect(priced).toBeGreaterThan(0);
    expect(refused).toBeGreaterThan(0);
  });
});

describe('honest names', () => {
  test('the MILP label names the method; the library appears only as attribution in the guarantee', () => {
    expect(getSolver('milp').label).toMatch(/branch-and-cut/);
    expect(getSolver('milp').label).not.toMatch(/HiGHS/);
    expect(getSolver('milp').guarantee).toMatch(/with the HiGHS library/);
  });
  test('"-style" where our version simplifies the published method', () => {
    expect(getSolver('tabu').label).toMatch(/breakout-style/); // after Benlic & Hao 2013, simplified
    expect(getSolver('gw').label).toMatch(/Goemans–Williamson-style/); // low-rank SDP, not the full SDP
    expect(OPTIMIZER_LABELS.cobyla).toMatch(/COBYLA-style/); // optimizers/cobyla.ts: no constraints
  });
});

describe('samples carry their feasibility', () => {
  test('QAOA read-out on a balanced split: every sample says whether it keeps the balance rule, and the answer is the best feasible one', async () => {
    // A 6-depot ring with one lane doubled: balanced bisections cut at least 2 lanes (ring, common practice).
    const edges: [number, number, number][] = [[0, 1, 1], [1, 2, 1], [2, 3, 1], [3, 4, 1], [4, 5, 1], [5, 0, 1]];
    const problem = bindProblem(compactFromEdges(6, edges), { kind: 'bisection', tolerance: 0 });
    const r = await solveProblem(problem, 'qaoa', { layers: 1, restarts: 1, maxIterations: 20, readoutShots: 256 }, { seed: 3, timeLimitSeconds: 20 }, { bounds: false });
    expect(r.samples!.length).toBeGreaterThan(1);
    for (const x of r.samples!) expect(x.feasible).toBe(isFeasible(problem, x.assignment));
    expect(r.samples!.some((x) => !x.feasible)).toBe(true); // the read-out does hold unbalanced samples
    const best = bestOf('min', r.samples!, (x) => x);
    expect(best!.feasible).toBe(true);
    expect(r.value).toBeLessThanOrEqual(best!.value);
  });
});
