/**
 * Run planning — what run creation and the preview share, so they can never disagree: load the
 * question, ask every chosen solver (settings, refusal, qubits — SolverDefinition is the only
 * place that counts qubits), check the role's rights (non-default settings, seed and time limit
 * need runs:advanced), then the plan: a size beyond the paid ceiling is refused before any price;
 * otherwise the quote is a finite price at most the plan's stated ceiling (or free).
 */
import type { Deps } from '../../deps';
import { HttpError, badRequest, forbidden, notFound } from '../../lib/http-error';
import { advancedRunFields, can, type Role } from '../../../shared/permissions';
import { nextPlan, paidRunPlan, planLabel, runLimits, runSizeRefusal, type PlanRunLimits, type RunSize, type RunSizeRefusal } from '../../../shared/plans';
import { buildCompactNetwork } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import type { NetworkDocument } from '../../../shared/engine/network/types';
import type { Problem, ProblemSpec } from '../../../shared/engine/problem/types';
import { getSolver, type AnySolverDefinition } from '../../../shared/engine/solvers/registry';
import type { CreateRunBody, ProblemInput } from '../../../shared/schemas/runs';
import type { RunQuote } from '../../../shared/schemas/billing';
import { getVersionDocument } from '../networks';
import { loadRunsConfig } from '../queue-config';
import { quoteRun } from '../pricing';

export type PlanningDeps = Pick<Deps, 'db' | 'models' | 'redis' | 'mailer' | 'config' | 'logger'>;

/** Who asks: the organisation every query is scoped to, the user, and the role for `runs:advanced`. */
export interface RunActor {
  organisationId: number;
  userId: number | null;
  role: Role | null;
}

/** One chosen solver as planned: what it said about this problem. */
export interface PlannedSolver {
  /** Position in the request's solver list. */
  index: number;
  definition: AnySolverDefinition;
  /** Settings as given (stored; the worker parses them again). */
  settings: Record<string, unknown>;
  /** Parsed settings (defaults filled in). */
  parsed: unknown;
  isDefault: boolean;
  refusal: string | null;
  /** What the solver says it will simulate (0 for classical). */
  qubits: number;
}

