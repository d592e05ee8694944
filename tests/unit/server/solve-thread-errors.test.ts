/**
 * Job errors are shown to every member of an organisation (viewers too), so they never carry
 * file paths or stack text: our own faults get a fixed sentence and their details go to the
 * worker's log (outcome.detail); input problems keep their explanation.
 */
import path from 'node:path';
import { createThreadSlot, type SlotOutcome, type ThreadSlot } from '../../../server/workers/thread-slot';
import { INTERNAL_ERROR } from '../../../server/workers/solve-task';
import type { SolveTask } from '../../../server/workers/solve-task';

const ROOT = path.resolve(__dirname, '../../..');
/** A path of this checkout or a stack frame ("at fn (file:line:col)"). */
const LEAK = new RegExp(`${ROOT.replace(/[/\\.]/g, '\\$&')}|\\bat .+:\\d+:\\d+|node_modules|\\.ts\\b|\\.cjs\\b`);

const DOC = { depots: [{ id: 'A' }, { id: 'B' }, { id: 'C' }], lanes: [{ from: 'A', to: 'B', weight: 2 }, { from: 'B', to: 'C', weight: 1 }] };
const task = (over: Partial<Omit<SolveTask, 'cancelFlag' | 'optimumFlag'>>): Omit<SolveTask, 'cancelFlag' | 'optimumFlag'> => ({
  document: DOC, problem: { kind: 'maxcut' }, solver: 'tabu', settings: {}, seed: 1, timeLimitSeconds: 1, ...over,
});
const run = (slot: ThreadSlot, t: Omit<SolveTask, 'cancelFlag' | 'optimumFlag'>): Promise<SlotOutcome> => slot.run(t, { hardLimitMs: 60_000, onProgress: () => {} }).outcome;

describe('solve-thread errors as members see them', () => {
  let slot: ThreadSlot;
  beforeAll(() => { slot = createThreadSlot(); });
  afterAll(() => slot.close());

  test('a fault of ours: fixed sentence for members, the stack for the log', async () => {
    // A null question makes the binding code throw a TypeError: a fault of ours, not of the input.
    const o = await run(slot, task({ problem: null as never }));
    expect(o).toMatchObject({ kind: 'error', userError: false, message: INTERNAL_ERROR });
    if (o.kind !== 'error') return;
    expect(o.message).not.toMatch(LEAK);
    expect(o.detail).toMatch(LEAK); // the log keeps where it happened
  }, 120_000);

  test('an input problem keeps its explanation (and has no paths either)', async () => {
    const o = await run(slot, task({ solver: 'no-such-solver' }));
    expect(o).toMatchObject({ kind: 'error', userError: true, message: expect.stringContaining('unknown solver "no-such-solver"') });
    if (o.kind === 'error') expect(o.message).not.toMatch(LEAK);
  }, 120_000);

  test('a crashed thread: members see that it crashed, the log gets the error text', async () => {
    const crashing = createThreadSlot(path.join(ROOT, 'tests/support/threads/crashing-thread.cjs'));
    try {
      const o = await run(crashing, task({}));
      expect(o).toMatchObject({ kind: 'killed', reason: 'crash' });
      if (o.kind !== 'killed') return;
      expect(o.message).not.toMatch(LEAK);
      expect(o.detail).toContain('no-such-module');
    } finally {
      await crashing.close();
    }
  }, 120_000);
});
