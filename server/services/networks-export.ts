import type { Deps } from '../deps';
import { writeDepotsCsv, writeGeojson, writeLanesCsv } from '../../shared/formats';
import { getVersion } from './networks';

export type ExportKind = 'lanes-csv' | 'depots-csv' | 'geojson';

/** A file name safe in a Content-Disposition header and on every file system. */
export function exportFileName(networkName: string, number: number, suffix: string): string {
  const base = networkName.normalize('NFKD').replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'network';
  return `${base}-v${number}-${suffix}`;
}

/** One version written in a file format the importers read back (round trip). */
export async function exportVersion(deps: Deps, organisationId: number, id: number, versionId: number, kind: ExportKind) {
  const v = await getVersion(deps, organisationId, id, versionId);
  const name = v.document.name ?? 'network';
  switch (kind) {
    case 'lanes-csv': return { fileName: exportFileName(name, v.number, 'lanes.csv'), contentType: 'text/csv; charset=utf-8', body: writeLanesCsv(v.document) };
    case 'depots-csv': return { fileName: exportFileName(name, v.number, 'depots.csv'), contentType: 'text/csv; charset=utf-8', body: writeDepotsCsv(v.document) };
    case 'geojson': return { fileName: exportFileName(name, v.number, 'network.geojson'), contentType: 'application/geo+json; charset=utf-8', body: writeGeojson(v.document) };
  }
}
