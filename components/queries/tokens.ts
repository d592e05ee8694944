import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client';
import type { ApiToken, CreateToken, CreatedToken } from '../../shared/schemas/auth';
import { STALE } from './staleTimes';

export const tokenKeys = {
  root: ['tokens'] as const,
  list: () => [...tokenKeys.root, 'list'] as const,
};

export function useTokensQuery(enabled = true) {
  return useQuery({ queryKey: tokenKeys.list(), staleTime: STALE.list, enabled, queryFn: () => api.get<ApiToken[]>('/tokens') });
}

/** The answer carries the secret — the only time it is ever shown. */
export function useTokenCreateMutation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: CreateToken) => api.post<CreatedToken>('/tokens', body), onSuccess: () => qc.invalidateQueries({ queryKey: tokenKeys.root }) });
}

export function useTokenRevokeMutation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (id: number) => api.delete<void>(`/tokens/${id}`), onSuccess: () => qc.invalidateQueries({ queryKey: tokenKeys.root }) });
}
