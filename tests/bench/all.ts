/**
 * `npm run bench`: runs every benchmark as its own process — simulator (sim.ts), classical
 * (classical.ts), partitioning against METIS (partition.ts), solve service (service.ts), load (load.ts), large variational (large-variational.ts), one run spread over workers (spread.ts), web (web.ts) — one after another (they would
 * disturb each other's timings on 2 cores), reads the markdown each prints, and prints ONE table
 * of ratios (metric, measured, target, ratio = measured / target, met?). Each benchmark rewrites
 * its own section of docs/benchmarks.md; this script writes the `## Summary` section at the top
 * (machine, date, what ran) and leaves the other sections alone.
 *
 *   npx tsx tests/bench/all.ts [--quick] [--full load,…] [--only sim,classical,partition,service,load,variational,spread,web] [--no-write]
 * --quick passes each benchmark its short options (and they then leave their sections alone);
 * --full names benchmarks that run with their full options even under --quick; --reuse names
 * benchmarks that are not run again: their ratios are read from their current section of
 * docs/benchmarks.md (written by their own last run, whose date the summary repeats).
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '..', '..');
const DOC = path.join(ROOT, 'docs', 'benchmarks.md');
const args = process.argv.slice(2);
const quick = args.includes('--quick');
const write = !args.includes('--no-write');
const onlyAt = args.indexOf('--only');
const only = onlyAt >= 0 ? args[onlyAt + 1].split(',') : null;
const fullAt = args.indexOf('--full');
const full = fullAt >= 0 ? args[fullAt + 1].split(',') : [];
const shortFor = (b: { name: string }) => quick && !full.includes(b.name);
const reuseAt = args.indexOf('--reuse');
const reuse = reuseAt >= 0 ? args[reuseAt + 1].split(',') : [];
const SECTION: Record<string, string> = { sim: '## Simulator', classical: '## Classical', partition: '## Partitioning vs METIS', service: '## Service', load: '## Load', variational: '## Large variational', spread: '## Spread', web: '## Web' };

/** The current section of docs/benchmarks.md for one benchmark, and the date its run wrote. */
function sectionOf(name: string): { text: string; written: string } | null {
  if (!fs.existsSync(DOC)) return null;
  const doc = fs.readFileSync(DOC, 'utf8');
  const start = doc.indexOf(`${SECTION[name]}\n`);
  if (start < 0) return null;
  const next = doc.indexOf('\n## ', start + 3);
  const text = doc.slice(start, next < 0 ? undefined : next);
  const m = /(\d{4}-\d\d-\d\d)[ T](\d\d:\d\d)/.exec(text);
  return { text, written: m ? `${m[1]} ${m[2]} UTC` : 'at an unknown date' };
}

interface Bench { name: string; file: string; args: string[]; quickArgs: string[] }
const BENCHES: Bench[] = [
  { name: 'sim', file: 'tests/bench/sim.ts', args: [], quickArgs: ['--quick'] },
  { name: 'classical', file: 'tests/bench/classical.ts', args: [], quickArgs: ['--limit', '2', '--skip-exact', '--skip-milp', '--skip-partition', '--no-write'] },
  { name: 'partition', file: 'tests/bench/partition.ts', args: [], quickArgs: ['--seconds', '2', '--ks', '2,8', '--no-write'] },
  { name: 'service', file: 'tests/bench/service.ts', args: [], quickArgs: ['--runs', '8', '--paced', '5', '--cancels', '2', '--no-write'] },
  { name: 'load', file: 'tests/bench/load.ts', args: [], quickArgs: ['--quick'] },
  { name: 'variational', file: 'tests/bench/large-variational.ts', args: [], quickArgs: ['--limit', '20', '--instances', 'G11', '--batch-study', '', '--no-write'] },
  { name: 'spread', file: 'tests/bench/spread.ts', args: [], quickArgs: ['--max-iterations', '20', '--no-write'] },
  { name: 'web', file: 'tests/bench/web.ts', args: [], quickArgs: ['--quick'] },
];

