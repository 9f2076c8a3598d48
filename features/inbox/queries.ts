import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import type { InboxItem, MailSettings, MarkReadRequest } from '@/shared/reviews';
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

type InboxAnswer = { items: InboxItem[]; unread: number };

/**
 * What every cached list looks like once `body` is read: items marked read now, and gone from the
 * unread-only list. Without it, switching "Only unread" off after "Mark all read" would show the
 * other list's cached copy, still saying Unread, until its refetch came back.
 */
export function listAfterMarkRead(answer: InboxAnswer, body: MarkReadRequest, unread: number, now: string, onlyUnread: boolean): InboxAnswer {
  const marked = (item: InboxItem) => 'all' in body || body.ids.includes(item.id);
  const items = answer.items
    .filter((item) => !(onlyUnread && marked(item)))
    .map((item) => (marked(item) && item.readAt === null ? { ...item, readAt: now } : item));
  return { items, unread };
}

/** Marks items (or all) read; the answer is the new unread count, so the badge changes at once. */
export function useMarkReadMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MarkReadRequest) => call(routes.markRead, { body }),
    onSuccess: ({ unread }, body) => {
      queryClient.setQueryData(unreadKey, { unread });
      const now = new Date().toISOString();
      for (const onlyUnread of [false, true]) {
        const key = routeKey(routes.list, { query: { unread: onlyUnread ? ('only' as const) : ('all' as const) } });
        queryClient.setQueryData<InboxAnswer>(key, (answer) => (answer ? listAfterMarkRead(answer, body, unread, now, onlyUnread) : answer));
      }
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
