import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiContract } from '@/shared/contract';
import {
  versionConflictCode,
  versionConflictDetailsSchema,
  type CloneRequest,
  type CreateDesignRequest,
  type CreateShareLinkRequest,
  type ListDesignsQuery,
  type NotebookFileInput,
  type SaveVersionRequest,
  type UpdateDesignRequest,
  type Version,
} from '@/shared/notebooks';
import { ApiError, call, routeKey, staleTime, withParams } from '@/features/api';

const routes = apiContract.notebooks;
const design = (id: string) => ({ params: { id } });
/** Every cached answer about one design (it, its versions, comparisons and links). */
const aboutDesign = (id: string) => withParams('notebooks', { id });

export function useDesignListQuery(teamId: string, query: ListDesignsQuery) {
  return useQuery({
    queryKey: routeKey(routes.list, { params: { teamId }, query }),
    queryFn: ({ signal }) => call(routes.list, { params: { teamId }, query }, { signal }),
    enabled: teamId !== '',
    placeholderData: keepPreviousData,
    staleTime: staleTime.stable,
  });
}

export function useNotebookQuery(id: string) {
  return useQuery({
    queryKey: routeKey(routes.get, design(id)),
    queryFn: ({ signal }) => call(routes.get, design(id), { signal }),
  });
}

export function useVersionsQuery(id: string) {
  return useQuery({
    queryKey: routeKey(routes.versions, design(id)),
    queryFn: ({ signal }) => call(routes.versions, design(id), { signal }),
    select: (data) => data.versions,
  });
}

/** Versions never change once saved, so a fetched one is fresh for good. */
export function useVersionQuery(id: string, n: number | null) {
  return useQuery({
    queryKey: routeKey(routes.version, { params: { id, n: n ?? 0 } }),
    queryFn: ({ signal }) => call(routes.version, { params: { id, n: n ?? 0 } }, { signal }),
    select: (data) => data.version,
    enabled: n !== null && n > 0,
    staleTime: Infinity,
  });
}

export function useCompareQuery(id: string, a: number, b: number) {
  return useQuery({
    queryKey: routeKey(routes.compare, { params: { id }, query: { a, b } }),
    queryFn: ({ signal }) => call(routes.compare, { params: { id }, query: { a, b } }, { signal }),
    enabled: a > 0 && b > 0,
    staleTime: Infinity,
  });
}

export function useShareLinksQuery(id: string, enabled: boolean) {
  return useQuery({
    queryKey: routeKey(routes.shareLinks, design(id)),
    queryFn: ({ signal }) => call(routes.shareLinks, design(id), { signal }),
    select: (data) => data.links,
    enabled,
  });
}

export function useSharedVersionQuery(token: string) {
  return useQuery({
    queryKey: routeKey(routes.shared, { params: { token } }),
    queryFn: ({ signal }) => call(routes.shared, { params: { token } }, { signal }),
    retry: false,
  });
}

export function useCreateDesignMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateDesignRequest) => call(routes.create, { params: { teamId }, body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.list) }),
  });
}

export function useUpdateDesignMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: UpdateDesignRequest }) => call(routes.update, { ...design(id), body }),
    onSuccess: (_data, { id }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: routeKey(routes.list) }),
        queryClient.invalidateQueries({ predicate: aboutDesign(id) }),
      ]),
  });
}

/** A save answered 409: someone saved first. `latest` is the newest version at that moment. */
export class VersionConflict extends Error {
  constructor(readonly latest: Version) {
    super(`Version ${latest.number} was saved while you were editing.`);
    this.name = 'VersionConflict';
  }
}

/**
 * Saves version latest+1. On a stale base the server answers 409 with the latest version in
 * `error.details`; it is handed to the screen as a `VersionConflict` to show beside the user's
 * edits, so a conflict costs one request.
 */
export async function saveVersion(id: string, body: SaveVersionRequest) {
  try {
    return await call(routes.saveVersion, { ...design(id), body });
  } catch (error) {
    if (error instanceof ApiError && error.status === 409 && error.code === versionConflictCode) {
      // Parsed like every other answer, so a server that drifted fails here, not in the card.
      const details = versionConflictDetailsSchema.safeParse(error.details);
      if (!details.success) {
        throw new ApiError(409, 'bad_response', "The server's answer to notebooks.saveVersion did not match what this app expects.");
      }
      throw new VersionConflict(details.data.latest);
    }
    throw error;
  }
}

export function useSaveVersionMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SaveVersionRequest) => saveVersion(id, body),
    onSuccess: (data) => {
      queryClient.setQueryData(routeKey(routes.version, { params: { id, n: data.version.number } }), { version: data.version });
      // The screen moves to the new version at once, without a stale moment of "someone saved".
      queryClient.setQueryData(routeKey(routes.get, design(id)), { design: data.design, version: data.version });
    },
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: routeKey(routes.get, design(id)), exact: true }),
        queryClient.invalidateQueries({ queryKey: routeKey(routes.versions, design(id)) }),
        queryClient.invalidateQueries({ queryKey: routeKey(routes.list) }),
      ]),
  });
}

export function useCloneMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CloneRequest) => call(routes.clone, { ...design(id), body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.list) }),
  });
}

export function useBaselineMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (version: number | null) => call(routes.setBaseline, { ...design(id), body: { version } }),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: routeKey(routes.get, design(id)), exact: true }),
        queryClient.invalidateQueries({ queryKey: routeKey(routes.list) }),
      ]),
  });
}

export function useCreateShareLinkMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateShareLinkRequest) => call(routes.createShareLink, { ...design(id), body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.shareLinks, design(id)) }),
  });
}

export function useRevokeShareLinkMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) => call(routes.revokeShareLink, { params: { id, linkId } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: routeKey(routes.shareLinks, design(id)) }),
  });
}

/** The notebook file as the server writes it; parsed so a malformed export never reaches disk. */
export function fetchNotebookFile(id: string) {
  return call(routes.exportFile, design(id));
}

export function useImportMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: NotebookFileInput) => call(routes.importFile, { params: { teamId }, body: file }),
    onSuccess: (made) => {
      // The answer is the new design with its latest version: the notebook opens without a fetch.
      queryClient.setQueryData(routeKey(routes.get, design(made.design.id)), made);
      return queryClient.invalidateQueries({ queryKey: routeKey(routes.list) });
    },
  });
}