/** Key-order independent JSON, to compare settings with the defaults. */
function stable(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stable).join(',')}]`;
  if (value && typeof value === 'object') {
    return `{${Object.keys(value as object).sort().map((k) => `${JSON.stringify(k)}:${stable((value as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

/** Ask each chosen solver about the problem; field errors for unknown names, kinds and bad settings. */
export function planSolvers(problem: Problem, entries: CreateRunBody['solvers']): { solvers: PlannedSolver[]; fields: Record<string, string[]> } {
  const fields: Record<string, string[]> = {};
  const solvers: PlannedSolver[] = [];
  entries.forEach((entry, i) => {
    let definition: AnySolverDefinition;
    try {
      definition = getSolver(entry.solver);
    } catch (e) {
      fields[`solvers.${i}.solver`] = [(e as Error).message];
      return;
    }
    if (!definition.kinds.includes(problem.kind)) {
      fields[`solvers.${i}.solver`] = [`${definition.name} answers ${definition.kinds.join(', ')}, not ${problem.kind}; choose another solver`];
      return;
    }
    let parsed: unknown;
    try {
      parsed = definition.parseSettings(entry.settings ?? {});
    } catch (e) {
      const f = (e as { fields?: Record<string, string> }).fields;
      if (f) for (const [k, v] of Object.entries(f)) fields[`solvers.${i}.settings.${k}`] = [v];
      else fields[`solvers.${i}.settings`] = [(e as Error).message];
      return;
    }
    const isDefault = entry.settings === undefined || stable(parsed) === stable(definition.parseSettings({}));
    solvers.push({ index: i, definition, settings: entry.settings ?? {}, parsed, isDefault, refusal: definition.refuses(problem, parsed), qubits: definition.qubits(problem, parsed) });
  });
  return { solvers, fields };
}

/** What the price and the size rule depend on: size, time, and each solver's family and qubits. */
export function runSizeOf(problem: Problem, solvers: readonly PlannedSolver[], seconds: number): Omit<RunSize, 'runsThisMonth'> {
  return { depots: problem.network.n, secondsPerSolver: seconds, solvers: solvers.map((c) => ({ name: c.definition.name, family: c.definition.family, qubits: c.qubits })) };
}

export async function loadProblem(deps: PlanningDeps, organisationId: number, versionId: number, spec: ProblemInput) {
  const version = await deps.models.NetworkVersion.findOne({ where: { id: versionId, organisationId }, attributes: ['id', 'networkId', 'depotCount'] });
  if (!version) throw notFound('Network version');
  const document: NetworkDocument = await getVersionDocument(deps as Deps, organisationId, versionId);
  let problem: Problem;
  try {
    problem = bindProblem(buildCompactNetwork(document), spec as ProblemSpec);
  } catch (e) {
    throw badRequest((e as Error).message, { problem: [(e as Error).message] });
  }
  return { problem, networkId: version.get('networkId') as number, document };
}

export async function planOf(deps: Pick<Deps, 'models'>, organisationId: number): Promise<string> {
  const org = await deps.models.Organisation.findByPk(organisationId);
  return org?.plan ?? 'free';
}

/** 402 for a run beyond the plan's paid ceiling, with what to do. */
export function planLimitError(plan: string, refusal: RunSizeRefusal): HttpError {
  const up = nextPlan(refusal.plan);
  const todo = up ? `Upgrade to the ${planLabel(up)} plan (Billing) or make the run smaller.` : 'Make the run smaller.';
  return new HttpError(402, `${refusal.message} ${todo}`, { code: 'plan_limit', limit: refusal.limit, plan });
}

export interface RunPlanning {
  problem: Problem;
  networkId: number;
  solvers: PlannedSolver[];
  /** Field errors (unknown solver, wrong kind, bad settings): the run cannot be created. */
  fields: Record<string, string[]>;
  /** Refusals of the solvers that parsed, keyed like fields. */
  refusals: Record<string, string[]>;
  /** Run fields the role may not set (non-default settings, seed, timeLimitSeconds), in words; null when allowed. */
  forbidden: string | null;
  plan: string;
  limits: PlanRunLimits;
  seconds: number;
  /** The size beyond the paid ceiling, when there is one (then quote.price is null). */
  limitRefusal: RunSizeRefusal | null;
  quote: RunQuote;
}

/** Everything create and preview decide before writing anything. */
export async function planRun(deps: PlanningDeps, actor: RunActor, body: CreateRunBody): Promise<RunPlanning> {
  const { problem, networkId } = await loadProblem(deps, actor.organisationId, body.versionId, body.problem);
  const { solvers, fields } = planSolvers(problem, body.solvers);
  const refusals: Record<string, string[]> = {};
  for (const c of solvers) if (c.refusal !== null) refusals[`solvers.${c.index}.solver`] = [`${c.definition.name} refuses this problem: ${c.refusal}`];
  const advanced = can(actor.role, 'runs:advanced');
  const words: Record<string, string> = { seed: 'a fixed seed', timeLimitSeconds: 'a time limit (timeLimitSeconds)' };
  const wanted = [...advancedRunFields(body).map((f) => words[f] ?? f), ...(solvers.some((c) => !c.isDefault) ? ['changed solver settings'] : [])];
  const forbiddenWhat = advanced || wanted.length === 0 ? null
    : `Your role (${actor.role ?? 'none'}) may start runs with the default solver settings only: ${wanted.join(' and ')} ${wanted.length > 1 ? 'are' : 'is'} reserved for analysts and admins (runs:advanced). Remove ${wanted.length > 1 ? 'them' : 'it'}, or ask an analyst or admin.`;
  const plan = await planOf(deps, actor.organisationId);
  const limits = runLimits(plan);
  const seconds = body.timeLimitSeconds ?? Math.min(loadRunsConfig().RUN_DEFAULT_SECONDS, limits.maxSecondsPerSolver);
  const size = runSizeOf(problem, solvers, seconds);
  const quote = await quoteRun(deps, actor.organisationId, size);
  return { problem, networkId, solvers, fields, refusals, forbidden: forbiddenWhat, plan, limits, seconds, limitRefusal: runSizeRefusal(plan, size), quote };
}

/** Throw the first reason the planned run cannot be created (400 fields, 400 refusals, 403 rights, 402 size). */
export function assertStartable(p: RunPlanning): void {
  if (Object.keys(p.fields).length > 0) throw badRequest('Some solver choices are not valid.', p.fields);
  if (Object.keys(p.refusals).length > 0) throw badRequest('Some solvers cannot take this problem.', p.refusals);
  if (p.forbidden) throw forbidden(p.forbidden);
  if (p.limitRefusal) throw planLimitError(p.plan, p.limitRefusal);
}

/** The plan whose priority and limits a run gets: its own when free, the paid ceiling when priced. */
export const effectivePlan = (p: RunPlanning): string => (p.quote.price ? paidRunPlan(p.plan) : p.plan);
