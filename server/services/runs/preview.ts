import { can } from '../../../shared/permissions';
import { formatMoney, planLabel } from '../../../shared/plans';
import { describeEncoding, estimatedPauliTerms } from '../../../shared/engine/solvers/orchestrate';
import type { PreviewBody } from '../../../shared/schemas/runs';
import { planLimitError, planRun, type RunActor } from './planning';
import type { RunServiceDeps } from './read';

/** Above this many estimated Pauli terms the preview does not build the operator in the API process. */
const PREVIEW_MAX_TERMS = 300_000;

/**
 * The preview: the same planning as createRun (nothing is written) shown per solver — qubits,
 * refusal, whether the role may use its settings — plus the encoding summary of the widest circuit
 * a chosen solver simulates, each QAOA/VQE entry's circuit resources (qubits, gate counts and
 * depths on the three layouts — what its finished run reports), the price or the size refusal,
 * and `blockers`: every reason the run would not start (the app disables Start while there is one).
 */
export async function previewRun(deps: RunServiceDeps, actor: RunActor, body: PreviewBody) {
  const planned = await planRun(deps, actor, body);
  const { problem, solvers, plan, limits, seconds, quote } = planned;
  // Describe what a chosen solver will simulate (k regions: the first split), else the direct encoding.
  const chosen = solvers.map((c) => c.definition.circuit(problem, c.parsed)).find((c) => c !== null) ?? null;
  const target = chosen ?? { problem, options: {}, what: `the direct ${problem.kind === 'kway' ? 'one-hot k-way' : problem.kind} encoding (no chosen solver simulates a circuit)` };
  let encoding: ReturnType<typeof describeEncoding> | null = null;
  let encodingNote: string | null = null;
  try {
    const terms = estimatedPauliTerms(target.problem);
    if (terms > PREVIEW_MAX_TERMS) throw new Error(`the ${problem.kind} operator would have about ${Math.round(terms).toLocaleString('en')} Pauli terms; too large to summarise here (the variational solvers would refuse it; qaoa-blocks splits it into blocks)`);
    encoding = describeEncoding(target.problem, { ...target.options, ...(body.precision !== undefined ? { precision: body.precision } : {}) });
  } catch (e) {
    encodingNote = (e as Error).message;
  }
  const limitProblem = planned.limitRefusal ? planLimitError(plan, planned.limitRefusal).message : null;
  const blockers = [
    ...Object.values(planned.fields).flat(),
    ...Object.values(planned.refusals).flat(),
    ...(planned.forbidden ? [planned.forbidden] : []),
    ...(limitProblem ? [limitProblem] : []),
  ];
  // Circuit resources before launch: the circuit each chosen QAOA/VQE entry will simulate, by the
  // rule the run itself follows (shared/engine/solvers/circuit-plan.ts); none for refused entries.
  const circuits = solvers.map((c) => {
    if (c.refusal !== null || c.definition.family !== 'variational') return { circuit: null, circuitNote: null };
    try {
      if (estimatedPauliTerms(c.definition.circuit(problem, c.parsed)?.problem ?? problem) > PREVIEW_MAX_TERMS) return { circuit: null, circuitNote: 'too large to count here' };
      return { circuit: c.definition.plannedCircuit(problem, c.parsed, body.seed ?? 0)?.summary ?? null, circuitNote: null };
    } catch (e) {
      return { circuit: null, circuitNote: (e as Error).message };
    }
  });
  // Each solver may use its time limit, then the orchestrator spends up to min(10 s, limit/5) on bounds.
  const boundSeconds = Math.min(10, Math.max(0.5, seconds / 5));
  return {
    depots: problem.network.n,
    lanes: problem.network.m,
    encoding,
    /** Which circuit the encoding summary describes, in words. */
    circuit: target.what,
    encodingNote,
    plan: { id: plan, label: planLabel(plan), limits },
    limitProblem,
    /** Billing: the price when this is a paid run (null = free or refused), and whether the credits cover it. */
    price: quote.price ? { ...quote.price, label: formatMoney(quote.price) } : null,
    quote,
    fields: planned.fields,
    forbidden: planned.forbidden,
    blockers,
    startable: blockers.length === 0,
    solvers: solvers.map((c, i) => ({
      solver: c.definition.name,
      label: c.definition.label,
      family: c.definition.family,
      guarantee: c.definition.guarantee,
      refusal: c.refusal,
      defaultSettings: c.isDefault,
      needsAdvanced: !c.isDefault,
      allowed: c.isDefault || can(actor.role, 'runs:advanced'),
      qubits: c.qubits,
      /** Qubits and gate counts per layout of the circuit this entry will run (null: none or refused). */
      circuit: circuits[i].circuit,
      circuitNote: circuits[i].circuitNote,
      estimatedSeconds: { atMost: seconds + boundSeconds, note: 'anytime solvers stop at the time limit; exact ones may finish sooner' },
    })),
  };
}
