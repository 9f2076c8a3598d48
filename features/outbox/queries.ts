import { useQuery } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import { call, routeKey, staleTime } from '@/features/api';

const outbox = apiContract.platform.outbox;

export function useOutboxQuery() {
  return useQuery({
    queryKey: routeKey(outbox, {}),
    queryFn: ({ signal }) => call(outbox, {}, { signal }),
    select: (data) => data.messages,
    staleTime: staleTime.live,
    refetchInterval: 5_000,
    retry: false,
  });
}
