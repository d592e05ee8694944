import Papa from 'papaparse';
import type { Depot, NetworkDocument } from '../engine/network/types';
import { restoreCsvText, writeCsvTable } from './csv-cells';
import { emptyResult, finishNetwork, readNumber, sizeIssue, type DraftNetwork } from './finish';
import type { FormatIssue, ParseResult, SourcePosition } from './types';

/** A CSV file handed to the importer: its name (for messages) and its text. */
export interface CsvFile {
  name?: string;
  content: string;
}

export const LANE_COLUMNS = ['from', 'to', 'weight'] as const;
export const DEPOT_COLUMNS = ['id', 'name', 'lat', 'lon', 'weight'] as const;

interface CsvRow {
  cells: string[];
  line: number;
}

/**
 * Splits CSV text into rows with the line each row starts on (quoted cells may span lines,
 * so row numbers and line numbers differ). Delimiter is guessed among , ; tab |.
 */
function readRows(file: CsvFile, issues: FormatIssue[]): CsvRow[] {
  const text = file.content.replace(/\r\n?/g, '\n').replace(/^\uFEFF/, '');
  const rows: CsvRow[] = [];
  let start = 0, line = 1;
  Papa.parse<string[]>(text, {
    skipEmptyLines: false,
    delimiter: headerDelimiter(text),
    step: (result) => {
      const end = result.meta.cursor;
      const e = result.errors[0];
      if (e) issues.push({ ...(file.name ? { file: file.name } : {}), line, severity: 'error', message: `${e.message.replace(/\.$/, '')}; close the quote or remove it` });
      // Undo the export's formula guard (csv-cells.ts), so an exported file reads back the same.
      const cells = result.data.map(restoreCsvText);
      if (!(cells.length === 1 && cells[0].trim() === '') && result.errors.length === 0) rows.push({ cells, line });
      for (let i = start; i < end && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
      start = end;
    },
  });
  return rows;
}

/**
 * The delimiter is read off the header row alone (plain column names), so commas or semicolons
 * inside quoted ids further down cannot mislead the guess. Comma unless another wins.
 */
function headerDelimiter(text: string): string {
  const header = text.split('\n').find((l) => l.trim() !== '') ?? '';
  let best = ',', bestCount = 0;
  for (const d of [',', ';', '\t', '|']) {
    const count = header.split(d).length - 1;
    if (count > bestCount) { best = d; bestCount = count; }
  }
  return best;
}

/**
 * A row with more non-empty fields than the header has columns: the fields no longer line up, so
 * the row is refused rather than read from the wrong columns. The usual cause is a decimal comma
 * (`CV06,CV07,1,5` meant volume 1.5), so that case gets its own fix.
 */
function extraFieldsProblem(row: CsvRow, header: CsvRow, numberColumn: number | undefined): string | null {
  const width = header.cells.length;
  if (row.cells.length <= width || row.cells.slice(width).every((c) => c.trim() === '')) return null;
  const used = row.cells.length - [...row.cells].reverse().findIndex((c) => c.trim() !== '');
  const base = `the row has ${used} fields but the header has ${width} (${header.cells.join(',')})`;
  if (numberColumn !== undefined && numberColumn === width - 1 && used === width + 1) {
    const [whole, fraction] = [row.cells[width - 1].trim(), row.cells[width].trim()];
    if (/^[+-]?\d+$/.test(whole) && /^\d+$/.test(fraction)) {
      return `${base}: "${whole},${fraction}" looks like a number written with a decimal comma; write ${whole}.${fraction}`;
    }
  }
  return `${base}; remove the extra fields, or put quotes around a value that contains the delimiter`;
}

/** Maps header names (case-insensitive, trimmed) to column indices; warns about the rest. */
function readHeader(row: CsvRow, wanted: readonly string[], required: readonly string[], hint: string, file: CsvFile, issues: FormatIssue[]): Map<string, number> | null {
  const where = { ...(file.name ? { file: file.name } : {}), line: row.line };
  const names = row.cells.map((c) => c.trim().toLowerCase());
  const columns = new Map<string, number>();
  const ignored: string[] = [];
  names.forEach((name, i) => {
    if ((wanted as readonly string[]).includes(name) && !columns.has(name)) columns.set(name, i);
    else ignored.push(row.cells[i].trim() || `(column ${i + 1} without a name)`);
  });
  const missing = required.filter((r) => !columns.has(r));
  if (missing.length > 0) {
    issues.push({ ...where, severity: 'error', message: `the header row is missing ${missing.map((m) => `"${m}"`).join(', ')} (found "${row.cells.join(',').slice(0, 60)}"); the first row must be the header ${hint}` });
    return null;
  }
  if (ignored.length > 0) issues.push({ ...where, severity: 'warning', message: `column(s) ${ignored.map((c) => `"${c}"`).join(', ')} are not used and were ignored; the columns read are ${wanted.join(', ')}` });
  return columns;
}

/**
 * Network from CSV: a lanes file with header `from,to,weight` and, optionally, a depots file with
 * header `id,name,lat,lon,weight` (only id is required). Without a depots file the depots are the
 * ids seen in the lanes, in first-seen order. Volumes must be ≥ 0 (business import).
 */
export function parseCsvNetwork(lanesFile: CsvFile, depotsFile?: CsvFile): ParseResult {
  const issues: FormatIssue[] = [];
  for (const f of depotsFile ? [lanesFile, depotsFile] : [lanesFile]) {
    const big = sizeIssue(f.content, f.name);
    if (big) return emptyResult([big]);
  }
  const draft: DraftNetwork = { depots: [], depotAt: [], lanes: [], laneAt: [] };
  const pos = (file: CsvFile, line: number): SourcePosition => (file.name !== undefined ? { file: file.name, line } : { line });

  const laneRows = readRows(lanesFile, issues);
  if (laneRows.length === 0) {
    issues.push({ ...(lanesFile.name ? { file: lanesFile.name } : {}), line: 1, severity: 'error', message: `the lanes file is empty; it needs the header ${LANE_COLUMNS.join(',')} and one row per lane` });
    return emptyResult(issues);
  }
  const laneCols = readHeader(laneRows[0], LANE_COLUMNS, LANE_COLUMNS, LANE_COLUMNS.join(','), lanesFile, issues);
  if (!laneCols) return emptyResult(issues);
  for (const row of laneRows.slice(1)) {
    const cell = (name: string) => (row.cells[laneCols.get(name)!] ?? '').trim();
    const from = cell('from'), to = cell('to');
    const here = pos(lanesFile, row.line);
    const extra = extraFieldsProblem(row, laneRows[0], laneCols.get('weight'));
    if (extra) {
      issues.push({ ...here, where: 'lanes', severity: 'error', message: extra });
      continue;
    }
    if (from === '' || to === '') {
      issues.push({ ...here, where: 'lanes', severity: 'error', message: `the lane needs both "from" and "to" depot ids (found "${from}" and "${to}"); fill them in or remove the row` });
      continue;
    }
    const w = readNumber(cell('weight'), 'weight');
    if (typeof w !== 'number') {
      issues.push({ ...here, where: 'lanes', severity: 'error', message: w.problem });
      continue;
    }
    draft.lanes.push({ from, to, weight: w });
    draft.laneAt.push(here);
  }

  if (depotsFile) {
    const depotRows = readRows(depotsFile, issues);
    if (depotRows.length === 0) {
      issues.push({ ...(depotsFile.name ? { file: depotsFile.name } : {}), line: 1, severity: 'error', message: `the depots file is empty; it needs the header ${DEPOT_COLUMNS.join(',')} (only id is required)` });
      return emptyResult(issues);
    }
    const cols = readHeader(depotRows[0], DEPOT_COLUMNS, ['id'], `${DEPOT_COLUMNS.join(',')} (only id is required)`, depotsFile, issues);
    if (!cols) return emptyResult(issues);
    for (const row of depotRows.slice(1)) {
      const cell = (name: string) => (cols.has(name) ? (row.cells[cols.get(name)!] ?? '').trim() : '');
      const here = pos(depotsFile, row.line);
      const extra = extraFieldsProblem(row, depotRows[0], cols.get('weight'));
      if (extra) {
        issues.push({ ...here, where: 'depots', severity: 'error', message: extra });
        continue;
      }
      const depot: Depot = { id: cell('id') };
      if (cell('name') !== '') depot.name = cell('name');
      let ok = true;
      for (const [key, label, example] of [['lat', 'latitude', '51.5'], ['lon', 'longitude', '-0.12'], ['weight', 'weight', '3']] as const) {
        if (cell(key) === '') continue;
        const v = readNumber(cell(key), label, example);
        if (typeof v === 'number') depot[key] = v;
        else { issues.push({ ...here, where: 'depots', severity: 'error', message: v.problem }); ok = false; }
      }
      if (!ok) continue;
      draft.depots.push(depot);
      draft.depotAt.push(here);
    }
  } else {
    const seen = new Set<string>();
    draft.lanes.forEach((l, e) => {
      for (const id of [l.from, l.to]) {
        if (seen.has(id)) continue;
        seen.add(id);
        draft.depots.push({ id });
        draft.depotAt.push(draft.laneAt[e]);
      }
    });
  }
  return finishNetwork(draft, issues, { rejectNegativeWeights: true, weightWord: 'volume' });
}

/** Lanes as CSV with header from,to,weight (text cells guarded against formulas: csv-cells.ts). */
export function writeLanesCsv(doc: NetworkDocument): string {
  return writeCsvTable(LANE_COLUMNS, doc.lanes.map((l) => [l.from, l.to, l.weight]));
}

/** Depots as CSV with header id,name,lat,lon,weight (empty cells for absent fields). */
export function writeDepotsCsv(doc: NetworkDocument): string {
  return writeCsvTable(DEPOT_COLUMNS, doc.depots.map((d) => [d.id, d.name, d.lat, d.lon, d.weight]));
}
