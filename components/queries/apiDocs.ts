import { useQuery } from '@tanstack/react-query';
import { api } from '../api/client';
import type { OpenApiDocument } from '../api-docs/describe';
import { STALE } from './staleTimes';

export const apiDocsKeys = {
  root: ['api-docs'] as const,
  document: () => [...apiDocsKeys.root, 'openapi'] as const,
};

/** The OpenAPI document (generated from the route table; changes only with a new server version). */
export function useApiDocsQuery() {
  return useQuery({ queryKey: apiDocsKeys.document(), staleTime: STALE.static, queryFn: () => api.get<OpenApiDocument>('/openapi.json') });
}
