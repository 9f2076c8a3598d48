import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  acceptInvitationResponseSchema,
  invitationListResponseSchema,
  invitationPreviewSchema,
  invitationResponseSchema,
  memberListResponseSchema,
  memberResponseSchema,
  teamListResponseSchema,
  teamResponseSchema,
  type InviteRequest,
  type Role,
} from '@/shared/teams';
import { api, staleTime } from '@/features/api';

export const teamKeys = {
  all: ['teams'] as const,
  list: () => [...teamKeys.all, 'list'] as const,
  detail: (teamId: string) => [...teamKeys.all, 'detail', teamId] as const,
  members: (teamId: string) => [...teamKeys.detail(teamId), 'members'] as const,
  invitations: (teamId: string) => [...teamKeys.detail(teamId), 'invitations'] as const,
  invitation: (token: string) => [...teamKeys.all, 'invitation', token] as const,
};

const team = (id: string) => `/teams/${encodeURIComponent(id)}`;

export function useTeamsQuery() {
  return useQuery({
    queryKey: teamKeys.list(),
    queryFn: ({ signal }) => api('/teams', teamListResponseSchema, { signal }),
    select: (data) => data.teams,
    staleTime: staleTime.stable,
  });
}

export function useTeamQuery(teamId: string) {
  return useQuery({
    queryKey: teamKeys.detail(teamId),
    queryFn: ({ signal }) => api(team(teamId), teamResponseSchema, { signal }),
    select: (data) => data.team,
  });
}

export function useMembersQuery(teamId: string) {
  return useQuery({
    queryKey: teamKeys.members(teamId),
    queryFn: ({ signal }) => api(`${team(teamId)}/members`, memberListResponseSchema, { signal }),
    select: (data) => data.members,
  });
}

export function useInvitationsQuery(teamId: string, enabled: boolean) {
  return useQuery({
    queryKey: teamKeys.invitations(teamId),
    queryFn: ({ signal }) => api(`${team(teamId)}/invitations`, invitationListResponseSchema, { signal }),
    select: (data) => data.invitations,
    enabled,
  });
}

export function useInvitationPreviewQuery(token: string) {
  return useQuery({
    queryKey: teamKeys.invitation(token),
    queryFn: ({ signal }) => api(`/invitations/${encodeURIComponent(token)}`, invitationPreviewSchema, { signal }),
    retry: false,
  });
}

export function useCreateTeamMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => api('/teams', teamResponseSchema, { method: 'POST', body: { name } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.list() }),
  });
}

export function useChangeRoleMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) =>
      api(`${team(teamId)}/members/${encodeURIComponent(userId)}`, memberResponseSchema, { method: 'PATCH', body: { role } }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: teamKeys.detail(teamId) }),
  });
}

export function useRemoveMemberMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => api(`${team(teamId)}/members/${encodeURIComponent(userId)}`, z.unknown(), { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.all }),
  });
}

export function useInviteMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteRequest) => api(`${team(teamId)}/invitations`, invitationResponseSchema, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.invitations(teamId) }),
  });
}

export function useRevokeInvitationMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) =>
      api(`${team(teamId)}/invitations/${encodeURIComponent(invitationId)}`, z.unknown(), { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.invitations(teamId) }),
  });
}

export function useAcceptInvitationMutation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api(`/invitations/${encodeURIComponent(token)}/accept`, acceptInvitationResponseSchema, { method: 'POST' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.all }),
  });
}
