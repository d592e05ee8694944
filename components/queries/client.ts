import { QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from '../api/client';
import { authKeys } from './auth';

/**
 * A refused or missing resource (4xx) does not get better by asking again: show it at once.
 * Network failures and server errors are retried up to three times, as TanStack Query does by default.
 */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 3;
}

/**
 * A 403 means what the app believes about the membership (organisation, role) is out of date —
 * the member was removed or their role changed meanwhile — so the signed-in user is fetched again
 * and the screens follow the answer (the shell shows the way forward when there is no organisation).
 */
function onQueryError(qc: QueryClient, error: unknown, key: readonly unknown[]) {
  if (error instanceof ApiError && error.status === 403 && key[0] !== authKeys.root[0]) void qc.invalidateQueries({ queryKey: authKeys.me() });
}

/** The app's query client (the root layout makes one; tests make their own). */
export function createQueryClient(): QueryClient {
  const qc: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => onQueryError(qc, error, query.queryKey) }),
    defaultOptions: { queries: { refetchOnWindowFocus: true, retry: shouldRetry } },
  });
  return qc;
}
