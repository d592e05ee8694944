import multer from 'multer';
import { XMLParser } from 'fast-xml-parser';
import type { NextFunction, Request, Response } from 'express';
import type { Deps } from '../deps';
import { HttpError, badRequest } from '../lib/http-error';
import {
  GRAPHML_NAME_CANDIDATES, MAX_DEPOTS, MAX_FILE_BYTES, MAX_LANES, detectFormat, formatIssue, hasErrors, readNetwork,
  type GraphmlMapping, type NetworkFormat, type ParseResult,
} from '../../shared/formats';
import { summariseNetwork } from '../../shared/networks/summary';
import { GraphmlMappingSchema, type ImportPreview, type ImportIssue } from '../../shared/schemas/networks';
import { addVersion, createNetwork, type Actor } from './networks';

const mb = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(0)} MB`;

/** Uploaded files, as multer's memory storage hands them over. */
export interface ImportFiles {
  file?: Express.Multer.File[];
  depots?: Express.Multer.File[];
}

export interface ImportFields {
  name?: string;
  format?: NetworkFormat;
  mapping?: string;
  dropBadRows?: 'true' | 'false';
  networkId?: number;
}

/**
 * multer with memory storage and the formats module's size limit; its errors become messages
 * that say what to do (413 for size, 400 for unexpected fields).
 */
export function importUpload() {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_FILE_BYTES, files: 2, fields: 10, fieldSize: 64 * 1024 } })
    .fields([{ name: 'file', maxCount: 1 }, { name: 'depots', maxCount: 1 }]);
  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, `The file is larger than the ${mb(MAX_FILE_BYTES)} limit; split the network into regions and import them separately.`, { code: 'file_too_large' }));
        return next(badRequest(`The upload was not understood (${err.message}${err.field ? `: ${err.field}` : ''}); send the network as "file" and, for CSV, the depots as "depots".`));
      }
      next(err);
    });
  };
}

interface Prepared {
  fileName: string;
  depotsFileName: string | null;
  format: NetworkFormat | null;
  result: ParseResult;
  graphml: ImportPreview['graphml'];
  suggestedName: string;
}

const firstLine = (text: string) => (text.replace(/^\uFEFF/, '').split(/\r?\n/).find((l) => l.trim() !== '') ?? '').toLowerCase();
const columns = (line: string) => line.split(/[,;\t|]/).map((c) => c.trim().replace(/^"|"$/g, ''));

/** GraphML keys as declared (for the mapping the user confirms in the preview). */
function graphmlKeys(content: string): { id: string; for: string; name: string }[] {
  try {
    const root = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@_', isArray: (n) => n === 'key' }).parse(content) as { graphml?: { key?: Record<string, unknown>[] } };
    return (root.graphml?.key ?? []).map((k) => ({ id: String(k['@_id'] ?? ''), for: String(k['@_for'] ?? 'all'), name: String(k['@_attr.name'] ?? '') }));
  } catch {
    return [];
  }
}

/** Which key each field would use: the explicit mapping, else the formats module's candidates. */
function resolvedMapping(keys: { id: string; for: string; name: string }[], mapping: GraphmlMapping): Record<string, string | null> {
  // The same candidates the GraphML reader falls back to (shared/formats/graphml.ts).
  const domains: Record<keyof GraphmlMapping, 'node' | 'edge'> = { depotName: 'node', depotLat: 'node', depotLon: 'node', depotWeight: 'node', laneWeight: 'edge' };
  const candidates = Object.fromEntries(
    (Object.keys(domains) as (keyof GraphmlMapping)[]).map((f) => [f, { domain: domains[f], names: [...GRAPHML_NAME_CANDIDATES[f]] as string[] }]),
  ) as Record<keyof GraphmlMapping, { domain: string; names: string[] }>;
  const out: Record<string, string | null> = {};
  for (const [field, c] of Object.entries(candidates) as [keyof GraphmlMapping, { domain: string; names: string[] }][]) {
    const usable = keys.filter((k) => k.for === c.domain || k.for === 'all');
    const chosen = mapping[field];
    if (chosen !== undefined) out[field] = chosen === '' ? null : chosen;
    else out[field] = c.names.map((n) => usable.find((k) => k.name.toLowerCase() === n)).find((k) => k)?.id ?? null;
  }
  return out;
}

function parseMapping(raw: string | undefined): GraphmlMapping {
  if (!raw) return {};
  let data: unknown;
  try {
    data = JSON.parse(raw);
  } catch {
    throw badRequest('The GraphML mapping is not valid JSON; send it as {"laneWeight": "<key id>", …}.', { mapping: ['not valid JSON'] });
  }
  const parsed = GraphmlMappingSchema.safeParse(data);
  if (!parsed.success) throw badRequest('The GraphML mapping has unknown or non-text fields; use depotName, depotLat, depotLon, depotWeight and laneWeight.', { mapping: parsed.error.issues.map((i) => i.message) });
  // An empty string means "do not read this field".
  return Object.fromEntries(Object.entries(parsed.data).filter(([, v]) => v !== undefined && v !== '')) as GraphmlMapping;
}

/** Reads the upload with shared/formats (nothing is written here). */
export function prepareImport(files: ImportFiles, fields: ImportFields): Prepared {
  let main = files.file?.[0];
  let depots = files.depots?.[0];
  if (!main) throw badRequest('Choose a network file to import (the "file" field is empty).', { file: ['choose a file'] });
  let content = main.buffer.toString('utf8');
  let depotsContent = depots?.buffer.toString('utf8');
  // People pick the two CSV files in either order; the headers tell which is which.
  if (depots && depotsContent !== undefined) {
    const a = columns(firstLine(content)), b = columns(firstLine(depotsContent));
    if (!a.includes('from') && a.includes('id') && b.includes('from')) {
      [main, depots] = [depots, main];
      [content, depotsContent] = [depotsContent, content];
    }
  }
  const fileName = main.originalname || 'network';
  const format = fields.format ?? detectFormat(fileName, content);
  const mapping = parseMapping(fields.mapping);
  const result = readNetwork(fileName, content, {
    ...(format ? { format } : {}),
    ...(depots && depotsContent !== undefined ? { depots: { name: depots.originalname || 'depots.csv', content: depotsContent } } : {}),
    graphml: mapping,
  });
  if (depots && format !== 'csv') {
    result.issues.push({ file: depots.originalname, severity: 'warning', message: 'a depots file is only read together with a CSV lanes file; it was ignored' });
  }
  let graphml: ImportPreview['graphml'] = null;
  if (format === 'graphml') {
    const keys = graphmlKeys(content);
    graphml = { keys, mapping: resolvedMapping(keys, mapping) };
  }
  const base = fileName.replace(/\.[^.]+$/, '').replace(/[-_]+/g, ' ').trim();
  const suggestedName = (fields.name || result.document.name || base || 'Imported network').slice(0, 160);
  return { fileName, depotsFileName: depots?.originalname ?? null, format, result, graphml, suggestedName };
}

function issuesOf(result: ParseResult): ImportIssue[] {
  return result.issues.map((i) => ({ ...i, text: formatIssue(i) }));
}

export function previewOf(p: Prepared): ImportPreview {
  const { document } = p.result;
  const issues = issuesOf(p.result);
  return {
    fileName: p.fileName,
    depotsFileName: p.depotsFileName,
    format: p.format,
    counts: { depots: document.depots.length, lanes: document.lanes.length },
    firstDepots: document.depots.slice(0, 8),
    firstLanes: document.lanes.slice(0, 8),
    issues: issues.slice(0, 200),
    errorCount: issues.filter((i) => i.severity === 'error').length,
    warningCount: issues.filter((i) => i.severity === 'warning').length,
    summary: document.depots.length > 0 ? summariseNetwork(document) : null,
    suggestedName: p.suggestedName,
    graphml: p.graphml,
    limits: { maxFileBytes: MAX_FILE_BYTES, maxDepots: MAX_DEPOTS, maxLanes: MAX_LANES },
  };
}

/**
 * Saves an import as a new network (or a new version of `networkId`). With errors nothing is
 * written unless the user asked to drop the bad rows — and even then only when something usable
 * is left (at least one depot, and no file-level error such as a missing header).
 */
export async function importNetwork(deps: Deps, actor: Actor, files: ImportFiles, fields: ImportFields) {
  const p = prepareImport(files, fields);
  const errors = hasErrors(p.result.issues);
  const preview = previewOf(p);
  // An error with no position at all concerns the whole file (size limits, wrong kind of file).
  const fileLevel = p.result.issues.some((i) => i.severity === 'error' && i.where === undefined && i.line === undefined && i.feature === undefined && i.row === undefined);
  if (errors && (fields.dropBadRows !== 'true' || fileLevel || p.result.document.depots.length === 0)) {
    const first = preview.issues.find((i) => i.severity === 'error');
    const why = fields.dropBadRows === 'true'
      ? 'these rows cannot be dropped because the file as a whole cannot be read'
      : 'nothing was saved; fix the file, or choose to drop the bad rows';
    throw new HttpError(400, `The import has ${preview.errorCount} error${preview.errorCount === 1 ? '' : 's'} (first: ${first?.text}); ${why}.`, { code: 'import_errors', issues: preview.issues, errorCount: preview.errorCount });
  }
  const doc = p.result.document;
  const allowSignedWeights = p.format === 'edgelist' || p.format === 'json';
  const note = `imported ${p.fileName}${p.depotsFileName ? ` + ${p.depotsFileName}` : ''}${errors ? ` (${preview.errorCount} bad row${preview.errorCount === 1 ? '' : 's'} dropped)` : ''}`;
  const saved = fields.networkId
    ? { id: fields.networkId, ...(await addVersion(deps, actor, fields.networkId, { ...(fields.name ? { name: fields.name } : {}), depots: doc.depots, lanes: doc.lanes }, { source: 'import', note, allowSignedWeights })) }
    : await createNetwork(deps, actor, { name: p.suggestedName, depots: doc.depots, lanes: doc.lanes }, { source: 'import', note, allowSignedWeights });
  return { id: saved.id, versionId: saved.versionId, number: saved.number, dropped: errors ? preview.errorCount : 0, counts: preview.counts };
}
