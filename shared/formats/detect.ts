import type { NetworkFormat } from './types';

export const FORMAT_EXTENSIONS: Record<string, NetworkFormat> = {
  '.txt': 'edgelist',
  '.csv': 'csv',
  '.json': 'json',
  '.graphml': 'graphml',
  '.geojson': 'geojson',
};

/**
 * Format of an uploaded file, by extension first. Files without a known extension are sniffed:
 * XML → graphml, a JSON FeatureCollection → geojson, other JSON → json, a leading "n m" line →
 * edgelist, a comma header → csv. Null when nothing fits (the caller asks the user).
 */
export function detectFormat(fileName: string, content: string): NetworkFormat | null {
  const lower = fileName.toLowerCase();
  const dot = lower.lastIndexOf('.');
  const ext = dot >= 0 ? lower.slice(dot) : '';
  if (ext in FORMAT_EXTENSIONS) {
    // GeoJSON is often saved as .json; the content decides between our document and GeoJSON.
    if (ext === '.json' && /"type"\s*:\s*"FeatureCollection"/.test(content.slice(0, 4096))) return 'geojson';
    return FORMAT_EXTENSIONS[ext];
  }
  const head = content.replace(/^\uFEFF/, '').trimStart().slice(0, 4096);
  if (head.startsWith('<')) return 'graphml';
  if (head.startsWith('{')) return /"type"\s*:\s*"FeatureCollection"/.test(head) ? 'geojson' : 'json';
  const first = head.split(/\r?\n/).find((l) => l.trim() !== '' && !l.trim().startsWith('#')) ?? '';
  if (/^\s*\d+\s+\d+\s*$/.test(first)) return 'edgelist';
  if (first.includes(',')) return 'csv';
  return null;
}
