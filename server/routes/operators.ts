import type { Deps } from '../deps';
import type { RouteSpec } from '../lib/routes';
import { OperatorInspectBodySchema, OperatorInspectionSchema, OperatorSolveAnswerSchema, OperatorSolveBodySchema } from '../../shared/schemas/operators';
import { inspectCustomOperator, solveCustomOperator } from '../services/operators';

const advanced = { kind: 'member', permission: 'runs:advanced' } as const;

/** Operators of your own (analysts and up): inspect, and run VQE or QAOA next to the exact ground energy. */
export function operatorsRoutes(_deps: Deps): RouteSpec[] {
  return [
    {
      method: 'post', path: '/operators/inspect', summary: 'Read a custom operator (spinyard-operator text or JSON, or a QUBO matrix as CSV): terms, qubit-wise commuting groups, shots for a precision; problems named by line',
      access: advanced, body: OperatorInspectBodySchema, response: OperatorInspectionSchema,
      handler: ({ body }) => inspectCustomOperator(body),
    },
    {
      method: 'post', path: '/operators/solve', summary: 'Run VQE (or QAOA for a diagonal operator) on a custom operator, next to its exact ground energy (dense diagonalisation or Lanczos) and the gap',
      access: advanced, body: OperatorSolveBodySchema, response: OperatorSolveAnswerSchema,
      handler: ({ body }) => solveCustomOperator(body),
    },
  ];
}