export interface RatioRow { bench: string; metric: string; measured: number; target: number; better: 'lower' | 'higher'; unit: string; /** decimals to print (cut ratios near 1 need four) */ digits?: number }

/** Markdown tables after a heading containing `heading`: header cells and rows of cells. */
export function tableAfter(text: string, heading: string): { head: string[]; rows: string[][] } | null {
  const lines = text.split(/\r?\n/);
  const at = lines.findIndex((l) => l.startsWith('#') && l.includes(heading));
  if (at < 0) return null;
  const start = lines.findIndex((l, i) => i > at && l.trim().startsWith('|'));
  if (start < 0) return null;
  const cells = (l: string) => l.trim().replace(/^\||\|$/g, '').split('|').map((c) => c.trim());
  const head = cells(lines[start]);
  const rows: string[][] = [];
  for (let i = start + 2; i < lines.length && lines[i].trim().startsWith('|'); i++) rows.push(cells(lines[i]));
  return { head, rows };
}

/** Every table under the `###` headings that follow the heading containing `heading`, with its title. */
export function tablesAfter(text: string, heading: string, sub: string): Array<{ title: string; head: string[]; rows: string[][] }> {
  const lines = text.split(/\r?\n/);
  const at = lines.findIndex((l) => l.startsWith('#') && l.includes(heading));
  const out: Array<{ title: string; head: string[]; rows: string[][] }> = [];
  if (at < 0) return out;
  for (let i = at + 1; i < lines.length && !/^## /.test(lines[i]); i++) {
    if (!lines[i].startsWith(`${sub} `)) continue;
    const title = lines[i].slice(sub.length + 1).split(' (')[0].trim();
    const t = tableAfter(lines.slice(i).join('\n'), lines[i].trim());
    if (t) out.push({ title, ...t });
  }
  return out;
}

