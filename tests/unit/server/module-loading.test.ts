/**
 * Project TypeScript loads one way everywhere: as CommonJS (tsx's require hook in the CLI and in
 * worker threads, jest's transform here). Dynamic import() of project files worked in jest and
 * failed as deployed ("Cannot find module …/classical/threads/pool"), because Node 20 applies no
 * TypeScript loader hooks to import() in worker threads or under tsx/cjs/api
 * (nodejs/node#47747). So: no import() in code that runs on Node, and the deployed paths — a
 * solve thread as the worker process starts it, the CLI as a child process — run the solvers
 * that start further threads (milp, tabu with threads: 2).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import ts from 'typescript';
import { createThreadSlot, type ThreadSlot } from '../../../server/workers/thread-slot';
import type { NetworkDocument } from '../../../shared/engine/network/types';

const ROOT = path.resolve(__dirname, '../../..');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return name === 'node_modules' ? [] : sourceFiles(full);
    return /\.tsx?$/.test(name) && !name.endsWith('.d.ts') ? [full] : [];
  });
}

/** Every `import(…)` call expression (not `typeof import('…')` types) in a file. */
function importCalls(file: string): string[] {
  const sf = ts.createSourceFile(file, readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true);
  const found: string[] = [];
  const visit = (node: ts.Node): void => {
    if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword) {
      found.push(`${path.relative(ROOT, file)}:${sf.getLineAndCharacterOfPosition(node.getStart()).line + 1}`);
    }
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return found;
}

// Two triangles joined by one heavy lane, plus a chord: small enough for every solver.
const DOC: NetworkDocument = {
  depots: ['A', 'B', 'C', 'D', 'E', 'F'].map((id) => ({ id })),
  lanes: [['A', 'B', 1], ['B', 'C', 1], ['C', 'A', 1], ['D', 'E', 1], ['E', 'F', 1], ['F', 'D', 1], ['C', 'D', 5], ['A', 'F', 2]].map(([from, to, weight]) => ({ from: String(from), to: String(to), weight: Number(weight) })),
};
// The max-cut optimum, by enumerating all 64 assignments here.
function bestCut(): number {
  let best = 0;
  const ids = DOC.depots.map((d) => d.id);
  for (let mask = 0; mask < 1 << ids.length; mask++) {
    const side = (id: string) => (mask >> ids.indexOf(id)) & 1;
    best = Math.max(best, DOC.lanes.reduce((s, l) => s + (side(l.from) !== side(l.to) ? l.weight : 0), 0));
  }
  return best;
}

describe('module loading as deployed', () => {
  test('no dynamic import() in shared/ or server/ (project code loads through require)', () => {
    const calls = [...sourceFiles(path.join(ROOT, 'shared')), ...sourceFiles(path.join(ROOT, 'server'))].flatMap(importCalls);
    expect(calls).toEqual([]);
  });

  describe('a solve thread started the way the worker process starts it', () => {
    let slot: ThreadSlot;
    beforeAll(() => { slot = createThreadSlot(); });
    afterAll(() => slot.close());

    test.each([
      ['milp', {}],
      ['tabu', { threads: 2 }],
      ['exact', { threads: 2 }],
    ])('%s %j finds the optimum max-cut', async (solver, settings) => {
      const run = slot.run(
        { document: DOC, problem: { kind: 'maxcut' }, solver, settings, seed: 3, timeLimitSeconds: 2 },
        { hardLimitMs: 60_000, onProgress: () => {} },
      );
      const outcome = await run.outcome;
      expect(outcome).toMatchObject({ kind: 'done', cancelled: false });
      if (outcome.kind === 'done') expect(outcome.result.value).toBe(bestCut());
    }, 120_000); // a fresh thread compiles the engine first; slow on a shared machine
  });

  test('the statevector thread runner under tsx gives the single-thread amplitudes', () => {
    const r = spawnSync(path.join(ROOT, 'node_modules/.bin/tsx'), ['tests/support/threads/parallel-layers-check.ts'], { cwd: ROOT, encoding: 'utf8', timeout: 90_000 });
    expect(r.stderr).toBe('');
    expect(JSON.parse(r.stdout)).toEqual({ differ: 0, values: 2 * 2 ** 13 });
  }, 120_000);

  test('the CLI as a child process runs milp', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'spinyard-load-'));
    writeFileSync(path.join(dir, 'lanes.csv'), `from,to,weight\n${DOC.lanes.map((l) => `${l.from},${l.to},${l.weight}`).join('\n')}\n`);
    const r = spawnSync(process.execPath, [path.join(ROOT, 'server/cli/spinyard.cjs'), 'solve', 'lanes.csv', '--solver', 'milp', '--time-limit', '2', '--json', '--no-bounds'], { cwd: dir, encoding: 'utf8', timeout: 90_000 });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ value: bestCut() });
  }, 120_000);
});
