import { readFileSync, statSync } from 'node:fs';
import { buildCompactNetwork } from '../../shared/engine/network/build';
import type { CompactNetwork, NetworkDocument } from '../../shared/engine/network/types';
import { bindProblem } from '../../shared/engine/problem/bind';
import { isRegionCount, MAX_REGIONS, MIN_REGIONS } from '../../shared/engine/problem/limits';
import type { Problem, ProblemKind } from '../../shared/engine/problem/types';
import { formatIssue, MAX_FILE_BYTES, readNetwork, type FormatIssue, type NetworkFormat } from '../../shared/formats';

/** A mistake the user can fix: printed as "spinyard: <message>", exit code 2. */
export class UserError extends Error {
  constructor(message: string, public readonly details: string[] = []) {
    super(message);
    this.name = 'UserError';
  }
}

export function readText(file: string): string {
  let size: number;
  try {
    size = statSync(file).size;
  } catch {
    throw new UserError(`cannot read ${file}: no such file; check the path`);
  }
  if (size > MAX_FILE_BYTES) {
    throw new UserError(`${file}: the file is ${(size / 2 ** 20).toFixed(1)} MB; the limit is ${(MAX_FILE_BYTES / 2 ** 20).toFixed(1)} MB: split the network into regions`);
  }
  try {
    return readFileSync(file, 'utf8');
  } catch (e) {
    throw new UserError(`cannot read ${file}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`);
  }
}

export interface LoadedNetwork {
  document: NetworkDocument;
  network: CompactNetwork;
  warnings: FormatIssue[];
}

/** Reads and checks a network file; any error in it becomes one UserError listing the lines. */
export function loadNetwork(file: string, options: { depots?: string; format?: NetworkFormat }): LoadedNetwork {
  const content = readText(file);
  const depots = options.depots !== undefined ? { name: options.depots, content: readText(options.depots) } : undefined;
  const { document, issues } = readNetwork(file, content, { ...(options.format ? { format: options.format } : {}), ...(depots ? { depots } : {}) });
  const errors = issues.filter((i) => i.severity === 'error');
  if (errors.length > 0) {
    const shown = errors.slice(0, 10).map(formatIssue);
    const more = errors.length > 10 ? [`… and ${errors.length - 10} more error(s)`] : [];
    throw new UserError(shown[0], [...shown.slice(1), ...more]);
  }
  return { document, network: buildCompactNetwork(document), warnings: issues.filter((i) => i.severity === 'warning') };
}

export interface ProblemFlags {
  problem: string;
  k?: string;
  tolerance?: string;
  pins: string[];
}

const KINDS: ProblemKind[] = ['maxcut', 'bisection', 'kway'];

export function numberFlag(name: string, raw: string | undefined, check: (v: number) => boolean, expectation: string): number | undefined {
  if (raw === undefined) return undefined;
  const v = Number(raw);
  if (raw.trim() === '' || !Number.isFinite(v) || !check(v)) throw new UserError(`--${name} ${raw}: expected ${expectation}`);
  return v;
}

/** Binds --problem/--k/--tolerance/--pin to the network (ProblemError messages pass through). */
export function problemFrom(network: CompactNetwork, flags: ProblemFlags): Problem {
  if (!KINDS.includes(flags.problem as ProblemKind)) throw new UserError(`--problem ${flags.problem}: choose one of ${KINDS.join(', ')}`);
  const kind = flags.problem as ProblemKind;
  const k = numberFlag('k', flags.k, isRegionCount, `a whole number of regions (${MIN_REGIONS}…${MAX_REGIONS})`);
  if (k !== undefined && kind !== 'kway') throw new UserError(`--k only applies to --problem kway (regions); max-cut and bisection have 2 sides`);
  const tolerance = numberFlag('tolerance', flags.tolerance, (v) => v >= 0, 'a share of the total depot weight, e.g. 0.05');
  const pins: Record<string, number> = {};
  for (const pin of flags.pins) {
    const eq = pin.lastIndexOf('=');
    const id = pin.slice(0, eq), side = Number(pin.slice(eq + 1));
    if (eq <= 0 || pin.slice(eq + 1).trim() === '' || !Number.isInteger(side)) throw new UserError(`--pin ${pin}: write ID=SIDE, e.g. --pin Hub=0`);
    pins[id] = side;
  }
  try {
    return bindProblem(network, { kind, ...(k !== undefined ? { k } : {}), ...(tolerance !== undefined ? { tolerance } : {}), pins });
  } catch (e) {
    if (e instanceof Error && e.name === 'ProblemError') throw new UserError(e.message);
    throw e;
  }
}
