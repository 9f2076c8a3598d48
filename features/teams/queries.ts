import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import type { InviteRequest, Role } from '@/shared/teams';
import { call, groupKey, routeKey, staleTime, withParams } from '@/features/api';

const routes = apiContract.teams;

export function useTeamsQuery() {
  return useQuery({
    queryKey: routeKey(routes.list, {}),
    queryFn: ({ signal }) => call(routes.list, {}, { signal }),
    select: (data) => data.teams,
    staleTime: staleTime.stable,
  });
}

export function useTeamQuery(teamId: string) {
  const input = { params: { teamId } };
  return useQuery({
    queryKey: routeKey(routes.get, input),
    queryFn: ({ signal }) => call(routes.get, input, { signal }),
    select: (data) => data.team,
  });
}

export function useMembersQuery(teamId: string) {
  const input = { params: { teamId } };
  return useQuery({
    queryKey: routeKey(routes.members, input),
    queryFn: ({ signal }) => call(routes.members, input, { signal }),
    select: (data) => data.members,
  });
}

export function useInvitationsQuery(teamId: string, enabled: boolean) {
  const input = { params: { teamId } };
  return useQuery({
    queryKey: routeKey(routes.invitations, input),
    queryFn: ({ signal }) => call(routes.invitations, input, { signal }),
    select: (data) => data.invitations,
    enabled,
  });
}

export function useInvitationPreviewQuery(token: string) {
  const input = { params: { token } };
  return useQuery({
    queryKey: routeKey(routes.previewInvitation, input),
    queryFn: ({ signal }) => call(routes.previewInvitation, input, { signal }),
    retry: false,
  });
}

export function useCreateTeamMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => call(routes.create, { body: { name } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.list) }),
  });
}

export function useChangeRoleMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) => call(routes.changeRole, { params: { teamId, userId }, body: { role } }),
    onSettled: () => queryClient.invalidateQueries({ predicate: withParams('teams', { teamId }) }),
  });
}

export function useRemoveMemberMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => call(routes.removeMember, { params: { teamId, userId } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: groupKey('teams') }),
  });
}

export function useInviteMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteRequest) => call(routes.invite, { params: { teamId }, body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.invitations, { params: { teamId } }) }),
  });
}

export function useRevokeInvitationMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => call(routes.revokeInvitation, { params: { teamId, invitationId } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.invitations, { params: { teamId } }) }),
  });
}

export function useAcceptInvitationMutation(token: string) {
  const queryClient = useQueryClient();
  const preview = routeKey(routes.previewInvitation);
  return useMutation({
    mutationFn: () => call(routes.acceptInvitation, { params: { token } }),
    // Accepting uses the invitation up: asking for it again would only earn a 404 (and a console
    // error). The rest of the teams group changed, the invitation's preview is simply over.
    onSuccess: () =>
      queryClient.invalidateQueries({
        queryKey: groupKey('teams'),
        predicate: (query) => !preview.every((part, index) => query.queryKey[index] === part),
      }),
  });
}
