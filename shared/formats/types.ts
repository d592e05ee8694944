import type { NetworkDocument } from '../engine/network/types';

/**
 * One problem found while reading a network file. `message` says what is wrong and how to fix
 * it. Positions are 1-based lines for text formats, 0-based feature indices for GeoJSON
 * (the index into `features`, as GeoJSON tools show it); `row` is the 1-based depot or lane row
 * where no line is known (JSON documents, GraphML elements).
 */
export interface FormatIssue {
  file?: string;
  line?: number;
  feature?: number;
  where?: 'depots' | 'lanes';
  row?: number;
  message: string;
  severity: 'error' | 'warning';
}

/**
 * What every parser returns. `document` holds only the rows that passed every check, so a UI
 * can offer "drop the bad rows and continue"; callers must not proceed silently while
 * `issues` contains an error.
 */
export interface ParseResult {
  document: NetworkDocument;
  issues: FormatIssue[];
}

export type NetworkFormat = 'edgelist' | 'csv' | 'json' | 'graphml' | 'geojson';

/** Where a parsed depot or lane came from, so row-level issues can point back at the file. */
export interface SourcePosition {
  file?: string;
  line?: number;
  feature?: number;
  /** 1-based row of the depot or lane, used when no line or feature is known. */
  row?: number;
}

/** Limits the importers enforce (exported so the UI can state them before upload). */
export const MAX_FILE_BYTES = 20 * 1024 * 1024;
export const MAX_DEPOTS = 20_000;
export const MAX_LANES = 200_000;

export const hasErrors = (issues: readonly FormatIssue[]): boolean => issues.some((i) => i.severity === 'error');
