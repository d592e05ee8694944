import { applyRunEvent, parseRunEvent } from '../../../components/queries/run-events';
import type { RunDetail } from '../../../components/runs/types';

const job = (id: number, status: RunDetail['jobs'][number]['status'], progress = 0) => ({
  id, position: id - 1, solver: id === 1 ? 'tabu' : 'qaoa', label: '', family: '', settings: {}, attempt: 1, status, progress, live: null,
  queuedAt: null, startedAt: null, finishedAt: null, result: null, error: null,
});
const run = (jobs: RunDetail['jobs'], status: RunDetail['status'] = 'running'): RunDetail =>
  ({ id: 9, status, problem: { kind: 'maxcut' }, networkId: 1, versionId: 5, networkName: 'Triangle', depotCount: 3, timeLimitSeconds: 10, seed: 1, createdBy: 1, createdAt: '', finishedAt: null, jobs }) as unknown as RunDetail;

describe('run progress stream events', () => {
  test('parsing reads the four events the server sends and ignores anything else', () => {
    expect(parseRunEvent('snapshot', JSON.stringify(run([job(1, 'queued')])))?.type).toBe('snapshot');
    expect(parseRunEvent('progress', '{"type":"progress","runId":9,"jobId":1,"progress":0.5,"live":{"fraction":0.5,"energy":-3}}')).toEqual({ type: 'progress', jobId: 1, progress: 0.5, live: { fraction: 0.5, energy: -3 } });
    expect(parseRunEvent('status', '{"type":"status","runId":9,"jobId":2,"status":"succeeded"}')).toEqual({ type: 'status', jobId: 2, status: 'succeeded' });
    expect(parseRunEvent('end', JSON.stringify({ status: 'succeeded', run: run([]) }))?.type).toBe('end');
    expect(parseRunEvent('progress', 'not json')).toBeNull();
    expect(parseRunEvent('progress', '{"jobId":"1"}')).toBeNull();
    expect(parseRunEvent('end', '{"status":"succeeded"}')).toBeNull();
    expect(parseRunEvent('message', '{"jobId":1}')).toBeNull();
  });

  test('progress moves one job forward without a request; the run turns running by the shared status rule', () => {
    const before = run([job(1, 'queued'), job(2, 'queued')], 'queued');
    const out = applyRunEvent(before, { type: 'progress', jobId: 1, progress: 0.4, live: { fraction: 0.4, energy: -2 } });
    expect(out.refetch).toBe(false);
    expect(out.done).toBe(false);
    expect(out.run!.status).toBe('running');
    expect(out.run!.jobs[0]).toMatchObject({ status: 'running', progress: 0.4, live: { fraction: 0.4, energy: -2 } });
    expect(out.run!.jobs[1]).toBe(before.jobs[1]);
    expect(before.jobs[0].progress).toBe(0); // the cached object is not changed in place
  });

  test('a late progress event never reopens a finished job', () => {
    const before = run([job(1, 'succeeded', 1), job(2, 'running', 0.2)]);
    expect(applyRunEvent(before, { type: 'progress', jobId: 1, progress: 0.7 }).run!.jobs[0]).toBe(before.jobs[0]);
  });

  test('a job that finishes asks for one refetch (its result is not in the event); a start does not', () => {
    const before = run([job(1, 'running', 0.9), job(2, 'queued')]);
    const done = applyRunEvent(before, { type: 'status', jobId: 1, status: 'succeeded' });
    expect(done.refetch).toBe(true);
    expect(done.run!.jobs[0].status).toBe('succeeded');
    expect(done.run!.status).toBe('queued'); // deriveRunStatus: one succeeded, one still queued
    const started = applyRunEvent(before, { type: 'status', jobId: 2, status: 'running' });
    expect(started.refetch).toBe(false);
    expect(started.run!.status).toBe('running');
  });

  test('snapshot and end replace the run; end says the stream is over; an unknown job asks for the whole run', () => {
    const fresh = run([job(1, 'running', 0.1)]);
    expect(applyRunEvent(undefined, { type: 'snapshot', run: fresh })).toEqual({ run: fresh, refetch: false, done: false });
    const final = run([job(1, 'succeeded', 1)], 'succeeded');
    expect(applyRunEvent(fresh, { type: 'end', run: final })).toEqual({ run: final, refetch: false, done: true });
    expect(applyRunEvent(fresh, { type: 'progress', jobId: 77, progress: 0.3 })).toEqual({ run: fresh, refetch: true, done: false });
    expect(applyRunEvent(fresh, { type: 'status', jobId: 1, status: 'exploded' }).refetch).toBe(true);
  });
});
