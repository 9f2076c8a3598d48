import { useQuery } from '@tanstack/react-query';
import { healthSchema } from '@/shared/health';
import { api, staleTime } from '@/features/api';

export const healthKeys = {
  all: ['health'] as const,
};

export function useHealthQuery() {
  return useQuery({
    queryKey: healthKeys.all,
    queryFn: ({ signal }) => api('/health', healthSchema, { signal }),
    staleTime: staleTime.live,
  });
}
