import { z } from 'zod';
import { CircuitSummarySchema } from './circuits';

/**
 * Operators of your own (docs/runs.md, "Operators of your own"): the text an analyst uploads or
 * pastes — our "spinyard-operator 1" text or JSON, or a QUBO matrix as CSV — and the answers.
 */
export const OPERATOR_TEXT_MAX = 1_000_000;
/** Limits of a run from the API (a request-bound computation in a thread of the API process). */
export const OPERATOR_API_MAX_QUBITS = 14;
export const OPERATOR_API_MAX_SECONDS = 20;

const operatorText = {
  text: z.string().min(1, 'paste or upload an operator').max(OPERATOR_TEXT_MAX, `at most ${OPERATOR_TEXT_MAX} characters`),
  kind: z.enum(['operator', 'qubo-csv']).optional().describe('"operator" (spinyard-operator text or JSON) or "qubo-csv"; guessed when left out'),
};

export const OperatorInspectBodySchema = z.object({ ...operatorText, precision: z.number().positive().optional().describe('target standard error of the energy') }).strict();
export type OperatorInspectBody = z.infer<typeof OperatorInspectBodySchema>;

export const OperatorSolveBodySchema = z.object({
  ...operatorText,
  solver: z.enum(['vqe', 'qaoa']).default('vqe'),
  settings: z.record(z.string(), z.unknown()).optional().describe('the vqe/qaoa solver settings (GET /api/solvers)'),
  seed: z.number().int().min(0).max(2 ** 31 - 1).default(1),
  timeLimitSeconds: z.number().positive().max(OPERATOR_API_MAX_SECONDS).default(10),
}).strict();
export type OperatorSolveBody = z.infer<typeof OperatorSolveBodySchema>;

export const OperatorInspectionSchema = z.object({
  qubits: z.number().int(),
  terms: z.number().int(),
  offset: z.number(),
  diagonal: z.boolean().describe('Z terms only: QAOA applies'),
  coefficientNorm: z.number(),
  groups: z.array(z.object({ basis: z.string(), terms: z.number().int() })).describe('qubit-wise commuting groups, one measurement setting each'),
  precision: z.number(),
  shots: z.object({ uniformPerGroup: z.number().int(), uniformTotal: z.number().int(), weightedTotal: z.number().int() }),
  largest: z.array(z.object({ coeff: z.number(), factors: z.string() })),
});

export const OperatorSolveAnswerSchema = z.object({
  solver: z.enum(['vqe', 'qaoa']),
  ansatz: z.enum(['ladder', 'alternating']),
  qubits: z.number().int(),
  terms: z.number().int(),
  diagonal: z.boolean(),
  energy: z.number().describe('exact ⟨H⟩ at the optimised parameters'),
  exact: z.object({ energy: z.number(), method: z.string() }).nullable().describe('exact ground energy'),
  gap: z.number().nullable().describe('energy − exact ground energy'),
  relativeGap: z.number().nullable(),
  params: z.array(z.number()),
  paramNames: z.array(z.string()),
  evaluations: z.number().int(),
  shots: z.number().int(),
  seconds: z.number(),
  stopped: z.boolean(),
  trace: z.array(z.object({ iteration: z.number(), energy: z.number(), stdError: z.number(), seconds: z.number() })),
  circuit: CircuitSummarySchema.nullable(),
  circuitNote: z.string().nullable(),
});
