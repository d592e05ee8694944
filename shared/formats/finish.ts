import { checkNetwork } from '../engine/network/build';
import type { Depot, Lane, NetworkDocument } from '../engine/network/types';
import { MAX_DEPOTS, MAX_FILE_BYTES, MAX_LANES, type FormatIssue, type ParseResult, type SourcePosition } from './types';

/** Rows a parser accepted syntactically, each with the place it came from. */
export interface DraftNetwork {
  name?: string;
  depots: Depot[];
  /** Same length as depots. */
  depotAt: SourcePosition[];
  lanes: Lane[];
  /** Same length as lanes. */
  laneAt: SourcePosition[];
}

export interface FinishOptions {
  /**
   * Business imports (CSV, GeoJSON, GraphML) carry freight volumes, which cannot be negative.
   * Benchmark formats (edge list, our JSON document) allow signed weights: the ±1 max-cut
   * instances of the G-set and Biq Mac libraries need them.
   */
  rejectNegativeWeights: boolean;
  /** Word used in messages for a lane weight ("volume" reads better for business files). */
  weightWord?: string;
}

/** The issue fields that locate a row. */
export function locate(at: SourcePosition | undefined): Pick<FormatIssue, 'file' | 'line' | 'feature' | 'row'> {
  if (!at) return {};
  const out: Pick<FormatIssue, 'file' | 'line' | 'feature' | 'row'> = {};
  if (at.file !== undefined) out.file = at.file;
  if (at.line !== undefined) out.line = at.line;
  else if (at.feature !== undefined) out.feature = at.feature;
  else if (at.row !== undefined) out.row = at.row;
  return out;
}

/**
 * Shared last step of every parser: business rules on weights, the row checks of
 * `checkNetwork` (the one place those rules live), parallel-lane and size warnings.
 * Rows that fail are reported and left out of the returned document.
 */
export function finishNetwork(draft: DraftNetwork, issues: FormatIssue[], options: FinishOptions): ParseResult {
  let depots = draft.depots, depotAt = draft.depotAt;
  let lanes = draft.lanes, laneAt = draft.laneAt;
  const word = options.weightWord ?? 'weight';

  if (options.rejectNegativeWeights) {
    const keep: number[] = [];
    lanes.forEach((l, e) => {
      if (l.weight < 0) {
        issues.push({
          ...locate(laneAt[e]), where: 'lanes', severity: 'error',
          message: `lane ${l.from}–${l.to} has ${word} ${l.weight}; freight volumes must be ≥ 0 (signed weights are only for max-cut benchmark files: use the edge-list or JSON format for those)`,
        });
      } else keep.push(e);
    });
    if (keep.length !== lanes.length) {
      lanes = keep.map((e) => draft.lanes[e]);
      laneAt = keep.map((e) => draft.laneAt[e]);
    }
  }

  // Dropping a bad depot can orphan lanes, which the next pass then reports; two passes settle it.
  const droppedIds = new Set<string>();
  for (let pass = 0; pass < 3; pass++) {
    const found = checkNetwork({ depots, lanes });
    if (found.length === 0) break;
    const badDepots = new Set<number>();
    const badLanes = new Set<number>();
    for (const f of found) {
      const at = f.where === 'depots' ? depotAt[f.row - 1] : laneAt[f.row - 1];
      let message = f.message;
      if (f.where === 'lanes') {
        if (badLanes.has(f.row - 1)) continue; // one message per lane is enough
        const l = lanes[f.row - 1];
        const orphan = [l.from, l.to].find((id) => droppedIds.has(id));
        if (orphan !== undefined) message = `lane ${l.from}–${l.to} uses depot "${orphan}", which was left out because of its own error; fix that depot's row`;
      } else {
        const id = depots[f.row - 1].id;
        // A repeated id keeps its first row, so lanes to it stay valid.
        if (!message.includes('appears twice') && typeof id === 'string') droppedIds.add(id);
      }
      issues.push({ ...locate(at), where: f.where, severity: 'error', message });
      (f.where === 'depots' ? badDepots : badLanes).add(f.row - 1);
    }
    const keepD = depots.map((_, i) => i).filter((i) => !badDepots.has(i));
    const keepL = lanes.map((_, i) => i).filter((i) => !badLanes.has(i));
    const d0 = depots, da0 = depotAt, l0 = lanes, la0 = laneAt;
    depots = keepD.map((i) => d0[i]);
    depotAt = keepD.map((i) => da0[i]);
    lanes = keepL.map((i) => l0[i]);
    laneAt = keepL.map((i) => la0[i]);
  }

  const pairs = new Map<string, number>();
  let parallel = 0, firstParallel = -1;
  lanes.forEach((l, e) => {
    const key = l.from < l.to ? `${l.from}\u0000${l.to}` : `${l.to}\u0000${l.from}`;
    if (pairs.has(key)) {
      parallel++;
      if (firstParallel < 0) firstParallel = e;
    } else pairs.set(key, e);
  });
  if (parallel > 0) {
    const l = lanes[firstParallel];
    issues.push({
      ...locate(laneAt[firstParallel]), where: 'lanes', severity: 'warning',
      message: `${parallel} lane(s) repeat a depot pair already listed (first: ${l.from}–${l.to}); their ${word}s are added together — remove the repeats if that is not intended`,
    });
  }

  const file = draft.depotAt[0]?.file ?? draft.laneAt[0]?.file;
  if (depots.length === 0 && !issues.some((i) => i.severity === 'error')) {
    issues.push({ ...(file ? { file } : {}), severity: 'error', message: 'no depots found; a network needs at least two depots joined by a lane' });
  }
  if (depots.length > MAX_DEPOTS) {
    issues.push({ ...(file ? { file } : {}), severity: 'error', message: `the network has ${depots.length} depots; the limit is ${MAX_DEPOTS}: split it into regions and import them separately` });
  }
  if (lanes.length > MAX_LANES) {
    issues.push({ ...(file ? { file } : {}), severity: 'error', message: `the network has ${lanes.length} lanes; the limit is ${MAX_LANES}: merge small lanes or split the network` });
  }

  const document: NetworkDocument = { depots, lanes };
  if (draft.name !== undefined) document.name = draft.name;
  return { document, issues: sortIssues(issues) };
}

