import { useQuery } from '@tanstack/react-query';
import { api, ApiError } from '../api/client';
import type { Me } from '../../shared/schemas/auth';
import { STALE } from './staleTimes';

export const authKeys = {
  root: ['auth'] as const,
  me: () => [...authKeys.root, 'me'] as const,
};

/** The signed-in user and organisation; `data === null` when signed out. */
export function useMeQuery() {
  return useQuery({
    queryKey: authKeys.me(),
    staleTime: STALE.me,
    retry: (count, err) => !(err instanceof ApiError && err.status < 500) && count < 2,
    queryFn: async (): Promise<Me | null> => {
      try {
        return await api.get<Me>('/auth/me');
      } catch (err) {
        if (err instanceof ApiError && (err.status === 401 || err.status === 404)) return null;
        throw err;
      }
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { resetCsrf } from '../api/client';
import type { SignIn, SignUp } from '../../shared/schemas/auth';

function useSessionChange() {
  const qc = useQueryClient();
  return async () => {
    resetCsrf();
    qc.clear();
    await qc.invalidateQueries({ queryKey: authKeys.me() });
  };
}

export function useSignInMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: (body: SignIn) => api.post<Me>('/auth/sign-in', body), onSuccess: changed });
}

export function useSignUpMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: (body: SignUp) => api.post<Me>('/auth/sign-up', body), onSuccess: changed });
}

export function useSignOutMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: () => api.post<void>('/auth/sign-out'), onSuccess: changed });
}
