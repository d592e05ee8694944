import Papa from 'papaparse';

/**
 * The one rule for text written into a CSV cell (every CSV the product writes goes through
 * writeCsvTable) and its inverse for the CSV reader.
 *
 * Spreadsheets evaluate a cell that begins with = + - @, TAB or CR as a formula, so a depot
 * named "=HYPERLINK(…)" would run when a planner opens the export. Following OWASP Foundation,
 * "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection; values from memory: those six
 * leading characters, neutralised by a leading single quote), such text cells get a leading
 * apostrophe, which spreadsheets read as "this is text". A cell that already starts with
 * apostrophes before one of those characters gets one more, so `restoreCsvText` (used by our CSV
 * reader) can undo it exactly and a re-import of an export gives the same network.
 *
 * Numbers are written as number literals (JavaScript's own formatting of a finite number, e.g.
 * -31.25): a spreadsheet reads such a cell as a number, not a formula, and keeping negative
 * longitudes numeric keeps the export usable. Only text (ids, names) carries user content.
 */
const GUARDED = /^'*[=+\-@\t\r]/;

/** Text cell as written: a leading apostrophe added when a spreadsheet would read a formula. */
export function neutraliseCsvText(text: string): string {
  return GUARDED.test(text) ? `'${text}` : text;
}

/** Inverse of neutraliseCsvText for a cell read back (other cells are returned unchanged). */
export function restoreCsvText(cell: string): string {
  return cell.startsWith("'") && GUARDED.test(cell) ? cell.slice(1) : cell;
}

export type CsvValue = string | number | null | undefined;

/** A number cell: finite numbers as literals; anything else is a programming error. */
function numberCell(v: number): string {
  if (!Number.isFinite(v)) throw new Error(`cannot write ${v} into a CSV cell`);
  return String(v);
}

/**
 * A CSV table: header row, then the rows; text cells neutralised, numbers as literals, null and
 * undefined as empty cells; quoting as RFC 4180 (papaparse). Ends with a newline.
 */
export function writeCsvTable(header: readonly string[], rows: readonly (readonly CsvValue[])[], newline: '\n' | '\r\n' = '\n'): string {
  const data = rows.map((row) => row.map((v) => (v === null || v === undefined ? '' : typeof v === 'number' ? numberCell(v) : neutraliseCsvText(v))));
  return Papa.unparse({ fields: header.map(neutraliseCsvText), data }, { newline }) + newline;
}
