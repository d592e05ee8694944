import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '../api/client';
import type { Invitation, InvitationPreview, Invite, AcceptInvitation, Me } from '../../shared/schemas/auth';
import { useSessionChange } from './auth';
import { STALE } from './staleTimes';

export const invitationKeys = {
  root: ['invitations'] as const,
  pending: () => [...invitationKeys.root, 'pending'] as const,
  /** Under 'public': the same for everyone, so a session change does not refetch it (see useSessionChange). */
  preview: (token: string) => ['public', 'invitation-preview', token] as const,
};

export function useInvitationsQuery(enabled = true) {
  return useQuery({ queryKey: invitationKeys.pending(), staleTime: STALE.list, enabled, queryFn: () => api.get<Invitation[]>('/invitations') });
}

/** What an invitation link is for; the error (410) says when it expired or was used. */
export function useInvitationPreviewQuery(token: string) {
  return useQuery({
    queryKey: invitationKeys.preview(token),
    staleTime: STALE.detail,
    enabled: token.length > 0,
    retry: (count, err) => !(err instanceof ApiError && err.status < 500) && count < 2,
    queryFn: () => api.get<InvitationPreview>(`/invitations/lookup?token=${encodeURIComponent(token)}`),
  });
}

function useInvalidateTeam() {
  const qc = useQueryClient();
  return () => Promise.all([qc.invalidateQueries({ queryKey: invitationKeys.root }), qc.invalidateQueries({ queryKey: ['members'] }), qc.invalidateQueries({ queryKey: ['audit'] })]);
}

export function useInvitationCreateMutation() {
  const invalidate = useInvalidateTeam();
  // onSettled: a 503 mail_failed still saved the invitation, so the pending list must refresh.
  return useMutation({ mutationFn: (body: Invite) => api.post<Invitation>('/invitations', body), onSettled: invalidate });
}

export function useInvitationResendMutation() {
  const invalidate = useInvalidateTeam();
  return useMutation({ mutationFn: (id: number) => api.post<Invitation>(`/invitations/${id}/resend`), onSuccess: invalidate });
}

export function useInvitationCancelMutation() {
  const invalidate = useInvalidateTeam();
  return useMutation({ mutationFn: (id: number) => api.delete<void>(`/invitations/${id}`), onSuccess: invalidate });
}

/** Joining signs the visitor in (or moves a signed-in user to the new organisation). */
export function useInvitationAcceptMutation() {
  const changed = useSessionChange();
  return useMutation({ mutationFn: (body: AcceptInvitation) => api.post<Me>('/invitations/accept', body), onSuccess: (me) => changed(me) });
}