/** Errors first, then by file and position, so the first line printed is the one to fix first. */
function sortIssues(issues: FormatIssue[]): FormatIssue[] {
  // Rows (JSON, GraphML without positions) sort depots before lanes; lines and features by place.
  const pos = (i: FormatIssue) => i.line ?? i.feature ?? (i.row !== undefined ? (i.where === 'lanes' ? 1e9 : 0) + i.row : -1);
  return issues
    .map((issue, k) => ({ issue, k }))
    .sort((a, b) =>
      (a.issue.severity === b.issue.severity ? 0 : a.issue.severity === 'error' ? -1 : 1) ||
      (a.issue.file ?? '').localeCompare(b.issue.file ?? '') ||
      pos(a.issue) - pos(b.issue) || a.k - b.k)
    .map((x) => x.issue);
}

/** UTF-8 size of a string without allocating a copy. */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff) { bytes += 4; i++; }
    else bytes += 3;
  }
  return bytes;
}

/** An error when the content is over the size limit (checked before any parsing). */
export function sizeIssue(content: string, file?: string): FormatIssue | null {
  if (content.length <= MAX_FILE_BYTES / 4) return null; // cannot exceed the limit: skip the count
  const bytes = utf8Length(content);
  if (bytes <= MAX_FILE_BYTES) return null;
  const mb = (x: number) => (x / (1024 * 1024)).toFixed(1);
  return { ...(file ? { file } : {}), severity: 'error', message: `the file is ${mb(bytes)} MB; the limit is ${mb(MAX_FILE_BYTES)} MB: split the network into regions and import them separately` };
}

export const emptyResult = (issues: FormatIssue[]): ParseResult => ({ document: { depots: [], lanes: [] }, issues });

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads a number written in a text cell. Returns the number, or a message saying what is wrong
 * and what to write instead (so every format words it the same way).
 */
export function readNumber(raw: string, what: string, example = '12.5'): number | { problem: string } {
  const text = raw.trim();
  if (text === '') return { problem: `${what} is empty; write a number such as ${example}` };
  if (DECIMAL.test(text)) {
    const v = Number(text);
    if (Number.isFinite(v)) return v;
    return { problem: `${what} "${text}" is too large to be finite; use a number such as ${example}` };
  }
  if (/^[+-]?\d+,\d+$/.test(text)) return { problem: `${what} "${text}" uses a decimal comma; write it with a point, such as ${text.replace(',', '.')}` };
  if (/^[+-]?(inf(inity)?|nan)$/i.test(text)) return { problem: `${what} "${text}" is not a finite number; use a number such as ${example}` };
  return { problem: `${what} "${text}" is not a number; use a number such as ${example}` };
}
