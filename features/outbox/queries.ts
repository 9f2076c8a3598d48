import { useQuery } from '@tanstack/react-query';
import { outboxResponseSchema } from '@/shared/outbox';
import { api, staleTime } from '@/features/api';

export const outboxKeys = {
  all: ['outbox'] as const,
  list: () => [...outboxKeys.all, 'list'] as const,
};

export function useOutboxQuery() {
  return useQuery({
    queryKey: outboxKeys.list(),
    queryFn: ({ signal }) => api('/dev/outbox', outboxResponseSchema, { signal }),
    select: (data) => data.messages,
    staleTime: staleTime.live,
    refetchInterval: 5_000,
    retry: false,
  });
}
