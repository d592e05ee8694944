import { useMemo, useState } from 'react';
import { keepPreviousData, useMutation, useQueries, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client';
import type { VersionDetail } from '../../shared/schemas/networks';
import type { CreateRunBody, PreviewBody, RunDetail, RunListItem, RunPreview, RunProblem, SolverOption } from '../runs/types';
import { STALE } from './staleTimes';
import { runKeys } from './runKeys';
import { useRunStream, useRunStreams } from './useRunStream';

/** While any job of a run is waiting or working and its progress stream is not open, the run is polled this often (ms). */
export const LIVE_POLL_MS = 1000;

export { runKeys };

/** True while the run still changes (some job queued or running). */
export function isLive(run: Pick<RunDetail, 'status' | 'jobs'> | undefined | null): boolean {
  if (!run) return false;
  if (run.status === 'awaiting_payment') return false;
  return run.jobs.some((j) => j.status === 'queued' || j.status === 'running');
}

export function useRunsQuery(filters: { networkId?: number; status?: string } = {}) {
  return useQuery({
    queryKey: runKeys.list(filters),
    staleTime: STALE.list,
    queryFn: () => {
      const q = new URLSearchParams();
      if (filters.networkId) q.set('networkId', String(filters.networkId));
      if (filters.status) q.set('status', filters.status);
      const qs = q.toString();
      return api.get<{ runs: RunListItem[] } | RunListItem[]>(`/runs${qs ? `?${qs}` : ''}`).then((b) => (Array.isArray(b) ? b : b.runs));
    },
    // A list with unfinished runs keeps its progress fresh too, more slowly than one run.
    refetchInterval: (query) => (query.state.data?.some((r) => r.status === 'queued' || r.status === 'running') ? 3 * LIVE_POLL_MS : false),
  });
}

/**
 * One run with its jobs. While any job is queued or running, the server's progress stream
 * (useRunStream) updates the cache as events arrive; only when the stream is not open (not yet,
 * or it failed) is the run polled every second. Both stop by themselves when the run is done;
 * the cache keeps the run, so leaving the screen and coming back shows the latest state at once.
 */
export function useRunQuery(id: number | null | undefined) {
  const [live, setLive] = useState(false);
  const streaming = useRunStream(id, live);
  const query = useQuery({
    queryKey: runKeys.detail(id ?? 0),
    enabled: !!id,
    staleTime: STALE.live,
    queryFn: () => api.get<RunDetail>(`/runs/${id}`),
    refetchInterval: (q) => (isLive(q.state.data) && !streaming ? LIVE_POLL_MS : false),
    refetchIntervalInBackground: true,
  });
  const nowLive = isLive(query.data);
  if (nowLive !== live) setLive(nowLive);
  return query;
}

/**
 * Several runs at once (compare). Like useRunQuery: each run still queued or running follows its
 * progress stream (useRunStreams) and is polled only while its stream is not open; a finished run
 * is neither streamed nor polled.
 */
export function useRunsByIdQuery(ids: number[]) {
  const [liveIds, setLiveIds] = useState<number[]>([]);
  const streaming = useRunStreams(liveIds);
  const results = useQueries({
    queries: ids.map((id) => ({
      queryKey: runKeys.detail(id),
      staleTime: STALE.live,
      queryFn: () => api.get<RunDetail>(`/runs/${id}`),
      refetchInterval: (query: { state: { data?: RunDetail } }) => (isLive(query.state.data) && !streaming.has(id) ? LIVE_POLL_MS : false),
      refetchIntervalInBackground: true,
    })),
  });
  const nowLive = ids.filter((_, i) => isLive(results[i]?.data));
  if (nowLive.join(',') !== liveIds.join(',')) setLiveIds(nowLive);
  return results;
}

export function useSolversQuery() {
  return useQuery({
    queryKey: runKeys.solvers(),
    staleTime: STALE.static,
    queryFn: () => api.get<{ solvers: SolverOption[] }>('/solvers').then((b) => b.solvers),
  });
}

/**
 * Solver labels from the registry's listing, by name: the one way screens name a solver
 * ("Tabu search", never "tabu"). Falls back to the name only until the listing has loaded.
 */
export function useSolverLabels(): Record<string, string> {
  const solvers = useSolversQuery();
  return useMemo(() => Object.fromEntries((solvers.data ?? []).map((s) => [s.name, s.label])), [solvers.data]);
}

export interface SolverDefaultsAnswer {
  defaults: string[];
  depots: number;
  lanes: number;
  /** Each solver's answer for this question with default settings (server/services/solver-defaults.ts). */
  solvers?: { name: string; qubits: number; refusal: string | null }[];
}

/** The size-based default solver set (shared/runs/default-solvers.ts, evaluated by the API). */
export function useSolverDefaultsQuery(versionId: number | null, problem: RunProblem) {
  return useQuery({
    queryKey: runKeys.defaults(versionId ?? 0, problem),
    enabled: !!versionId,
    staleTime: STALE.static,
    placeholderData: keepPreviousData,
    queryFn: () => api.post<SolverDefaultsAnswer>('/solvers/defaults', { versionId, problem }),
  });
}

/** The encoding summary, refusals, time estimate and price of a run before it is created (nothing is written). */
export function useRunPreviewQuery(body: PreviewBody | null) {
  return useQuery({
    queryKey: runKeys.preview(body ?? ({} as PreviewBody)),
    enabled: !!body && body.solvers.length > 0,
    staleTime: STALE.detail,
    retry: false,
    // Keep showing the last summary while the next one loads (typing a precision, tapping pins).
    placeholderData: keepPreviousData,
    queryFn: () => api.post<RunPreview>('/runs/preview', body),
  });
}

export function useRunCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateRunBody) => api.post<{ id: number }>('/runs', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: runKeys.lists() }),
  });
}

