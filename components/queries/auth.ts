import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError, resetCsrf } from '../api/client';
import type { ChangePassword, Me, Profile, ResetConfirm, ResetRequest, SignIn, SignUp } from '../../shared/schemas/auth';
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

/**
 * After sign-in, sign-out, switching organisation or joining one, everything cached belongs to
 * another person or organisation: take the new Me from the answer and reset every other query
 * (mounted ones refetch for the new organisation) except those keyed 'public'. Mutations are left alone, so the caller's own
 * onSuccess (e.g. navigation) still runs.
 */
export function useSessionChange() {
  const qc = useQueryClient();
  return async (me?: Me | null) => {
    resetCsrf();
    await qc.cancelQueries();
    if (me !== undefined) qc.setQueryData(authKeys.me(), me);
    else void qc.invalidateQueries({ queryKey: authKeys.me() });
    void qc.resetQueries({ predicate: (q) => q.queryKey[0] !== authKeys.root[0] && q.queryKey[0] !== 'public' });
  };
}

export function useSignInMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: (body: SignIn) => api.post<Me>('/auth/sign-in', body), onSuccess: (me) => changed(me) });
}

export function useSignUpMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: (body: SignUp) => api.post<Me>('/auth/sign-up', body), onSuccess: (me) => changed(me) });
}

export function useSignOutMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: () => api.post<void>('/auth/sign-out'), onSuccess: () => changed(null) });
}

export function useSwitchOrganisationMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: (organisationId: number) => api.post<Me>('/auth/switch', { organisationId }), onSuccess: (me) => changed(me) });
}

export function useProfileMutation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: Profile) => api.patch<Me>('/auth/me', body), onSuccess: (me) => qc.setQueryData(authKeys.me(), me) });
}

export function usePasswordChangeMutation() {
  return useMutation({ mutationFn: (body: ChangePassword) => api.post<void>('/auth/password', body) });
}

export function useResetRequestMutation() {
  return useMutation({ mutationFn: (body: ResetRequest) => api.post<{ message: string }>('/auth/reset/request', body) });
}

export function useResetConfirmMutation() {
  return useMutation({ mutationFn: (body: ResetConfirm) => api.post<{ reset: true }>('/auth/reset/confirm', body) });
}
