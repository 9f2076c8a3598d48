import { useQuery } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import { call, routeKey, staleTime } from '@/features/api';

const health = apiContract.platform.health;

export function useHealthQuery() {
  return useQuery({
    queryKey: routeKey(health, {}),
    queryFn: ({ signal }) => call(health, {}, { signal }),
    staleTime: staleTime.live,
  });
}
