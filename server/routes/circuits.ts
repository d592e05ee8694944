import type { Deps } from '../deps';
import { unauthorized } from '../lib/http-error';
import type { AuthContext, RouteSpec } from '../lib/routes';
import { DeviceAnswerSchema, DeviceBodySchema, QasmQuerySchema } from '../../shared/schemas/circuits';
import { RunIdParamsSchema } from '../../shared/schemas/runs';
import { jobDevice, jobQasm } from '../services/run-circuits';

const orgOf = (auth: AuthContext | null): number => {
  if (!auth || auth.organisationId === null) throw unauthorized();
  return auth.organisationId;
};

/** What a variational job would need on a device: OpenQASM downloads, device time and noise (docs/runs.md). */
export function circuitsRoutes(deps: Deps): RouteSpec[] {
  return [
    {
      method: 'get', path: '/runs/:id/circuit.qasm', summary: 'Download a variational job\'s optimised circuit as OpenQASM 3 or 2.0, bound or parameterised, routed onto a layout',
      access: { kind: 'member', permission: 'runs:read' }, params: RunIdParamsSchema, query: QasmQuerySchema, produces: 'text/plain',
      handler: async ({ params, query, auth, res }) => {
        const file = await jobQasm(deps, orgOf(auth), params.id, query);
        res.status(200).type('text/plain; charset=utf-8').setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
        res.send(file.body);
        return undefined;
      },
    },
    {
      method: 'post', path: '/runs/:id/device', summary: 'Device time and the depolarizing noise estimate of a variational job under other device assumptions (analysts)',
      access: { kind: 'member', permission: 'runs:advanced' }, params: RunIdParamsSchema, body: DeviceBodySchema, response: DeviceAnswerSchema,
      handler: ({ params, body, auth }) => jobDevice(deps, orgOf(auth), params.id, body),
    },
  ];
}
