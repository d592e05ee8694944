import { z } from 'zod';
import type { Deps } from '../deps';
import { NoBodySchema, type AuthContext, type RouteSpec } from '../lib/routes';
import { unauthorized, unavailable } from '../lib/http-error';
import { CreateRunBodySchema, PreviewBodySchema, RunIdParamsSchema, RunListQuerySchema, type RunStatus } from '../../shared/schemas/runs';
import { RunPreviewSchema, RunViewSchema } from '../../shared/schemas/run-view';
import { assignmentCsv, cancelRun, createRun, deleteRun, getRun, listRuns, previewRun, retryRun, runReport, type RunActor } from '../services/runs';
import { assertQueueUp, runChannel } from '../services/queue';

const read = { kind: 'member', permission: 'runs:read' } as const;
const start = { kind: 'member', permission: 'runs:start' } as const;
const cancel = { kind: 'member', permission: 'runs:cancel' } as const;

/** checkAccess has already required a member with an organisation; this narrows the type. */
function actorOf(auth: AuthContext | null): RunActor {
  if (!auth || auth.organisationId === null) throw unauthorized();
  return { organisationId: auth.organisationId, userId: auth.userId, role: auth.role };
}

const FINISHED: RunStatus[] = ['succeeded', 'partial', 'failed', 'cancelled'];
const JobQuerySchema = z.object({ job: z.coerce.number().int().positive().optional() });

/** MariaDB unreachable: 503 with what to do, instead of a bare 500. */
function databaseDown(err: unknown): boolean {
  const name = (err as { name?: string })?.name ?? '';
  return /^Sequelize(Connection|HostNotReachable|HostNotFound|ConnectionRefused|ConnectionTimedOut|AccessDenied)/.test(name);
}

const guarded = (spec: RouteSpec): RouteSpec => ({
  ...spec,
  handler: async (input) => {
    try {
      return await spec.handler(input);
    } catch (err) {
      if (databaseDown(err)) throw unavailable('The run database cannot be reached right now; nothing was changed. Try again in a minute.');
      throw err;
    }
  },
});

/** Runs: create (queued for the workers), follow, cancel, retry, delete, download (docs/runs-service.md). */
export function runsRoutes(deps: Deps): RouteSpec[] {
  const routes: RouteSpec[] = [
    {
      method: 'post', path: '/runs', summary: 'Start a run: one network version, one problem, one or more solvers (each a queued job)', access: start, body: CreateRunBodySchema, status: 201,
      handler: ({ body, auth }) => createRun(deps, actorOf(auth), body),
    },
    {
      method: 'post', path: '/runs/preview', summary: 'Encoding summary, circuit resources per solver, refusals and time budget for a run, without creating it', access: read, body: PreviewBodySchema, response: RunPreviewSchema,
      handler: ({ body, auth }) => previewRun(deps, actorOf(auth), body),
    },
    {
      method: 'get', path: '/runs', summary: 'Runs of the organisation, newest first (filter by network and status)', access: read, query: RunListQuerySchema,
      handler: ({ query, auth }) => listRuns(deps, actorOf(auth).organisationId, query),
    },
    {
      method: 'get', path: '/runs/:id', summary: 'One run with its jobs, live progress and checked results', access: read, params: RunIdParamsSchema, response: RunViewSchema,
      handler: ({ params, auth }) => getRun(deps, actorOf(auth).organisationId, params.id),
    },
    {
      method: 'post', path: '/runs/:id/cancel', summary: 'Cancel the queued and running jobs of a run (running ones keep their best answer so far)', access: cancel, params: RunIdParamsSchema, body: NoBodySchema,
      handler: ({ params, auth }) => cancelRun(deps, actorOf(auth).organisationId, params.id),
    },
    {
      method: 'post', path: '/runs/:id/retry', summary: 'Queue the failed and cancelled jobs of a run again', access: start, params: RunIdParamsSchema, body: NoBodySchema,
      handler: ({ params, auth }) => retryRun(deps, actorOf(auth).organisationId, params.id),
    },
    {
      method: 'delete', path: '/runs/:id', summary: 'Delete a run (what still runs is cancelled)', access: start, params: RunIdParamsSchema,
      handler: async ({ params, auth }) => {
        await deleteRun(deps, actorOf(auth).organisationId, params.id);
        return undefined;
      },
    },
    {
      method: 'get', path: '/runs/:id/assignment.csv', summary: 'Download the best (or ?job=) assignment as CSV: depot id, name, side or region', access: read, params: RunIdParamsSchema, query: JobQuerySchema,
      handler: async ({ params, query, auth, res }) => {
        const file = await assignmentCsv(deps, actorOf(auth).organisationId, params.id, query.job);
        res.status(200).type('text/csv; charset=utf-8').setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
        res.send(file.body);
        return undefined;
      },
    },
    {
      method: 'get', path: '/runs/:id/report.json', summary: 'Download the run report (every job with its checked result, the best answer)', access: read, params: RunIdParamsSchema,
      handler: async ({ params, auth, res }) => {
        const report = await runReport(deps, actorOf(auth).organisationId, params.id);
        res.status(200).setHeader('Content-Disposition', `attachment; filename="run-${params.id}-report.json"`);
        res.json(report);
        return undefined;
      },
    },
    {
      method: 'get', path: '/runs/:id/events', summary: 'Live progress as Server-Sent Events (snapshot, then progress and status events)', access: read, params: RunIdParamsSchema,
      handler: async ({ params, auth, req, res }) => {
        const organisationId = actorOf(auth).organisationId;
        await getRun(deps, organisationId, params.id); // 404 before anything is opened
        await assertQueueUp(deps.redis);
        // Subscribe before the snapshot, so no event between the two is lost.
        const sub = deps.redis.duplicate();
        sub.on('error', () => {});
        const early: string[] = [];
        let forward: ((message: string) => void) | null = null;
        sub.on('message', (_channel: string, message: string) => (forward ? forward(message) : early.push(message)));
        try {
          await sub.subscribe(runChannel(params.id));
        } catch (err) {
          sub.disconnect();
          throw err;
        }
        const snapshot = await getRun(deps, organisationId, params.id);
        res.status(200).set({ 'Content-Type': 'text/event-stream; charset=utf-8', 'Cache-Control': 'no-cache, no-transform', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' });
        res.flushHeaders();
        const send = (event: string, data: unknown) => res.write(`event: ${event}\ndata: ${JSON.stringify(data)}\n\n`);
        let closed = false;
        const heartbeat = setInterval(() => res.write(': keep-alive\n\n'), 15_000);
        const close = () => {
          if (closed) return;
          closed = true;
          clearInterval(heartbeat);
          sub.disconnect();
          res.end();
        };
        req.on('close', close);
        send('snapshot', snapshot);
        if (FINISHED.includes(snapshot.status)) {
          send('end', { status: snapshot.status, run: snapshot });
          close();
          return undefined;
        }
        forward = (message: string) => {
          if (closed) return;
          const event = JSON.parse(message) as { type: string };
          send(event.type, event);
          if (event.type !== 'status') return;
          void getRun(deps, organisationId, params.id).then((view) => {
            if (closed || !FINISHED.includes(view.status)) return;
            send('end', { status: view.status, run: view });
            close();
          }, () => close());
        };
        early.splice(0).forEach(forward);
        return undefined;
      },
    },
  ];
  return routes.map(guarded);
}
