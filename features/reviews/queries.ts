import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import type { CreateReviewRequest, Review } from '@/shared/reviews';
import { call, routeKey, staleTime } from '@/features/api';

const routes = apiContract.reviews;
const versionInput = (designId: string, n: number) => ({ params: { id: designId, n } });

export function useReviewsQuery(designId: string, n: number) {
  const input = versionInput(designId, n);
  return useQuery({
    queryKey: routeKey(routes.list, input),
    queryFn: ({ signal }) => call(routes.list, input, { signal }),
    select: (data) => data.reviews,
    // Colleagues comment while the screen is open; a short freshness keeps the list near live.
    staleTime: staleTime.live,
  });
}

export function useCreateReviewMutation(designId: string, n: number) {
  const queryClient = useQueryClient();
  const input = versionInput(designId, n);
  const key = routeKey(routes.list, input);
  return useMutation({
    mutationFn: (body: CreateReviewRequest) => call(routes.create, { ...input, body }),
    onSuccess: ({ review }) => {
      // Show one's own comment at once; the refetch below brings in anyone else's.
      queryClient.setQueryData(key, (old: { reviews: Review[] } | undefined) => ({
        reviews: [...(old?.reviews ?? []), review],
      }));
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: key }),
  });
}
