/**
 * Network file formats: parsers (string in, `{ document, issues }` out, never throwing on user
 * input) and writers. One file per format; this module only dispatches.
 */
import { parseCsvNetwork } from './csv';
import { detectFormat } from './detect';
import { parseEdgeList } from './edgelist';
import { parseGeojson } from './geojson';
import { parseGraphml, type GraphmlMapping } from './graphml';
import { parseNetworkJson } from './json';
import type { NetworkFormat, ParseResult } from './types';

export * from './types';
export { detectFormat, FORMAT_EXTENSIONS } from './detect';
export { parseEdgeList, writeEdgeList } from './edgelist';
export { parseCsvNetwork, writeLanesCsv, writeDepotsCsv, LANE_COLUMNS, DEPOT_COLUMNS, type CsvFile } from './csv';
export { writeCsvTable, neutraliseCsvText, restoreCsvText, type CsvValue } from './csv-cells';
export { parseNetworkJson, writeNetworkJson, NETWORK_FORMAT_TAG, NETWORK_FORMAT_VERSION } from './json';
export { parseGraphml, writeGraphml, GRAPHML_NAME_CANDIDATES, type GraphmlMapping } from './graphml';
export { parseGeojson, writeGeojson } from './geojson';

export interface ReadNetworkOptions {
  /** Forces a format instead of detecting it. */
  format?: NetworkFormat;
  /** CSV only: the depots file that goes with a lanes file. */
  depots?: { name?: string; content: string };
  /** GraphML only: which keys feed which fields. */
  graphml?: GraphmlMapping;
}

/** Reads one network file in any supported format. */
export function readNetwork(fileName: string, content: string, options: ReadNetworkOptions = {}): ParseResult {
  const format = options.format ?? detectFormat(fileName, content);
  if (options.depots && format !== 'csv') {
    const r = readNetworkAs(format, fileName, content, options);
    r.issues.push({ ...(options.depots.name ? { file: options.depots.name } : {}), severity: 'warning', message: `a depots file only goes with a CSV lanes file; it was not read (the ${format ?? 'unknown'} file carries its own depots)` });
    return r;
  }
  return readNetworkAs(format, fileName, content, options);
}

function readNetworkAs(format: NetworkFormat | null, fileName: string, content: string, options: ReadNetworkOptions): ParseResult {
  switch (format) {
    case 'edgelist': return parseEdgeList(content, fileName);
    case 'csv': return parseCsvNetwork({ name: fileName, content }, options.depots);
    case 'json': return parseNetworkJson(content, fileName);
    case 'graphml': return parseGraphml(content, fileName, options.graphml);
    case 'geojson': return parseGeojson(content, fileName);
    default:
      return {
        document: { depots: [], lanes: [] },
        issues: [{ file: fileName, severity: 'error', message: 'the file type is not recognised; use .txt (edge list), .csv, .json, .graphml or .geojson' }],
      };
  }
}

/** "lanes.csv line 7: …" — the one way positions are written in messages (CLI, server logs). */
export function formatIssue(issue: { file?: string; line?: number; feature?: number; row?: number; where?: string; message: string }): string {
  const place = issue.line !== undefined ? `line ${issue.line}` : issue.feature !== undefined ? `feature ${issue.feature}` : issue.row !== undefined && issue.where ? `${issue.where === 'lanes' ? 'lane' : 'depot'} ${issue.row}` : '';
  const prefix = [issue.file, place].filter((x) => x).join(' ');
  return prefix ? `${prefix}: ${issue.message}` : issue.message;
}
