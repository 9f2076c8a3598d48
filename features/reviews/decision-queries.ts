import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import type { RecordDecisionRequest, RequestReview } from '@/shared/reviews';
import { can } from '@/shared/teams';
import { call, routeKey, staleTime, withParams } from '@/features/api';

const routes = apiContract.reviews;
const versionInput = (designId: string, n: number) => ({ params: { id: designId, n } });

/** Every version's review state and open thread count, newest first (history and notebook). */
export function useReviewStatesQuery(designId: string, enabled = true) {
  const input = { params: { id: designId } };
  return useQuery({
    queryKey: routeKey(routes.states, input),
    queryFn: ({ signal }) => call(routes.states, input, { signal }),
    select: (data) => data.versions,
    enabled,
    staleTime: staleTime.live,
  });
}

/**
 * The members who may be asked to review a version: those whose role can decide, less its author
 * (who never decides on it). The team comes from the design's cached answer, which the notebook
 * screen has already fetched under the same key.
 */
export function useReviewerChoicesQuery(designId: string, authorId: string | null, enabled: boolean) {
  const designInput = { params: { id: designId } };
  const design = useQuery({
    queryKey: routeKey(apiContract.notebooks.get, designInput),
    queryFn: ({ signal }) => call(apiContract.notebooks.get, designInput, { signal }),
    select: (data) => data.design.teamId,
    enabled,
  });
  const teamId = design.data ?? '';
  const membersInput = { params: { teamId } };
  return useQuery({
    queryKey: routeKey(apiContract.teams.members, membersInput),
    queryFn: ({ signal }) => call(apiContract.teams.members, membersInput, { signal }),
    select: (data) =>
      data.members
        .filter((member) => can(member.role, 'designs.review') && member.userId !== authorId)
        .sort((a, b) => a.displayName.localeCompare(b.displayName)),
    enabled: enabled && teamId !== '',
  });
}

/**
 * A request or decision changes the version's review, the design's states (history) and the
 * team's list (its state column and filter), so all three are fetched again.
 */
function useForgetReviewAnswers(designId: string) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      // reviews.get of every version (a decision names the latest earlier sign-off) and reviews.states.
      queryClient.invalidateQueries({ predicate: withParams('reviews', { id: designId }) }),
      queryClient.invalidateQueries({ queryKey: routeKey(apiContract.notebooks.list) }),
    ]);
}

export function useRequestReviewMutation(designId: string, n: number) {
  const forget = useForgetReviewAnswers(designId);
  return useMutation({
    mutationFn: (body: RequestReview) => call(routes.requestReview, { ...versionInput(designId, n), body }),
    onSuccess: forget,
  });
}

export function useDecideMutation(designId: string, n: number) {
  const forget = useForgetReviewAnswers(designId);
  return useMutation({
    mutationFn: (body: RecordDecisionRequest) => call(routes.decide, { ...versionInput(designId, n), body }),
    onSuccess: forget,
  });
}
