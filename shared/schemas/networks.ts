import { z } from 'zod';
import { DEPOT_ID_MAX, DEPOT_NAME_MAX } from '../engine/network/limits';
import { MAX_DEPOTS, MAX_LANES } from '../formats/types';

export { DEPOT_ID_MAX, DEPOT_NAME_MAX };

/**
 * Shapes of the networks API, shared by the server (validation) and the app (forms, inline
 * edits). Business networks carry freight volumes, so lane weights sent through the API must be
 * ≥ 0 — the same rule the CSV, GeoJSON and GraphML importers apply (shared/formats/finish.ts).
 * Signed ±1 weights exist only for max-cut benchmark files (edge list, Spinyard JSON), which
 * come in through the import endpoint.
 */

export const NETWORK_NAME_MAX = 160;
/** Characters of a version note (the column's size; longer notes from imports are shortened). */
export const VERSION_NOTE_MAX = 300;

const finite = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be a finite number`);

export const DepotIdSchema = z.string({ error: 'depot id must be text' }).trim().min(1, 'give the depot an id').max(DEPOT_ID_MAX, `keep depot ids to ${DEPOT_ID_MAX} characters`);

export const DepotInputSchema = z.object({
  id: DepotIdSchema,
  name: z.string().trim().max(DEPOT_NAME_MAX, `keep depot names to ${DEPOT_NAME_MAX} characters`).optional(),
  lat: finite('latitude').refine((v) => Math.abs(v) <= 90, 'latitude must lie in −90…90').optional(),
  lon: finite('longitude').refine((v) => Math.abs(v) <= 180, 'longitude must lie in −180…180').optional(),
  weight: finite('depot weight').refine((v) => v >= 0, 'depot weight (demand) must be ≥ 0').optional(),
});

/** A lane volume typed into the app or sent to the API (≥ 0: freight volumes cannot be negative). */
export const LaneVolumeSchema = finite('volume').refine((v) => v >= 0, 'volume must be ≥ 0: freight volumes cannot be negative (signed weights are only for max-cut benchmark files, imported as edge list or JSON)');

export const LaneInputSchema = z.object({
  from: DepotIdSchema,
  to: DepotIdSchema,
  weight: LaneVolumeSchema,
});

export const NetworkNameSchema = z.string({ error: 'give the network a name' }).trim().min(1, 'give the network a name').max(NETWORK_NAME_MAX, `keep the name to ${NETWORK_NAME_MAX} characters`);

/** POST /api/networks and POST /api/networks/:id/versions. */
export const NetworkBodySchema = z.object({
  name: NetworkNameSchema,
  depots: z.array(DepotInputSchema).min(1, 'a network needs at least one depot').max(MAX_DEPOTS, `a network holds at most ${MAX_DEPOTS} depots`),
  lanes: z.array(LaneInputSchema).max(MAX_LANES, `a network holds at most ${MAX_LANES} lanes`),
  /** Optional note shown in the version list ("moved depot 7", "imported lanes.csv"). */
  note: z.string().trim().max(VERSION_NOTE_MAX, `keep the note to ${VERSION_NOTE_MAX} characters`).optional(),
});
export type NetworkBody = z.infer<typeof NetworkBodySchema>;

/** POST /api/networks/:id/versions: the name is optional there (it stays the network's name). */
export const VersionBodySchema = NetworkBodySchema.extend({ name: NetworkNameSchema.optional() });
export type VersionBody = z.infer<typeof VersionBodySchema>;

export const RenameBodySchema = z.object({ name: NetworkNameSchema });

export const NETWORK_SORTS = ['name', 'updated', 'size'] as const;
export type NetworkSort = (typeof NETWORK_SORTS)[number];

export const NetworkListQuerySchema = z.object({
  search: z.string().trim().max(100).optional(),
  sort: z.enum(NETWORK_SORTS).default('updated'),
  order: z.enum(['asc', 'desc']).optional(),
});
export type NetworkListQuery = z.infer<typeof NetworkListQuerySchema>;

/** Figures shown with every version (computed by shared/networks/summary.ts). */
export interface NetworkSummary {
  depots: number;
  lanes: number;
  /** Sum of lane volumes. */
  totalVolume: number;
  /** Connected components (an isolated depot counts as one). */
  components: number;
  /** Smallest and largest number of distinct neighbours of a depot. */
  minDegree: number;
  maxDegree: number;
  /** True when every depot has lat and lon (the drawing uses a map projection then). */
  hasCoordinates: boolean;
}

export type VersionSource = 'drawn' | 'api' | 'import' | 'demo' | 'duplicate';

export interface NetworkListItem {
  id: number;
  name: string;
  latestVersion: number;
  latestVersionId: number;
  summary: Pick<NetworkSummary, 'depots' | 'lanes' | 'totalVolume'>;
  createdAt: string;
  updatedAt: string;
}

export interface VersionInfo {
  id: number;
  number: number;
  source: VersionSource;
  note: string | null;
  summary: NetworkSummary;
  createdAt: string;
  createdBy: number | null;
}

export interface NetworkDocumentBody {
  name?: string;
  depots: { id: string; name?: string; lat?: number; lon?: number; weight?: number }[];
  lanes: { from: string; to: string; weight: number }[];
}

export interface VersionDetail extends VersionInfo {
  networkId: number;
  document: NetworkDocumentBody;
}

/** GET /api/networks/:id */
export interface NetworkDetail {
  id: number;
  name: string;
  createdAt: string;
  updatedAt: string;
  versionCount: number;
  latest: VersionDetail;
}

/** GET /api/networks/:id/compare */
export interface VersionComparison {
  from: { id: number; number: number };
  to: { id: number; number: number };
  addedDepots: string[];
  removedDepots: string[];
  /** Depots whose name, weight or position changed. */
  changedDepots: { id: string; fields: string[] }[];
  addedLanes: { from: string; to: string; weight: number }[];
  removedLanes: { from: string; to: string; weight: number }[];
  weightChanges: { from: string; to: string; before: number; after: number }[];
}

export const CompareQuerySchema = z.object({
  from: z.coerce.number().int().positive('choose the version to compare from'),
  to: z.coerce.number().int().positive('choose the version to compare to'),
});

export const IdParamsSchema = z.object({ id: z.coerce.number().int().positive('network id must be a positive whole number') });
export const VersionParamsSchema = IdParamsSchema.extend({ versionId: z.coerce.number().int().positive('version id must be a positive whole number') });

/** Multipart text fields of POST /api/networks/import/preview and /import. */
export const ImportFieldsSchema = z.object({
  name: z.string().trim().max(NETWORK_NAME_MAX).optional(),
  format: z.enum(['edgelist', 'csv', 'json', 'graphml', 'geojson']).optional(),
  /** JSON of a GraphmlMapping: which key feeds which field. */
  mapping: z.string().max(2000).optional(),
  /** "true" to save the rows that passed and leave the bad ones out. */
  dropBadRows: z.enum(['true', 'false']).optional(),
  /** Import as a new version of this network instead of a new network. */
  networkId: z.coerce.number().int().positive().optional(),
});

export const GraphmlMappingSchema = z.object({
  depotName: z.string().max(200).optional(),
  depotLat: z.string().max(200).optional(),
  depotLon: z.string().max(200).optional(),
  depotWeight: z.string().max(200).optional(),
  laneWeight: z.string().max(200).optional(),
});

export interface ImportIssue {
  file?: string;
  line?: number;
  feature?: number;
  where?: 'depots' | 'lanes';
  row?: number;
  message: string;
  severity: 'error' | 'warning';
  /** "lanes.csv line 7: …", ready to show. */
  text: string;
}

/** Answer of POST /api/networks/import/preview (nothing is written). */
export interface ImportPreview {
  fileName: string;
  depotsFileName: string | null;
  format: 'edgelist' | 'csv' | 'json' | 'graphml' | 'geojson' | null;
  /** Counts of the rows that passed every check (what "drop bad rows" would save). */
  counts: { depots: number; lanes: number };
  firstDepots: NetworkDocumentBody['depots'];
  firstLanes: NetworkDocumentBody['lanes'];
  issues: ImportIssue[];
  errorCount: number;
  warningCount: number;
  summary: NetworkSummary | null;
  suggestedName: string;
  /** GraphML only: the declared keys and the mapping that was applied. */
  graphml: { keys: { id: string; for: string; name: string }[]; mapping: Record<string, string | null> } | null;
  limits: { maxFileBytes: number; maxDepots: number; maxLanes: number };
}
