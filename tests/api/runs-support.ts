/**
 * Helpers for the solve-service suites: the run settings for tests (short queue locks, the mail
 * threshold at 0, each file its own queue name and SMTP port), a real worker process spawned as
 * a child (`tsx server/worker.ts`), Bearer tokens per role, networks written through the
 * networks service, and polling.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import request from 'supertest';
import type { Deps } from '../../server/deps';
import type { Role } from '../../shared/permissions';
import { createOrgWithRoles, createTestApp, uniqueTag, type TestApp } from './setup/test-app';

export const ROOT = path.resolve(__dirname, '..', '..');

/** Environment for the API (this process) and the worker children; set before createTestApp. */
export function applyRunsEnv(opts: { smtpPort: number; queue: string; extra?: Record<string, string> }): Record<string, string> {
  const env: Record<string, string> = {
    RUN_QUEUE_NAME: `${opts.queue}-${uniqueTag()}`,
    RUN_LOCK_MS: '2000',
    RUN_STALLED_INTERVAL_MS: '1000',
    RUN_MAX_STALLED: '5',
    RUN_MAIL_AFTER_SECONDS: '0',
    RUN_PROGRESS_WRITE_MS: '200',
    RUN_GRACE_SECONDS: '20', // generous: the test machine is shared and often saturated
    SMTP_PORT: String(opts.smtpPort),
    LOG_LEVEL: 'silent',
    ...(opts.extra ?? {}),
  };
  Object.assign(process.env, env);
  return env;
}

export interface WorkerChild {
  child: ChildProcess;
  /** Pid of the node process that runs the worker (tsx may start it as a child of its own). */
  pid: number;
  output: () => string;
  /** Resolves with the exit code or signal once the process is gone. */
  exited: Promise<string>;
  kill(signal?: NodeJS.Signals): Promise<string>;
}

/**
 * A real solve worker process with the current environment (plus `extra`). `ownSession`: start it
 * in a session of its own (setsid), as a worker started as its own service runs — Linux shares
 * a busy machine's CPU between sessions first (autogroup scheduling), so workers started in the
 * caller's session together get one session's share however many there are.
 */
export async function startWorkerChild(extra: Record<string, string> = {}, opts: { ownSession?: boolean } = {}): Promise<WorkerChild> {
  const child = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/worker.ts'], {
    cwd: ROOT,
    env: { ...process.env, ...extra },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: opts.ownSession === true,
  });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const exited = new Promise<string>((resolve) => child.once('exit', (code, signal) => resolve(String(signal ?? code))));
  await new Promise<void>((resolve, reject) => {
    const t = setTimeout(() => reject(new Error(`worker did not get ready in 60 s:\n${out}`)), 60_000);
    const check = () => {
      if (/solve worker ready \(pid \d+\)/.test(out)) {
        clearTimeout(t);
        resolve();
      }
    };
    child.stdout!.on('data', check);
    void exited.then((code) => {
      clearTimeout(t);
      reject(new Error(`worker exited (${code}) before it was ready:\n${out}`));
    });
  });
  const pid = Number(/solve worker ready \(pid (\d+)\)/.exec(out)?.[1] ?? child.pid);
  return {
    child,
    pid,
    output: () => out,
    exited,
    async kill(signal = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) {
        try {
          if (pid !== child.pid) process.kill(pid, signal);
        } catch {
          // already gone
        }
        child.kill(signal);
      }
      return exited;
    },
  };
}

/** Organisation with one member per role and a Bearer token for each (no CSRF needed). */
export async function orgWithTokens(deps: Deps, label: string, plan = 'team') {
  const { createToken } = await import('../../server/services/tokens');
  const org = await createOrgWithRoles(deps, label, plan);
  const tokens = {} as Record<Role, string>;
  for (const role of Object.keys(org.users) as Role[]) {
    tokens[role] = (await createToken(deps, org.organisationId, org.users[role].id, `runs test ${role}`, null)).token;
  }
  return { ...org, tokens };
}

export type Edge = [number, number, number];

/** A network document with depots d1…dn (names "Depot i") and the given 0-based lanes. */
export function networkBody(name: string, n: number, edges: Edge[]) {
  return {
    name,
    depots: Array.from({ length: n }, (_, i) => ({ id: `d${i + 1}`, name: `Depot ${i + 1}` })),
    lanes: edges.map(([a, b, w]) => ({ from: `d${a + 1}`, to: `d${b + 1}`, weight: w })),
  };
}

/** Saves a network as version 1 through the API (as the given token's user); returns the ids. */
export async function saveNetwork(app: TestApp['app'], token: string, body: ReturnType<typeof networkBody>): Promise<{ id: number; versionId: number }> {
  const res = await request(app).post('/api/networks').set('Authorization', `Bearer ${token}`).send(body);
  if (res.status !== 201) throw new Error(`could not save network: ${res.status} ${JSON.stringify(res.body)}`);
  return { id: res.body.id, versionId: res.body.versionId };
}

/** Erdős–Rényi G(n, p), unit weights, from a tiny seeded generator (mulberry32). */
export function randomEdges(n: number, p: number, seed: number): Edge[] {
  let s = seed >>> 0;
  const next = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (next() < p) edges.push([i, j, 1]);
  return edges;
}

/** Petersen graph (max-cut 12, common practice). */
export function petersenEdges(): Edge[] {
  const e: Edge[] = [];
  for (let i = 0; i < 5; i++) {
    e.push([i, (i + 1) % 5, 1]);
    e.push([5 + i, 5 + ((i + 2) % 5), 1]);
    e.push([i, 5 + i, 1]);
  }
  return e;
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 30_000, everyMs = 100): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let last: unknown = null;
  for (;;) {
    try {
      const v = await probe();
      if (v) return v;
      last = v;
    } catch (e) {
      last = e;
    }
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what} (last: ${last instanceof Error ? last.message : JSON.stringify(last)})`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

export { createTestApp, type TestApp };

/**
 * For suites that only look at stored rows: an app whose queue no worker serves (jobs stay
 * queued), with the hooks that open and close it. Call at the top level of a test file.
 */
export function appWithoutWorker(queue: string): () => TestApp {
  let t: TestApp | undefined;
  beforeAll(async () => {
    process.env.RUN_QUEUE_NAME = `${queue}-${uniqueTag()}`;
    process.env.LOG_LEVEL = 'silent';
    t = await createTestApp();
  });
  afterAll(async () => {
    const { closeSolveQueue } = await import('../../server/services/queue');
    if (t) await closeSolveQueue(t.deps);
    await t?.close();
  });
  return () => t!;
}

/** A 4-depot path network and a run of four solver jobs on it (greedy, tabu, anneal, exact). */
export async function runOfFourJobs(t: TestApp, label: string) {
  const org = await orgWithTokens(t.deps, `${label} yard`, 'team');
  const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody(label, 4, [[0, 1, 1], [1, 2, 1], [2, 3, 1]]));
  const created = await request(t.app).post('/api/runs').set('Authorization', `Bearer ${org.tokens.dispatcher}`)
    .send({ versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }, { solver: 'tabu' }, { solver: 'anneal' }, { solver: 'exact' }] });
  if (created.status !== 201) throw new Error(`run not created: ${created.status} ${JSON.stringify(created.body)}`);
  const jobs = (await t.deps.models.RunJob.findAll({ where: { runId: created.body.id }, order: [['position', 'ASC']] })).map((j) => j.get('id') as number);
  return { org, net, runId: created.body.id as number, jobs };
}