const num = (s: string | undefined) => Number(String(s ?? '').replace(/[*`%,\s]/g, ''));

/** The ratios each benchmark's output supports (targets are the ones its own report states). */
export function ratiosOf(bench: string, out: string): RatioRow[] {
  const rows: RatioRow[] = [];
  if (bench === 'sim') {
    const layer = tableAfter(out, 'One QAOA layer');
    if (layer) {
      const n = layer.head.indexOf('n');
      const fused = layer.head.indexOf('fused passes');
      const last = layer.rows[layer.rows.length - 1];
      if (last && fused >= 0) rows.push({ bench, metric: `QAOA layer cost in streaming passes (n = ${last[n]})`, measured: num(last[fused]), target: 3, better: 'lower', unit: 'passes' });
    }
    const wasmCol = layer ? layer.head.indexOf('Hadamard + WASM passes') : -1;
    const lastLayer = layer?.rows[layer.rows.length - 1];
    if (layer && lastLayer && wasmCol >= 0 && Number.isFinite(num(lastLayer[wasmCol]))) {
      rows.push({ bench, metric: `QAOA layer, Hadamard basis + WebAssembly, 1 thread (n = ${lastLayer[layer.head.indexOf('n')]})`, measured: num(lastLayer[wasmCol]), target: 6, better: 'lower', unit: 'passes' });
    }
    const dual = tableAfter(out, 'on 1 and 2 threads');
    const dualRow = dual?.rows[dual.rows.length - 1];
    if (dual && dualRow && Number.isFinite(num(dualRow[dual.head.indexOf('2 threads passes')]))) {
      rows.push({ bench, metric: `QAOA layer, Hadamard basis + WebAssembly, 2 threads (n = ${dualRow[0]})`, measured: num(dualRow[dual.head.indexOf('2 threads passes')]), target: 4, better: 'lower', unit: 'passes' });
    }
    const opt = tableAfter(out, 'Default QAOA optimisation');
    const optRow = opt?.rows[opt.rows.length - 1];
    // Left out with --skip-optimisation: then the next table after the heading is another one.
    if (opt && optRow && opt.head.includes('WASM CPU s')) rows.push({ bench, metric: `default QAOA p = 2 optimisation speed-up, WASM vs JS (${optRow[0]} depots)`, measured: num(optRow[opt.head.indexOf('speed-up')]), target: 3, better: 'higher', unit: '×' });
    const ref = tableAfter(out, 'quantum-circuit');
    if (ref) {
      const n = ref.head.indexOf('n');
      const sp = ref.head.indexOf('speed-up');
      const last = ref.rows[ref.rows.length - 1];
      if (last && sp >= 0) rows.push({ bench, metric: `speed-up over quantum-circuit (n = ${last[n]})`, measured: num(last[sp]), target: 50, better: 'higher', unit: '×' });
    }
  }
  if (bench === 'classical') {
    const m = /Mean gap to best known: ([\d.]+) %/.exec(out);
    if (m) rows.push({ bench, metric: 'G-set tabu mean gap to best known', measured: Number(m[1]), target: 0.03, better: 'lower', unit: '%' });
    const matched = /over (\d+) instances[^\n]*; matched: (\d+)/.exec(out);
    if (matched && matched[1] === '30') rows.push({ bench, metric: 'G-set instances at the best known cut (of 30)', measured: Number(matched[2]), target: 24, better: 'higher', unit: '' });
  }
  if (bench === 'partition') {
    // Ours / METIS's best of 50 per k (lower is better; ≤ 1 meets it), at 1 CPU s and at the full budget.
    for (const t of tablesAfter(out, 'Partitioning vs METIS', '###')) {
      const col = (label: string) => t.head.findIndex((h) => h.startsWith(label));
      const r1 = col('ratio at 1 s'), rEnd = t.head.findIndex((h, i) => i > r1 && h.startsWith('ratio at'));
      const endLabel = rEnd >= 0 ? t.head[rEnd].replace('ratio at ', '') : '';
      for (const row of t.rows) {
        const k = row[0];
        if (r1 >= 0 && Number.isFinite(num(row[r1]))) rows.push({ bench, metric: `${t.title}: fm / METIS cut, k = ${k}, at 1 CPU s`, measured: num(row[r1]), target: 1, better: 'lower', unit: '×', digits: 4 });
        if (rEnd >= 0 && Number.isFinite(num(row[rEnd]))) rows.push({ bench, metric: `${t.title}: fm / METIS cut, k = ${k}, at ${endLabel.replace(/ s$/, " CPU s")}`, measured: num(row[rEnd]), target: 1, better: 'lower', unit: '×', digits: 4 });
      }
    }
  }
  if (bench === 'variational') {
    const m = /Mean gap to best known: rqaoa ([\d.]+) % \(before refinement ([\d.]+) %\), qaoa-blocks ([\d.]+) %/.exec(out);
    if (m) {
      rows.push({ bench, metric: 'G-set rqaoa mean gap to best known (time cap in its section)', measured: Number(m[1]), target: 3, better: 'lower', unit: '%' });
      rows.push({ bench, metric: 'G-set qaoa-blocks mean gap to best known (time cap in its section)', measured: Number(m[3]), target: 3, better: 'lower', unit: '%' });
    }
  }
  if (bench === 'service') {
    const m = /throughput ratio: \*\*([\d.]+)\*\*/.exec(out);
    if (m) rows.push({ bench, metric: '2-worker / 1-worker throughput', measured: Number(m[1]), target: 1.5, better: 'higher', unit: '×' });
    const c = /Cancel latency[^\n]*median: \*\*([\d.]+) ms\*\*/.exec(out);
    if (c) rows.push({ bench, metric: 'cancel → cancelled, median of long runs', measured: Number(c[1]), target: 1000, better: 'lower', unit: 'ms' });
  }
  if (bench === 'spread') {
    const m = /wall-time ratio: \*\*([\d.]+)\*\*/.exec(out);
    if (m) rows.push({ bench, metric: 'one 2,000-depot qaoa-blocks run, 1-worker / 2-worker wall time (shared machine: load beside it)', measured: Number(m[1]), target: 1.6, better: 'higher', unit: '×' });
    const a = /Amdahl's bound on the 2-worker ratio \*\*([\d.]+)\*\*/.exec(out);
    if (a) rows.push({ bench, metric: "the same run's Amdahl bound at 2 workers, from the engine's measured serial CPU share (not a speed-up; what the stages allow)", measured: Number(a[1]), target: 1.6, better: 'higher', unit: '×' });
  }
  if (bench === 'load') {
    const m = /^LOAD-METRICS (.*)$/m.exec(out);
    if (m) {
      const j = JSON.parse(m[1]) as { worstP95Ms: number; worstP99Ms: number; drainSeconds: number; drainRuns: number };
      rows.push({ bench, metric: 'worst p95 latency, list/get routes, 50 connections', measured: j.worstP95Ms, target: 250, better: 'lower', unit: 'ms' });
      rows.push({ bench, metric: 'worst p99 latency, list/get routes, 50 connections', measured: j.worstP99Ms, target: 500, better: 'lower', unit: 'ms' });
      rows.push({ bench, metric: `drain ${j.drainRuns} small runs with 2 workers`, measured: j.drainSeconds, target: 120, better: 'lower', unit: 's' });
    }
    // The runs list (the busiest list of a team with live runs) has its own, tighter target.
    const runsRow = m ? (JSON.parse(m[1]) as { rows?: Array<{ route: string; p95: number }> }).rows?.find((r) => r.route === 'GET /runs') : undefined;
    const fromTable = tableAfter(out, 'List and get routes')?.rows.find((r) => r[0] === '`GET /runs`');
    const runsP95 = runsRow?.p95 ?? (fromTable ? num(fromTable[5]) : NaN);
    if (Number.isFinite(runsP95)) rows.push({ bench, metric: 'runs list p95 latency, 50 connections', measured: runsP95, target: 100, better: 'lower', unit: 'ms' });
  }
  if (bench === 'web') {
    const m = /^WEB-METRICS (.*)$/m.exec(out);
    const j = m ? (JSON.parse(m[1]) as Record<string, number>) : null;
    const t = tableAfter(out, 'Web');
    const col = t ? Math.max(1, t.head.indexOf('now')) : 1; // with a "before" column, "now" is the third
    const cell = (label: string) => {
      const row = t?.rows.find((r) => r[0].startsWith(label));
      return row ? num(row[col].split(/\s/)[0]) : NaN;
    };
    const first = j?.firstFormSeconds ?? cell('first visit: sign-in form shown');
    const bytes = j ? j.firstBytes / 1000 : cell('first visit: bytes to the sign-in form');
    const repeat = j?.repeatFormSeconds ?? cell('repeat visit: sign-in form shown');
    const list = j ? Math.max(j.firstListSeconds, j.repeatListSeconds) : Math.max(cell('first visit: signing in'), cell('repeat visit: signing in'));
    if (Number.isFinite(first)) rows.push({ bench, metric: 'first visit: sign-in form, throttled phone', measured: first, target: 3, better: 'lower', unit: 's' });
    if (Number.isFinite(bytes)) rows.push({ bench, metric: 'first visit: bytes to the sign-in form', measured: bytes, target: 1000, better: 'lower', unit: 'kB' });
    if (Number.isFinite(repeat)) rows.push({ bench, metric: 'repeat visit: sign-in form, throttled phone', measured: repeat, target: 1, better: 'lower', unit: 's' });
    if (Number.isFinite(list)) rows.push({ bench, metric: 'signing in → networks list (slower of first/repeat)', measured: list, target: 2, better: 'lower', unit: 's' });
  }
  return rows;
}

function run(b: Bench): Promise<{ code: number; out: string; seconds: number }> {
  const t0 = Date.now();
  return new Promise((resolve) => {
    const child = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), [b.file, ...(shortFor(b) ? b.quickArgs : b.args)], { cwd: ROOT, env: process.env, stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.on('data', (d) => {
      out += String(d);
      process.stdout.write(d);
    });
    child.on('close', (code) => resolve({ code: code ?? 1, out, seconds: (Date.now() - t0) / 1000 }));
  });
}

const fmt = (x: number) => (Number.isFinite(x) ? (Math.abs(x) >= 100 ? x.toFixed(0) : Math.abs(x) >= 1 ? x.toFixed(2) : x.toPrecision(2)) : '—');

async function main() {
  const ratios: RatioRow[] = [];
  const ran: string[] = [];
  for (const b of BENCHES.filter((x) => !only || only.includes(x.name))) {
    if (reuse.includes(b.name)) {
      const section = sectionOf(b.name);
      const found = section ? ratiosOf(b.name, section.text) : [];
      ran.push(`${b.name} (not re-run: ratios from its section of docs/benchmarks.md, written ${section?.written ?? 'never'}${found.length === 0 ? ', no ratios found there' : ''})`);
      ratios.push(...found);
      continue;
    }
    console.log(`\n=== ${b.name}: npx tsx ${b.file} ${(shortFor(b) ? b.quickArgs : b.args).join(' ')}`);
    const r = await run(b);
    const found = ratiosOf(b.name, r.out);
    ran.push(`${b.name} (${r.code === 0 ? 'ok' : `exit ${r.code}`}, ${Math.round(r.seconds)} s${shortFor(b) ? `, quick options: ${b.quickArgs.join(' ')}` : ', full options'}${found.length === 0 ? ', no ratios found in its output' : ''})`);
    ratios.push(...found);
  }
  const table = [
    '| benchmark | metric | measured | target | ratio (measured / target) | met? |',
    '|---|---|---|---|---|---|',
    ...ratios.map((r) => {
      const ratio = r.measured / r.target;
      const met = r.better === 'lower' ? ratio <= 1 : ratio >= 1;
      const f = (x: number) => (r.digits !== undefined && Number.isFinite(x) ? x.toFixed(r.digits) : fmt(x));
      return `| ${r.bench} | ${r.metric} | ${f(r.measured)} ${r.unit} | ${r.better === 'lower' ? '≤' : '≥'} ${r.target} ${r.unit} | ${f(ratio)} | ${met ? 'yes' : '**no**'} |`;
    }),
  ].join('\n');
  const cpu = os.cpus()[0]?.model ?? 'unknown CPU';
  const when = new Date().toISOString().slice(0, 16).replace('T', ' ');
  const summary = [
    '## Summary',
    '',
    `\`npm run bench\` on ${when} UTC — ${cpu}, ${os.cpus().length} cores (shared with other work while measuring), ${(os.totalmem() / 2 ** 30).toFixed(1)} GiB RAM, Node ${process.version}, ${os.type()} ${os.release()}.`,
    '',
    `Ran: ${ran.join('; ')}. Each ratio is measured / target from the same run; the sections below hold the details. Targets are the ones each benchmark states; the service ratio (≥ 1.5 of the 2.0 ceiling on 2 cores) and the load targets are set in tests/bench/all.ts and load.ts.`,
    '',
    table,
    '',
  ].join('\n');
  console.log(`\n${summary}`);
  if (write) {
    const doc = fs.existsSync(DOC) ? fs.readFileSync(DOC, 'utf8') : '# Benchmarks\n';
    const re = /## Summary\n[\s\S]*?(?=\n## |$)/;
    let next: string;
    if (re.test(doc)) next = doc.replace(re, summary);
    else {
      const title = /^# .*\n/.exec(doc);
      next = title ? `${title[0]}\n${summary}\n${doc.slice(title[0].length).replace(/^\n+/, '')}` : `# Benchmarks\n\n${summary}\n${doc}`;
    }
    fs.writeFileSync(DOC, next);
    console.log(`updated ${path.relative(process.cwd(), DOC)}`);
  }
}

if (require.main === module) {
  main().catch((err) => {
    console.error(err);
    process.exit(1);
  });
}
