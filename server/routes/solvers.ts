import { z } from 'zod';
import type { Deps } from '../deps';
import type { RouteSpec } from '../lib/routes';
import { listSolvers } from '../../shared/engine/solvers/registry';
import { ProblemInputSchema } from '../../shared/schemas/runs';
import { solverDefaultsFor } from '../services/solver-defaults';

const ListQuery = z.object({ kind: z.enum(['maxcut', 'bisection', 'kway']).optional() });
const DefaultsBody = z.object({ versionId: z.number().int().positive(), problem: ProblemInputSchema });

/** The solver registry as the app sees it, and the size-based default set for a question. */
export function solversRoutes(deps: Deps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/solvers',
      summary: 'Solvers Spinyard offers: name, label, family, questions answered, guarantee',
      access: { kind: 'member', permission: 'runs:read' },
      query: ListQuery,
      handler: ({ query }) => ({ solvers: listSolvers(query.kind) }),
    },
    {
      method: 'post',
      path: '/solvers/defaults',
      summary: 'The default solver set for a question on a network version (exact when small, best heuristic, QAOA/VQE when the qubits fit)',
      access: { kind: 'member', permission: 'runs:read' },
      body: DefaultsBody,
      handler: ({ body, auth }) => solverDefaultsFor(deps, auth!.organisationId!, body.versionId, body.problem),
    },
  ];
}
