/**
 * Spinyard's own file format for a custom operator (a weighted sum of Pauli strings), in a
 * plain-text and an equivalent JSON form.
 *
 * Text:
 *   spinyard-operator 1          ← header: format name and version
 *   qubits 8
 *   offset -1.5                  ← optional, at most once
 *   # comment lines and trailing "# …" are ignored
 *   0.5   Z0 Z3 X5               ← coefficient, then letter+qubit for each non-identity factor
 *   -2    Y1
 *   0.25                         ← a bare coefficient adds to the offset
 * JSON:
 *   { "format": "spinyard-operator", "version": 1, "qubits": 8, "offset": -1.5,
 *     "terms": [{ "coeff": 0.5, "ops": "Z0 Z3 X5" }] }
 *
 * Readers never throw on bad input: they return issues that say where (line, or JSON path), what
 * is wrong and how to fix it.
 */
import type { PauliSum, PauliTerm } from './types';

export const OPERATOR_FORMAT = 'spinyard-operator';
export const OPERATOR_VERSION = 1;
export const MAX_OPERATOR_QUBITS = 30;

export interface OperatorIssue {
  /** 1-based line (text form). */
  line?: number;
  /** Location inside the JSON form, e.g. "terms[2].ops". */
  path?: string;
  /** Full message including the location, e.g. 'line 4: qubit 9 is outside 0…7; …'. */
  message: string;
}

export type OperatorParse = { ok: true; operator: PauliSum; issues: [] } | { ok: false; issues: OperatorIssue[] };

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

const parseNumber = (tok: string): number | null => (NUMBER.test(tok) ? Number(tok) : null);

/**
 * Factors like "Z0 Z3 X5" → letters string, or an error text (without location).
 * Accepts lower-case letters; an empty list is the identity.
 */
function parseFactors(tokens: string[], numQubits: number): { letters: string } | { error: string } {
  const letters = 'I'.repeat(numQubits).split('');
  const seen = new Map<number, string>();
  for (const tok of tokens) {
    const m = /^([A-Za-z])(\d+)$/.exec(tok);
    if (!m) {
      return { error: `cannot read "${tok}" as a Pauli factor; write a letter X, Y or Z followed by the qubit index, e.g. Z3` };
    }
    const letter = m[1].toUpperCase();
    if (letter === 'I') continue;
    if (letter !== 'X' && letter !== 'Y' && letter !== 'Z') {
      return { error: `unknown Pauli letter "${m[1]}" in "${tok}"; use X, Y or Z (identity factors need no letter)` };
    }
    const q = Number(m[2]);
    if (q >= numQubits) return { error: `qubit ${q} is outside 0…${numQubits - 1}; raise "qubits" or fix the index` };
    const prev = seen.get(q);
    if (prev !== undefined) {
      return { error: `qubit ${q} appears twice in one term ("${prev}" and "${tok}"); give each qubit at most one letter per term` };
    }
    seen.set(q, tok);
    letters[q] = letter;
  }
  return { letters: letters.join('') };
}

function finish(numQubits: number, offset: number, terms: PauliTerm[]): PauliSum {
  return { numQubits, offset, terms };
}

