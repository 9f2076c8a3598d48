import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import type { MailSettings, MarkReadRequest } from '@/shared/reviews';
import { call, routeKey, staleTime } from '@/features/api';

const routes = apiContract.inbox;

/** How often the header's count asks again while a screen stays open: new events arrive from others. */
export const unreadRefetchMs = 30_000;

const unreadKey = routeKey(routes.unreadCount, {});

/** The header badge's number. `enabled` is false while signed out (the route answers 401). */
export function useUnreadCountQuery(enabled: boolean) {
  return useQuery({
    queryKey: unreadKey,
    queryFn: ({ signal }) => call(routes.unreadCount, {}, { signal }),
    select: (data) => data.unread,
    enabled,
    staleTime: staleTime.live,
    refetchInterval: unreadRefetchMs,
    retry: false,
  });
}

export function useInboxQuery(onlyUnread: boolean) {
  const queryClient = useQueryClient();
  const input = { query: { unread: onlyUnread ? ('only' as const) : ('all' as const) } };
  return useQuery({
    queryKey: routeKey(routes.list, input),
    queryFn: async ({ signal }) => {
      const answer = await call(routes.list, input, { signal });
      // The list carries the count too: the header badge need not wait for its own next poll.
      queryClient.setQueryData(unreadKey, { unread: answer.unread });
      return answer;
    },
    staleTime: staleTime.live,
    refetchInterval: unreadRefetchMs,
  });
}

/** Marks items (or all) read; the answer is the new unread count, so the badge changes at once. */
export function useMarkReadMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MarkReadRequest) => call(routes.markRead, { body }),
    onSuccess: ({ unread }) => {
      queryClient.setQueryData(unreadKey, { unread });
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.list) }),
  });
}

const settingsKey = routeKey(routes.mailSettings, {});

export function useMailSettingsQuery() {
  return useQuery({
    queryKey: settingsKey,
    queryFn: ({ signal }) => call(routes.mailSettings, {}, { signal }),
    select: (data) => data.settings,
  });
}

export function useUpdateMailSettingsMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MailSettings) => call(routes.updateMailSettings, { body }),
    onSuccess: (answer) => {
      queryClient.setQueryData(settingsKey, answer);
    },
  });
}