function useRunAction(action: 'cancel' | 'retry') {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.post<unknown>(`/runs/${id}/${action}`),
    onSuccess: (_data, id) => Promise.all([qc.invalidateQueries({ queryKey: runKeys.detail(id) }), qc.invalidateQueries({ queryKey: runKeys.lists() })]),
  });
}

export const useRunCancelMutation = () => useRunAction('cancel');
export const useRunRetryMutation = () => useRunAction('retry');

export function useRunDeleteMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete<void>(`/runs/${id}`),
    onSuccess: (_data, id) => {
      qc.removeQueries({ queryKey: runKeys.detail(id) });
      return qc.invalidateQueries({ queryKey: runKeys.lists() });
    },
  });
}

/** Same-origin URLs of a run's downloads (the browser fetches them with the session cookie). */
export const runExportUrls = (id: number) => ({
  csv: `/api/runs/${id}/assignment.csv`,
  json: `/api/runs/${id}/report.json`,
});

/**
 * The immutable network version a run was set up on (its depots and lanes, for pins and the
 * partition drawing). Versions never change, so this is cached for long.
 */
export function useRunVersionQuery(networkId: number | null | undefined, versionId: number | null | undefined) {
  return useQuery({
    queryKey: runKeys.version(networkId ?? 0, versionId ?? 0),
    enabled: !!networkId && !!versionId,
    staleTime: Infinity,
    queryFn: () => api.get<VersionDetail>(`/networks/${networkId}/versions/${versionId}`),
  });
}

/** The versions of several runs at once (compare shows which version each run used). */
export function useRunVersionsQuery(pairs: Array<{ networkId: number; versionId: number }>) {
  // Runs on the same version share one query (duplicate keys in one useQueries misbehave).
  const unique = [...new Map(pairs.map((p) => [`${p.networkId}/${p.versionId}`, p])).values()];
  return useQueries({
    queries: unique.map((p) => ({
      queryKey: runKeys.version(p.networkId, p.versionId),
      staleTime: Infinity,
      queryFn: () => api.get<VersionDetail>(`/networks/${p.networkId}/versions/${p.versionId}`),
    })),
  });
}
