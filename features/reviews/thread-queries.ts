import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import type { Pin, Thread, ThreadStatus, VersionReview } from '@/shared/reviews';
import { call, routeKey, staleTime } from '@/features/api';

const routes = apiContract.reviews;
const versionInput = (designId: string, n: number) => ({ params: { id: designId, n } });

/** The query key of one version's review (threads, carried threads, requests, decisions). */
export function versionReviewKey(designId: string, n: number) {
  return routeKey(routes.get, versionInput(designId, n));
}

/** A version's review: its threads and the open ones carried from earlier versions, requests, decisions and state. */
export function useVersionReviewQuery(designId: string, n: number, enabled = true) {
  const input = versionInput(designId, n);
  return useQuery({
    queryKey: routeKey(routes.get, input),
    queryFn: ({ signal }) => call(routes.get, input, { signal }),
    // Colleagues write while the screen is open; a short freshness keeps the threads near live.
    staleTime: staleTime.live,
    enabled: enabled && designId !== '',
  });
}

/** The team's members, for `@` completion (the same key as the members screen's query). */
export function useMentionCandidatesQuery(teamId: string, enabled: boolean) {
  const input = { params: { teamId } };
  return useQuery({
    queryKey: routeKey(apiContract.teams.members, input),
    queryFn: ({ signal }) => call(apiContract.teams.members, input, { signal }),
    select: (data) => data.members,
    enabled: enabled && teamId !== '',
  });
}

/**
 * After any thread change: the answer replaces that thread in the version's review at once (one's
 * own remark shows without waiting), then the review and the design's states are fetched again,
 * since a thread of an earlier version shows on every later one and the open counts move.
 */
function useThreadChange(designId: string, n: number) {
  const queryClient = useQueryClient();
  const key = versionReviewKey(designId, n);
  return {
    put(thread: Thread) {
      queryClient.setQueryData(key, (old: VersionReview | undefined) => {
        if (!old) return old;
        const index = old.threads.findIndex((t) => t.id === thread.id);
        if (index === -1) return { ...old, threads: [...old.threads, { ...thread, carry: thread.version === n ? { state: 'here' as const } : thread.carry }] };
        // The answer's carry is read from the thread's own version; keep this version's reading.
        const threads = old.threads.map((t, i) => (i === index ? { ...thread, carry: t.carry } : t));
        return { ...old, threads };
      });
    },
    settle() {
      void queryClient.invalidateQueries({ queryKey: routeKey(routes.get) });
      void queryClient.invalidateQueries({ queryKey: routeKey(routes.states, { params: { id: designId } }) });
    },
  };
}

export function useStartThreadMutation(designId: string, n: number) {
  const change = useThreadChange(designId, n);
  return useMutation({
    mutationFn: (body: { pin: Pin; body: string; mentions: string[] }) => call(routes.startThread, { ...versionInput(designId, n), body }),
    onSuccess: ({ thread }) => change.put(thread),
    onSettled: () => change.settle(),
  });
}

export function useReplyMutation(designId: string, n: number) {
  const change = useThreadChange(designId, n);
  return useMutation({
    mutationFn: ({ threadId, ...body }: { threadId: string; body: string; mentions: string[] }) =>
      call(routes.reply, { params: { threadId }, body }),
    onSuccess: ({ thread }) => change.put(thread),
    onSettled: () => change.settle(),
  });
}

export function useSetThreadStatusMutation(designId: string, n: number) {
  const change = useThreadChange(designId, n);
  return useMutation({
    mutationFn: ({ threadId, status }: { threadId: string; status: ThreadStatus }) =>
      call(routes.setThreadStatus, { params: { threadId }, body: { status } }),
    onSuccess: ({ thread }) => change.put(thread),
    onSettled: () => change.settle(),
  });
}

export function useEditRemarkMutation(designId: string, n: number) {
  const change = useThreadChange(designId, n);
  return useMutation({
    mutationFn: ({ remarkId, ...body }: { remarkId: string; body: string; mentions: string[] }) =>
      call(routes.editRemark, { params: { remarkId }, body }),
    onSuccess: ({ thread }) => change.put(thread),
    onSettled: () => change.settle(),
  });
}

export function useRemoveRemarkMutation(designId: string, n: number) {
  const change = useThreadChange(designId, n);
  return useMutation({
    mutationFn: ({ remarkId }: { remarkId: string }) => call(routes.removeRemark, { params: { remarkId } }),
    onSuccess: ({ thread }) => change.put(thread),
    onSettled: () => change.settle(),
  });
}
