import type { NetworkDocument } from '../engine/network/types';
import { emptyResult, finishNetwork, readNumber, sizeIssue, type DraftNetwork } from './finish';
import type { FormatIssue, ParseResult, SourcePosition } from './types';

/**
 * Plain edge list, the layout of the academic max-cut benchmarks (G-set, Biq Mac):
 *   n m          first line: depot count and lane count
 *   i j w        one lane per line, depots numbered 1…n
 * Depots get ids "1"…"n". Blank lines, trailing spaces and `#` comments are tolerated.
 * Signed weights are valid (±1 instances). A line with only `i j` is read as weight 1.
 */
export function parseEdgeList(content: string, file?: string): ParseResult {
  const tooBig = sizeIssue(content, file);
  if (tooBig) return emptyResult([tooBig]);
  const issues: FormatIssue[] = [];
  const at = (line: number): SourcePosition => (file !== undefined ? { file, line } : { line });
  const issue = (line: number, message: string, severity: FormatIssue['severity'] = 'error') =>
    issues.push({ ...at(line), severity, message });

  const lines = content.split(/\r\n|\n|\r/);
  let n = -1, declared = -1, headerLine = 0;
  const draft: DraftNetwork = { depots: [], depotAt: [], lanes: [], laneAt: [] };
  let unweighted = 0, firstUnweighted = 0, extra = 0, firstExtra = 0;

  for (let k = 0; k < lines.length; k++) {
    const lineNo = k + 1;
    const hash = lines[k].indexOf('#');
    const text = (hash >= 0 ? lines[k].slice(0, hash) : lines[k]).trim();
    if (text === '') continue;
    const cols = text.split(/\s+/);
    if (n < 0) {
      headerLine = lineNo;
      if (cols.length < 2 || !/^\d+$/.test(cols[0]) || !/^\d+$/.test(cols[1])) {
        issue(lineNo, `the first line must give the depot and lane counts as "n m" (two whole numbers), found "${text.slice(0, 40)}"; add a header such as "4 5"`);
        return emptyResult(issues);
      }
      n = Number(cols[0]);
      declared = Number(cols[1]);
      if (cols.length > 2) issue(lineNo, `the header has ${cols.length} fields; only "n m" is read, the rest is ignored`, 'warning');
      if (n > 1_000_000) {
        issue(lineNo, `the header declares ${n} depots; that is far above the import limit, check the header`);
        return emptyResult(issues);
      }
      for (let i = 1; i <= n; i++) {
        draft.depots.push({ id: String(i) });
        draft.depotAt.push(at(lineNo));
      }
      continue;
    }
    if (cols.length < 2) {
      issue(lineNo, `a lane line needs "i j w" (two depot numbers and a weight), found "${text.slice(0, 40)}"; complete or remove the line`);
      continue;
    }
    let ok = true;
    const ends: number[] = [];
    for (const c of cols.slice(0, 2)) {
      if (!/^\d+$/.test(c)) {
        issue(lineNo, `depot number "${c}" is not a whole number; depots are numbered 1…${n}`);
        ok = false;
      } else {
        const v = Number(c);
        if (v < 1 || v > n) {
          issue(lineNo, `depot number ${c} is outside 1…${n} declared in the header (line ${headerLine}); fix the number or the header`);
          ok = false;
        }
        ends.push(v);
      }
    }
    let weight = 1;
    if (cols.length >= 3) {
      const w = readNumber(cols[2], 'weight', '1');
      if (typeof w === 'number') weight = w;
      else { issue(lineNo, w.problem); ok = false; }
      if (cols.length > 3 && extra++ === 0) firstExtra = lineNo;
    } else if (unweighted++ === 0) firstUnweighted = lineNo;
    if (!ok) continue;
    draft.lanes.push({ from: String(ends[0]), to: String(ends[1]), weight });
    draft.laneAt.push(at(lineNo));
  }

  if (n < 0) {
    issues.push({ ...(file ? { file } : {}), severity: 'error', message: 'the file is empty; an edge list starts with "n m" followed by one "i j w" line per lane' });
    return emptyResult(issues);
  }
  if (unweighted > 0) issue(firstUnweighted, `${unweighted} lane line(s) have no weight and count as weight 1; add a third column to set weights`, 'warning');
  if (extra > 0) issue(firstExtra, `${extra} lane line(s) have more than three fields; only "i j w" is read`, 'warning');
  const lanesRead = countLaneLines(lines);
  if (lanesRead !== declared) {
    issue(headerLine, `the header declares ${declared} lanes but the file has ${lanesRead} lane lines; restore the missing lines or correct the header to "${n} ${lanesRead}"`);
  }
  return finishNetwork(draft, issues, { rejectNegativeWeights: false });
}

/** Non-blank, non-comment lines after the header (bad ones included: they are lanes meant). */
function countLaneLines(lines: string[]): number {
  let count = -1;
  for (const raw of lines) {
    const hash = raw.indexOf('#');
    if ((hash >= 0 ? raw.slice(0, hash) : raw).trim() !== '') count++;
  }
  return Math.max(0, count);
}

/**
 * Writes the edge-list layout. Depots are numbered by their position (1…n); ids, names and
 * coordinates are not representable and are dropped.
 */
export function writeEdgeList(doc: NetworkDocument): string {
  const index = new Map(doc.depots.map((d, i) => [d.id, i + 1]));
  const out = [`${doc.depots.length} ${doc.lanes.length}`];
  for (const l of doc.lanes) out.push(`${index.get(l.from)} ${index.get(l.to)} ${l.weight}`);
  return out.join('\n') + '\n';
}
