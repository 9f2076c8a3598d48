import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { call, routeKey, withParams } from '@/features/api';
import { apiContract } from '@/shared/contract';
import type { CurveCorrections } from '@/shared/curve-file';
import type { CurveKind } from '@/shared/curves';

const routes = apiContract.curves;

/** The team's curve library, newest first, without points. */
export function useTeamCurvesQuery(teamId: string | null) {
  const input = { params: { teamId: teamId ?? '' } };
  return useQuery({
    queryKey: routeKey(routes.list, input),
    queryFn: ({ signal }) => call(routes.list, input, { signal }),
    select: (data) => data.curves,
    enabled: teamId !== null,
  });
}

/** One library curve with its points, for a design to copy. */
export function fetchTeamCurve(teamId: string, curveId: string) {
  return call(routes.get, { params: { teamId, curveId } });
}

export type CurveUpload = {
  file: Blob;
  kind: CurveKind;
  name: string;
  corrections: CurveCorrections;
};

/** Adds a file to the team's library (or finds it there); the list is refetched after. */
export function useUploadTeamCurve(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (upload: CurveUpload) =>
      call(routes.upload, {
        params: { teamId },
        body: { file: upload.file as File, kind: upload.kind, name: upload.name, ...upload.corrections },
      }),
    onSuccess: () => queryClient.invalidateQueries({ predicate: withParams('curves', { teamId }) }),
  });
}

/** Removes a curve from the library (owners); designs keep their copies. */
export function useRemoveTeamCurve(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (curveId: string) => call(routes.remove, { params: { teamId, curveId } }),
    onSuccess: () => queryClient.invalidateQueries({ predicate: withParams('curves', { teamId }) }),
  });
}
