import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api } from '../api/client';
import type { AuditPage } from '../../shared/schemas/auth';
import { STALE } from './staleTimes';

export const auditKeys = {
  root: ['audit'] as const,
  page: (page: number, pageSize: number) => [...auditKeys.root, 'page', page, pageSize] as const,
};

export function useAuditQuery(page: number, pageSize = 25, enabled = true) {
  return useQuery({
    queryKey: auditKeys.page(page, pageSize),
    staleTime: STALE.list,
    enabled,
    placeholderData: keepPreviousData, // keep the old page on screen while the next loads
    queryFn: () => api.get<AuditPage>(`/audit?page=${page}&pageSize=${pageSize}`),
  });
}
