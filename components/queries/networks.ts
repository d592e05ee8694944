import { keepPreviousData, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { api } from '../api/client';
import type {
  ImportPreview, NetworkBody, NetworkDetail, NetworkListItem, NetworkSort, VersionBody, VersionComparison, VersionDetail, VersionInfo,
} from '../../shared/schemas/networks';
import { STALE } from './staleTimes';

export const networkKeys = {
  root: ['networks'] as const,
  lists: () => [...networkKeys.root, 'list'] as const,
  list: (p: NetworkListParams) => [...networkKeys.lists(), p] as const,
  detail: (id: number) => [...networkKeys.root, 'detail', id] as const,
  versions: (id: number) => [...networkKeys.detail(id), 'versions'] as const,
  version: (id: number, versionId: number) => [...networkKeys.detail(id), 'version', versionId] as const,
  compare: (id: number, from: number, to: number) => [...networkKeys.detail(id), 'compare', from, to] as const,
  demos: () => [...networkKeys.root, 'demos'] as const,
  limits: () => [...networkKeys.root, 'limits'] as const,
  /** Drawing positions of a version, kept client-side so a save never rearranges the drawing. */
  layout: (versionId: number) => [...networkKeys.root, 'layout', versionId] as const,
};

/** Remembered drawing positions for a version (networks without coordinates are laid out in the app). */
export function useVersionLayout() {
  const qc = useQueryClient();
  return {
    get: (versionId: number) => qc.getQueryData<Float64Array>(networkKeys.layout(versionId)) ?? null,
    set: (versionId: number, xy: Float64Array) => qc.setQueryData(networkKeys.layout(versionId), xy),
  };
}

export interface NetworkListParams {
  search?: string;
  sort?: NetworkSort;
  order?: 'asc' | 'desc';
}

const qs = (p: Record<string, string | number | undefined>) => {
  const parts = Object.entries(p).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => `${k}=${encodeURIComponent(String(v))}`);
  return parts.length ? `?${parts.join('&')}` : '';
};

/** The networks list as it first opens (no search, latest first): NetworkList's initial state, and what is fetched early after signing in. */
export const FIRST_NETWORK_LIST = { search: '', sort: 'updated', order: 'desc' } as const satisfies NetworkListParams;

const networkListQuery = (params: NetworkListParams) => ({
  queryKey: networkKeys.list(params),
  staleTime: STALE.list,
  queryFn: () => api.get<NetworkListItem[]>(`/networks${qs({ search: params.search?.trim(), sort: params.sort, order: params.order })}`),
});

export function useNetworksQuery(params: NetworkListParams) {
  return useQuery({
    ...networkListQuery(params),
    placeholderData: keepPreviousData, // typing in the search box keeps the last list on screen
  });
}

/** Start reading the first networks list now (signing in: in parallel with loading the list's screen code). */
export function prefetchFirstNetworkList(qc: QueryClient): void {
  void qc.prefetchQuery(networkListQuery(FIRST_NETWORK_LIST));
}

export function useNetworkQuery(id: number) {
  return useQuery({ queryKey: networkKeys.detail(id), staleTime: STALE.detail, enabled: id > 0, queryFn: () => api.get<NetworkDetail>(`/networks/${id}`) });
}

export function useNetworkVersionsQuery(id: number) {
  return useQuery({ queryKey: networkKeys.versions(id), staleTime: STALE.detail, enabled: id > 0, queryFn: () => api.get<VersionInfo[]>(`/networks/${id}/versions`) });
}

/** Versions never change once written, so a fetched one stays fresh. */
export function useNetworkVersionQuery(id: number, versionId: number | null) {
  return useQuery({
    queryKey: networkKeys.version(id, versionId ?? 0),
    staleTime: Infinity,
    enabled: id > 0 && !!versionId,
    queryFn: () => api.get<VersionDetail>(`/networks/${id}/versions/${versionId}`),
  });
}

export function useNetworkCompareQuery(id: number, from: number | null, to: number | null) {
  return useQuery({
    queryKey: networkKeys.compare(id, from ?? 0, to ?? 0),
    staleTime: Infinity,
    enabled: id > 0 && !!from && !!to && from !== to,
    queryFn: () => api.get<VersionComparison>(`/networks/${id}/compare${qs({ from: from!, to: to! })}`),
  });
}

export interface DemoNetworkInfo {
  key: string;
  name: string;
  description: string;
  depots: number;
  lanes: number;
}

