/**
 * Finds paths in the project's own files that lead outside the repository (the project must run
 * from a fresh clone with nothing beside it). Used by tests/unit/repo/stays-inside.test.ts.
 *
 * What counts as leaving:
 *  - an absolute path under a top-level home, work or data folder (the ABSOLUTE pattern below: home, root, mnt,
 *    srv, opt, tmp, var, Users, media, etc and the like) — system programs under usr and dev are fine;
 *  - a relative path that climbs above the repository: import/require specifiers and other
 *    string literals (from the file's folder), path.join/resolve(__dirname | ROOT | root |
 *    process.cwd(), '…') chains, `$(dirname …)/..` in shell scripts, and Markdown links or code
 *    spans like `../shared/data` (from the Markdown file's folder).
 * Heuristic by design (regexes, no parser); its own test feeds it each case.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';

export interface OutsideFinding { file: string; line: number; text: string; why: string }

const ABSOLUTE = /(?:^|[\s'"`(=:,[])(\/(?:work|home|root|mnt|srv|opt|data|tmp|var|Users|media|etc)\/[A-Za-z0-9._\/-]*)/g;
/** Named system locations the product uses on purpose (browser and database binaries). */
const ALLOWED_ABSOLUTE: Record<string, string> = {
  '/etc/mysql': 'docs say --no-defaults keeps Debian’s MySQL config out',
};
const SKIP_DIRS = new Set(['node_modules', '.git', '.data', 'dist', 'artifacts', '.expo', 'web-build', '.tmp', 'coverage']);
const SCANNED = /\.(ts|tsx|js|cjs|mjs|json|sh|md|ya?ml)$/;

/** Files of the project worth scanning: code, scripts, config and docs (not data, not builds). */
export function projectFiles(root: string): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      if (entry.isDirectory()) { if (!SKIP_DIRS.has(entry.name)) walk(path.join(dir, entry.name)); continue; }
      const full = path.join(dir, entry.name);
      if (entry.name === 'package-lock.json') continue;
      if (SCANNED.test(entry.name) || (!entry.name.includes('.') && fs.readFileSync(full, 'utf8').startsWith('#!'))) out.push(full);
    }
  };
  walk(root);
  return out;
}

const inside = (root: string, p: string): boolean => {
  const rel = path.relative(root, p);
  return rel === '' || (!rel.startsWith('..') && !path.isAbsolute(rel));
};

/** The top-level, comma-separated arguments of a call whose '(' is at `open`. */
function callArgs(text: string, open: number): string[] {
  const args: string[] = [];
  let depth = 0, cur = '', quote: string | null = null;
  for (let i = open + 1; i < text.length; i++) {
    const ch = text[i];
    if (quote) { cur += ch; if (ch === quote && text[i - 1] !== '\\') quote = null; continue; }
    if (ch === '\'' || ch === '"' || ch === '`') { quote = ch; cur += ch; continue; }
    if (ch === '(' || ch === '[' || ch === '{') depth++;
    if (ch === ')' || ch === ']' || ch === '}') { if (depth === 0) { args.push(cur.trim()); return args; } depth--; }
    if (ch === ',' && depth === 0) { args.push(cur.trim()); cur = ''; continue; }
    cur += ch;
  }
  return args;
}
const literal = (arg: string): string | null => {
  const m = /^(['"`])([^'"`$]*)\1$/.exec(arg);
  return m ? m[2] : null;
};
const lineOf = (text: string, index: number) => text.slice(0, index).split('\n').length;

/** Findings in one file's text; `file` is its absolute path (it decides the folder relative paths start from). */
export function findOutsidePaths(root: string, file: string, text: string): OutsideFinding[] {
  const found: OutsideFinding[] = [];
  const dir = path.dirname(file);
  const rel = path.relative(root, file);
  const add = (index: number, snippet: string, why: string) => found.push({ file: rel, line: lineOf(text, index), text: snippet, why });

  for (const m of text.matchAll(ABSOLUTE)) {
    const p = m[1].replace(/[.,:)]+$/, '');
    if (Object.keys(ALLOWED_ABSOLUTE).some((a) => p === a || p.startsWith(`${a}/`))) continue;
    add(m.index!, p, 'absolute path outside the repository');
  }

  // path.join / path.resolve chains from a known base.
  for (const m of text.matchAll(/\bpath\.(?:join|resolve)\(/g)) {
    const args = callArgs(text, m.index! + m[0].length - 1);
    const base = args[0] === '__dirname' ? dir : /^(ROOT|root|repoRoot|process\.cwd\(\))$/.test(args[0] ?? '') ? root : null;
    if (!base) continue;
    const parts: string[] = [];
    for (const a of args.slice(1)) { const l = literal(a); if (l === null) break; parts.push(l); }
    const target = path.resolve(base, ...parts);
    if (!inside(root, target)) add(m.index!, `path.${m[0].slice(5, -1)}(${args.join(', ')})`, 'climbs above the repository');
  }

  if (/\.md$/.test(file)) {
    for (const m of text.matchAll(/\]\((\.\.?\/[^)\s#]*)|`(\.\.\/[^`\s]*)`/g)) {
      const p = m[1] ?? m[2];
      if (!inside(root, path.resolve(dir, p))) add(m.index!, p, 'Markdown path climbs above the repository');
    }
    return found;
  }

  // Relative string literals (import specifiers and the rest) resolve from the file's folder.
  for (const m of text.matchAll(/(['"`])(\.\.?(?:\/[^'"`$\s]*)?)\1/g)) {
    if (!inside(root, path.resolve(dir, m[2]))) add(m.index!, m[2], 'relative path climbs above the repository');
  }
  // Shell: "$(dirname "$0")/../.." and the like.
  for (const m of text.matchAll(/\$\(dirname [^)]*\)"?((?:\/\.\.?)+)(?=[/"\s)]|$)/g)) {
    if (!inside(root, path.resolve(dir, `.${m[1]}`))) add(m.index!, m[0], 'script path climbs above the repository');
  }
  return found;
}
