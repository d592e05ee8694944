/**
 * No import cycles anywhere in the project: app, components, server, shared and the tests.
 * The check is dpdm's (an independent, widely used npm package): it parses every file with the
 * TypeScript compiler and follows static imports, re-exports, require() and dynamic import(),
 * type-only imports included, so a cycle cannot hide behind a lazy require.
 */
import { execFileSync } from 'node:child_process';
import * as path from 'node:path';

const root = path.resolve(__dirname, '../../..');

/**
 * dpdm's cycles for the given globs, one "a -> b -> c" string each. Run in a plain node child:
 * dpdm's dependencies are ES modules, which jest's CommonJS runtime cannot load.
 */
function cyclesOf(globs: string[], exclude: string): string[] {
  const script = `
    const { parseDependencyTree, parseCircular } = require('dpdm');
    parseDependencyTree(${JSON.stringify(globs)}, { cwd: process.cwd(), context: process.cwd(), exclude: new RegExp(${JSON.stringify(exclude)}), transform: false, skipDynamicImports: false })
      .then((tree) => process.stdout.write(JSON.stringify({ files: Object.keys(tree).length, cycles: parseCircular(tree).map((c) => c.join(' -> ')) })));`;
  const out = JSON.parse(execFileSync(process.execPath, ['-e', script], { cwd: root, encoding: 'utf8' })) as { files: number; cycles: string[] };
  expect(out.files).toBeGreaterThan(1); // the globs found files
  return out.cycles;
}


test('the project has no import cycles (dpdm)', () => {
  // The fixtures below hold a deliberate cycle for the second test.
  const cycles = cyclesOf(['app/**/*.{ts,tsx}', 'components/**/*.{ts,tsx}', 'server/**/*.ts', 'shared/**/*.ts', 'tests/**/*.{ts,tsx}'], 'node_modules|tests/unit/structure/fixtures');
  expect(cycles).toEqual([]);
}, 120_000);

test('the check sees a cycle hidden behind require() (so an empty list above means something)', () => {
  expect(cyclesOf(['tests/unit/structure/fixtures/cycle-a.ts'], 'node_modules')).toEqual(['tests/unit/structure/fixtures/cycle-a.ts -> tests/unit/structure/fixtures/cycle-b.ts']);
}, 60_000);