export function useDemoNetworksQuery(enabled = true) {
  return useQuery({ queryKey: networkKeys.demos(), staleTime: STALE.static, enabled, queryFn: () => api.get<DemoNetworkInfo[]>('/networks/demos') });
}

export function useImportLimitsQuery() {
  return useQuery({ queryKey: networkKeys.limits(), staleTime: STALE.static, queryFn: () => api.get<{ maxFileBytes: number; maxDepots: number; maxLanes: number }>('/networks/limits') });
}

/**
 * The one cache rule for networks: whatever a mutation changed, the lists and the network's
 * detail (versions, opened versions, comparisons live under it) are refetched; a deleted network's
 * entries are dropped instead, so nothing refetches (and retries) an address that is gone.
 */
export function networkChanged(qc: QueryClient, id: number | null, how: 'changed' | 'deleted' = 'changed'): Promise<unknown> {
  if (id !== null && how === 'deleted') {
    qc.removeQueries({ queryKey: networkKeys.detail(id) });
    return qc.invalidateQueries({ queryKey: networkKeys.lists() });
  }
  return Promise.all([
    qc.invalidateQueries({ queryKey: networkKeys.lists() }),
    id !== null ? qc.invalidateQueries({ queryKey: networkKeys.detail(id) }) : null,
  ]);
}

export function useNetworkCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: NetworkBody) => api.post<{ id: number; versionId: number; number: number }>('/networks', body),
    onSuccess: (r) => networkChanged(qc, r.id),
  });
}

export function useNetworkVersionCreateMutation(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: VersionBody) => api.post<{ versionId: number; number: number }>(`/networks/${id}/versions`, body),
    onSuccess: () => networkChanged(qc, id),
  });
}

export function useVersionDuplicateMutation(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (versionId: number) => api.post<{ versionId: number; number: number }>(`/networks/${id}/versions/${versionId}/duplicate`),
    onSuccess: () => networkChanged(qc, id),
  });
}

export function useNetworkRenameMutation(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => api.patch<{ id: number; name: string }>(`/networks/${id}`, { name }),
    onSuccess: () => networkChanged(qc, id),
  });
}

export function useNetworkDeleteMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete<void>(`/networks/${id}`),
    onSuccess: (_r, id) => networkChanged(qc, id, 'deleted'),
  });
}

export function useDemoCopyMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (key: string) => api.post<{ id: number; versionId: number }>('/networks/demos', { key }),
    onSuccess: (r) => networkChanged(qc, r.id),
  });
}

/** A file chosen with expo-document-picker (web gives a File; native gives a uri). */
export interface PickedFile {
  name: string;
  uri: string;
  mimeType?: string;
  file?: Blob;
}

export interface ImportRequest {
  file: PickedFile;
  depots?: PickedFile | null;
  name?: string;
  mapping?: Record<string, string>;
  dropBadRows?: boolean;
  networkId?: number;
}

function importForm(r: ImportRequest): FormData {
  const form = new FormData();
  const append = (field: string, f: PickedFile) => {
    if (f.file) form.append(field, f.file, f.name);
    // React Native's FormData takes {uri, name, type} for a file on disk.
    else form.append(field, { uri: f.uri, name: f.name, type: f.mimeType ?? 'application/octet-stream' } as unknown as Blob);
  };
  append('file', r.file);
  if (r.depots) append('depots', r.depots);
  if (r.name) form.append('name', r.name);
  if (r.mapping && Object.keys(r.mapping).length > 0) form.append('mapping', JSON.stringify(r.mapping));
  if (r.dropBadRows) form.append('dropBadRows', 'true');
  if (r.networkId) form.append('networkId', String(r.networkId));
  return form;
}

/** Reads the files and reports what would be imported; writes nothing. */
export function useImportPreviewMutation() {
  return useMutation({ mutationFn: (r: ImportRequest) => api.upload<ImportPreview>('/networks/import/preview', importForm(r)) });
}

export function useImportMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (r: ImportRequest) => api.upload<{ id: number; versionId: number; number: number; dropped: number }>('/networks/import', importForm(r)),
    onSuccess: (r) => networkChanged(qc, r.id),
  });
}

/** Download address of a version export (the session cookie authorises it; on web it is opened). */
export function exportUrl(id: number, versionId: number, kind: 'lanes-csv' | 'depots-csv' | 'geojson'): string {
  const g = globalThis as { location?: { origin?: string } };
  const base = `${g.location?.origin ?? ''}/api/networks/${id}/versions/${versionId}`;
  return kind === 'geojson' ? `${base}/export.geojson` : `${base}/export.csv${kind === 'depots-csv' ? '?part=depots' : ''}`;
}
