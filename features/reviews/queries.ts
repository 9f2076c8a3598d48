import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  reviewListResponseSchema,
  reviewPaths,
  reviewResponseSchema,
  type CreateReviewRequest,
} from '@/shared/reviews';
import { api, staleTime } from '@/features/api';

export const reviewKeys = {
  all: ['reviews'] as const,
  design: (designId: string) => [...reviewKeys.all, designId] as const,
  version: (designId: string, n: number) => [...reviewKeys.design(designId), n] as const,
};

/** `reviewPaths` spell the whole `/api/…` path; the client adds `/api` itself. */
const path = (full: string) => full.replace(/^\/api/, '');

export function useReviewsQuery(designId: string, n: number) {
  return useQuery({
    queryKey: reviewKeys.version(designId, n),
    queryFn: ({ signal }) => api(path(reviewPaths.reviews(designId, n)), reviewListResponseSchema, { signal }),
    select: (data) => data.reviews,
    // Colleagues comment while the screen is open; a short freshness keeps the list near live.
    staleTime: staleTime.live,
  });
}

export function useCreateReviewMutation(designId: string, n: number) {
  const queryClient = useQueryClient();
  const key = reviewKeys.version(designId, n);
  return useMutation({
    mutationFn: (body: CreateReviewRequest) =>
      api(path(reviewPaths.reviews(designId, n)), reviewResponseSchema, { method: 'POST', body }),
    onSuccess: ({ review }) => {
      // Show one's own comment at once; the refetch below brings in anyone else's.
      queryClient.setQueryData(key, (old: { reviews: (typeof review)[] } | undefined) => ({
        reviews: [...(old?.reviews ?? []), review],
      }));
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: key }),
  });
}
