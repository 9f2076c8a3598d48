import { QueryClient } from '@tanstack/react-query';

/** Shared stale times, so screens agree on how fresh "fresh" is. */
export const staleTime = {
  /** Things that change only when someone saves (design versions, team lists). */
  stable: 60_000,
  /** Status read-outs such as health. */
  live: 10_000,
} as const;

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { staleTime: staleTime.stable, retry: 1, refetchOnWindowFocus: false },
    },
  });
}
