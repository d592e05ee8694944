import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client';
import type { MembersAnswer } from '../../shared/schemas/auth';
import type { Role } from '../../shared/permissions';
import { useSessionChange } from './auth';
import { invitationKeys } from './invitations';
import { STALE } from './staleTimes';

export const memberKeys = {
  root: ['members'] as const,
  list: () => [...memberKeys.root, 'list'] as const,
};

export function useMembersQuery(enabled = true) {
  return useQuery({ queryKey: memberKeys.list(), staleTime: STALE.list, enabled, queryFn: () => api.get<MembersAnswer>('/members') });
}

function useInvalidateTeam() {
  const qc = useQueryClient();
  return () => Promise.all([qc.invalidateQueries({ queryKey: memberKeys.root }), qc.invalidateQueries({ queryKey: invitationKeys.root }), qc.invalidateQueries({ queryKey: ['audit'] })]);
}

export function useMemberRoleMutation() {
  const invalidate = useInvalidateTeam();
  return useMutation({ mutationFn: (v: { id: number; role: Role }) => api.patch<MembersAnswer>(`/members/${v.id}`, { role: v.role }), onSuccess: invalidate });
}

export function useMemberRemoveMutation() {
  const invalidate = useInvalidateTeam();
  return useMutation({ mutationFn: (id: number) => api.delete<void>(`/members/${id}`), onSuccess: invalidate });
}

/** Transfer changes the caller's own role: refresh Me as well. */
export function useOwnershipTransferMutation() {
  const invalidate = useInvalidateTeam();
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (userId: number) => api.post<MembersAnswer>('/organisation/transfer', { userId }),
    onSuccess: () => Promise.all([invalidate(), qc.invalidateQueries({ queryKey: ['auth'] })]),
  });
}

export function useOrganisationCloseMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: (confirmName: string) => api.delete<void>('/organisation', { confirmName }), onSuccess: () => changed() });
}
