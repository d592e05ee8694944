/**
 * The project stands alone: no file of it reads (or tells a reader to look at) a path outside
 * the repository — data, references and notes all live in the repo (tests/data, docs/).
 * The checker is heuristic, so its own cases below show each rule catching what it should.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { findOutsidePaths, projectFiles } from '../../support/outside-paths';

const ROOT = path.resolve(__dirname, '..', '..', '..');
const at = (rel: string) => path.join(ROOT, rel);
const check = (rel: string, text: string) => findOutsidePaths(ROOT, at(rel), text).map((f) => f.text);

describe('the checker catches each way out', () => {
  test('absolute paths to a shared folder, a home or a temp folder', () => {
    expect(check('tests/unit/x.test.ts', "const DATA = '/srv/team/data';")).toEqual(['/srv/team/data']);
    expect(check('server/a.ts', 'readFileSync("/home/me/g.txt")')).toEqual(['/home/me/g.txt']);
    expect(check('DEVELOPERS.md', 'see /mnt/team/references.md.')).toEqual(['/mnt/team/references.md']);
    // system programs and the repo's own paths pass
    expect(check('tests/support/browser.ts', "executablePath: '/usr/bin/chromium'")).toEqual([]);
    expect(check('server/app.ts', "app.get('/api/health')")).toEqual([]);
  });

  test('relative imports and string paths that climb above the repository', () => {
    expect(check('tests/unit/classical/x.test.ts', "import { a } from '../../../../team-notes/data/load';")).toHaveLength(1);
    expect(check('tests/unit/classical/x.test.ts', "import { a } from '../../../shared/engine/random';")).toEqual([]);
    expect(check('server/cli/main.ts', "require('../../../notes/x')")).toHaveLength(1);
  });

  test('path.join / path.resolve chains from __dirname or the repo root', () => {
    expect(check('tests/bench/x.ts', "path.join(__dirname, '..', '..', '..', 'shared', 'data')")).toHaveLength(1);
    expect(check('tests/bench/x.ts', "path.join(__dirname, '../../docs/benchmarks.md')")).toEqual([]);
    expect(check('tests/bench/x.ts', "path.resolve(ROOT, '..', 'shared')")).toHaveLength(1);
    expect(check('tests/bench/x.ts', "path.resolve(process.cwd(), '../shared-data')")).toHaveLength(1);
  });

  test('Markdown links and code spans, shell dirname chains', () => {
    expect(check('DEVELOPERS.md', 'an open dataset (`../shared/data`)')).toEqual(['../shared/data']);
    expect(check('docs/cli.md', 'see [the data](../../shared/data/README.md)')).toHaveLength(1);
    expect(check('docs/cli.md', 'see [the data](../tests/data/README.md) and `../README.md`')).toEqual([]);
    expect(check('server/scripts/x.sh', 'ROOT="$(cd "$(dirname "$0")/../../.." && pwd)"')).toHaveLength(1);
    expect(check('server/scripts/x.sh', 'ROOT="$(cd "$(dirname "$0")/../.." && pwd)"')).toEqual([]);
  });
});

/** Mentions that are not reads (file, path prefix, why); each must still occur, or it goes. */
const NOT_READS: Array<[file: string, prefix: string, why: string]> = [
  ['server/migrations/20261202-0600-job-errors-without-paths.ts', '/srv/', 'comment: what old error texts looked like'],
  ['tests/api/job-error-migration.test.ts', '/srv/spinyard/', 'sample error texts that carry server paths'],
  ['metro.config.js', '../locales/index.js', "a module name inside zod's package that the resolver swaps, not a path of ours"],
];

test('no file of the project points outside the repository', () => {
  const files = projectFiles(ROOT).filter((f) => f !== __filename);
  expect(files.length).toBeGreaterThan(300); // the walk really saw the project
  const found = files.flatMap((f) => findOutsidePaths(ROOT, f, fs.readFileSync(f, 'utf8')));
  const excused = (f: { file: string; text: string }) => NOT_READS.find(([file, prefix]) => f.file === file && f.text.startsWith(prefix));
  expect(found.filter((f) => !excused(f)).map((f) => `${f.file}:${f.line} ${f.text} (${f.why})`)).toEqual([]);
  const stale = NOT_READS.filter(([file, prefix]) => !found.some((f) => f.file === file && f.text.startsWith(prefix)));
  expect(stale).toEqual([]);
});