export function parseOperatorText(text: string): OperatorParse {
  const issues: OperatorIssue[] = [];
  const add = (line: number, msg: string) => issues.push({ line, message: `line ${line}: ${msg}` });
  const lines = text.split(/\r?\n/);
  let sawHeader = false;
  let numQubits: number | null = null;
  let offset = 0;
  let offsetLine = 0;
  const terms: PauliTerm[] = [];
  for (let i = 0; i < lines.length; i++) {
    const lineNo = i + 1;
    const body = lines[i].replace(/#.*$/, '').trim();
    if (body === '') continue;
    const tokens = body.split(/\s+/);
    if (!sawHeader) {
      sawHeader = true;
      if (tokens[0] !== OPERATOR_FORMAT) {
        add(lineNo, `expected the header "${OPERATOR_FORMAT} ${OPERATOR_VERSION}" as the first line, found "${body}"`);
        return { ok: false, issues };
      }
      if (tokens.length !== 2 || tokens[1] !== String(OPERATOR_VERSION)) {
        add(lineNo, `unsupported version "${tokens.slice(1).join(' ')}"; this reader understands "${OPERATOR_FORMAT} ${OPERATOR_VERSION}"`);
        return { ok: false, issues };
      }
      continue;
    }
    const key = tokens[0].toLowerCase();
    if (key === 'qubits') {
      const v = tokens.length === 2 ? parseNumber(tokens[1]) : null;
      if (numQubits !== null) add(lineNo, '"qubits" is given twice; keep one');
      else if (v === null || !Number.isInteger(v) || v < 1 || v > MAX_OPERATOR_QUBITS) {
        add(lineNo, `"qubits" needs a whole number from 1 to ${MAX_OPERATOR_QUBITS}, got "${tokens.slice(1).join(' ')}"`);
        return { ok: false, issues };
      } else if (terms.length > 0) add(lineNo, '"qubits" must come before the first term');
      else numQubits = v;
      continue;
    }
    if (key === 'offset') {
      const v = tokens.length === 2 ? parseNumber(tokens[1]) : null;
      if (offsetLine) add(lineNo, `"offset" is given twice (first on line ${offsetLine}); keep one or add the values`);
      else if (v === null) add(lineNo, `"offset" needs one number, got "${tokens.slice(1).join(' ')}"`);
      else {
        offset += v;
        offsetLine = lineNo;
      }
      continue;
    }
    const coeff = parseNumber(tokens[0]);
    if (coeff === null) {
      add(lineNo, `coefficient "${tokens[0]}" is not a number; start each term with a number like 0.5, -2 or 1e-3`);
      continue;
    }
    if (numQubits === null) {
      add(lineNo, 'a term comes before "qubits N"; declare the number of qubits first');
      return { ok: false, issues };
    }
    const f = parseFactors(tokens.slice(1), numQubits);
    if ('error' in f) {
      add(lineNo, f.error);
      continue;
    }
    if (!f.letters.includes('X') && !f.letters.includes('Y') && !f.letters.includes('Z')) offset += coeff;
    else terms.push({ letters: f.letters, coeff });
  }
  if (!sawHeader) {
    add(1, `empty operator; the first line must be "${OPERATOR_FORMAT} ${OPERATOR_VERSION}"`);
    return { ok: false, issues };
  }
  if (numQubits === null) add(lines.length, 'missing "qubits N" line after the header');
  if (issues.length > 0 || numQubits === null) return { ok: false, issues };
  return { ok: true, operator: finish(numQubits, offset, terms), issues: [] };
}

/** "Z0 Z3 X5" for a letters string (empty for the identity). */
export function factorsOf(letters: string): string {
  const parts: string[] = [];
  for (let q = 0; q < letters.length; q++) if (letters[q] !== 'I') parts.push(letters[q] + q);
  return parts.join(' ');
}

/** Text form; numbers use the shortest representation that reads back exactly. */
export function formatOperatorText(p: PauliSum, opts?: { comment?: string }): string {
  const out = [`${OPERATOR_FORMAT} ${OPERATOR_VERSION}`];
  if (opts?.comment) for (const l of opts.comment.split(/\r?\n/)) out.push(`# ${l}`);
  out.push(`qubits ${p.numQubits}`, `offset ${String(p.offset)}`);
  for (const t of p.terms) {
    const f = factorsOf(t.letters);
    out.push(f ? `${String(t.coeff)}  ${f}` : String(t.coeff));
  }
  return out.join('\n') + '\n';
}

export interface OperatorJson {
  format: typeof OPERATOR_FORMAT;
  version: typeof OPERATOR_VERSION;
  qubits: number;
  offset: number;
  terms: { coeff: number; ops: string }[];
}

export function operatorToJson(p: PauliSum): OperatorJson {
  return {
    format: OPERATOR_FORMAT,
    version: OPERATOR_VERSION,
    qubits: p.numQubits,
    offset: p.offset,
    terms: p.terms.map((t) => ({ coeff: t.coeff, ops: factorsOf(t.letters) })),
  };
}

/** Reads the JSON form from a string or an already parsed value. */
export function parseOperatorJson(input: string | unknown): OperatorParse {
  const issues: OperatorIssue[] = [];
  const add = (path: string, msg: string) => issues.push({ path, message: `${path}: ${msg}` });
  let doc: unknown = input;
  if (typeof input === 'string') {
    try {
      doc = JSON.parse(input);
    } catch (e) {
      add('(document)', `not valid JSON (${(e as Error).message})`);
      return { ok: false, issues };
    }
  }
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) {
    add('(document)', 'expected a JSON object with "format", "version", "qubits", "offset" and "terms"');
    return { ok: false, issues };
  }
  const d = doc as Record<string, unknown>;
  if (d.format !== OPERATOR_FORMAT) {
    add('format', `expected "${OPERATOR_FORMAT}", got ${JSON.stringify(d.format)}`);
    return { ok: false, issues };
  }
  if (d.version !== OPERATOR_VERSION) {
    add('version', `unsupported version ${JSON.stringify(d.version)}; this reader understands ${OPERATOR_VERSION}`);
    return { ok: false, issues };
  }
  const nq = d.qubits;
  if (typeof nq !== 'number' || !Number.isInteger(nq) || nq < 1 || nq > MAX_OPERATOR_QUBITS) {
    add('qubits', `needs a whole number from 1 to ${MAX_OPERATOR_QUBITS}, got ${JSON.stringify(nq)}`);
    return { ok: false, issues };
  }
  let offset = 0;
  if (d.offset !== undefined) {
    if (typeof d.offset !== 'number' || !Number.isFinite(d.offset)) add('offset', `needs a number, got ${JSON.stringify(d.offset)}`);
    else offset = d.offset;
  }
  if (!Array.isArray(d.terms)) {
    add('terms', 'needs an array of { "coeff": number, "ops": "Z0 X3" }');
    return { ok: false, issues };
  }
  const terms: PauliTerm[] = [];
  d.terms.forEach((t: unknown, k: number) => {
    const at = `terms[${k}]`;
    if (typeof t !== 'object' || t === null) return add(at, 'needs an object { "coeff": number, "ops": "Z0 X3" }');
    const { coeff, ops } = t as Record<string, unknown>;
    if (typeof coeff !== 'number' || !Number.isFinite(coeff)) {
      return add(`${at}.coeff`, `coefficient ${JSON.stringify(coeff)} is not a number; use a JSON number like 0.5`);
    }
    if (typeof ops !== 'string') return add(`${at}.ops`, `needs a string like "Z0 X3", got ${JSON.stringify(ops)}`);
    const tokens = ops.trim() === '' ? [] : ops.trim().split(/\s+/);
    const f = parseFactors(tokens, nq);
    if ('error' in f) return add(`${at}.ops`, f.error);
    if (!/[XYZ]/.test(f.letters)) offset += coeff;
    else terms.push({ letters: f.letters, coeff });
  });
  if (issues.length > 0) return { ok: false, issues };
  return { ok: true, operator: finish(nq, offset, terms), issues: [] };
}

/** Either form: JSON when the first non-blank character is "{". */
export function parseOperator(text: string): OperatorParse {
  return text.trimStart().startsWith('{') ? parseOperatorJson(text) : parseOperatorText(text);
}
