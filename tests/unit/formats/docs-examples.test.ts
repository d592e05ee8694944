/** The format examples in docs/cli.md must read without a single issue. */
import { readFileSync } from 'fs';
import path from 'path';
import { parseCsvNetwork, parseEdgeList, parseGeojson, parseGraphml, parseNetworkJson } from '../../../shared/formats';

const doc = readFileSync(path.resolve(__dirname, '../../../docs/cli.md'), 'utf8');

/** Fenced code blocks under the `### <title>` heading (up to the next heading). */
function blocks(title: string): string[] {
  const start = doc.indexOf(`### ${title}`);
  expect(start).toBeGreaterThan(0);
  const rest = doc.slice(start + 4);
  const section = rest.slice(0, rest.search(/\n##/) >= 0 ? rest.search(/\n##/) : undefined);
  return [...section.matchAll(/```[a-z]*\n([\s\S]*?)```/g)].map((m) => m[1]);
}

test.each([
  ['Edge list', (b: string[]) => parseEdgeList(b[0]), 3, 3],
  ['CSV', (b: string[]) => parseCsvNetwork({ content: b[0] }, { content: b[1] }), 3, 2],
  ['Spinyard network document', (b: string[]) => parseNetworkJson(b[0]), 2, 1],
  ['GraphML', (b: string[]) => parseGraphml(b[0]), 2, 1],
  ['GeoJSON', (b: string[]) => parseGeojson(b[0]), 2, 1],
] as const)('the %s example in docs/cli.md reads cleanly', (title, parse, depots, lanes) => {
  const { document, issues } = parse(blocks(title));
  expect(issues).toEqual([]);
  expect(document.depots).toHaveLength(depots);
  expect(document.lanes).toHaveLength(lanes);
});
