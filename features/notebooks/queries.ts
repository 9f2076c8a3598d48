import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  compareResponseSchema,
  createShareLinkResponseSchema,
  designListResponseSchema,
  designResponseSchema,
  importResponseSchema,
  notebookFileSchema,
  notebookPaths,
  notebookResponseSchema,
  notebookWithVersionResponseSchema,
  saveVersionResponseSchema,
  shareLinkListResponseSchema,
  sharedVersionResponseSchema,
  versionConflictCode,
  versionConflictDetailsSchema,
  versionListResponseSchema,
  versionResponseSchema,
  type CloneRequest,
  type CreateDesignRequest,
  type CreateShareLinkRequest,
  type ListDesignsQuery,
  type NotebookFileInput,
  type SaveVersionRequest,
  type UpdateDesignRequest,
  type Version,
} from '@/shared/notebooks';
import { api, ApiError, staleTime } from '@/features/api';

export const notebookKeys = {
  all: ['notebooks'] as const,
  lists: () => [...notebookKeys.all, 'list'] as const,
  list: (teamId: string, query: ListDesignsQuery) => [...notebookKeys.lists(), teamId, query] as const,
  detail: (id: string) => [...notebookKeys.all, 'detail', id] as const,
  versions: (id: string) => [...notebookKeys.detail(id), 'versions'] as const,
  version: (id: string, n: number) => [...notebookKeys.detail(id), 'version', n] as const,
  compare: (id: string, a: number, b: number) => [...notebookKeys.detail(id), 'compare', a, b] as const,
  shareLinks: (id: string) => [...notebookKeys.detail(id), 'share-links'] as const,
  shared: (token: string) => [...notebookKeys.all, 'shared', token] as const,
};

/** `notebookPaths` spell the whole `/api/…` path; the client adds `/api` itself. */
const path = (full: string) => full.replace(/^\/api/, '');

function listQueryString(query: ListDesignsQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

export function useDesignListQuery(teamId: string, query: ListDesignsQuery) {
  return useQuery({
    queryKey: notebookKeys.list(teamId, query),
    queryFn: ({ signal }) => api(`${path(notebookPaths.teamDesigns(teamId))}${listQueryString(query)}`, designListResponseSchema, { signal }),
    enabled: teamId !== '',
    placeholderData: keepPreviousData,
    staleTime: staleTime.stable,
  });
}

export function useNotebookQuery(id: string) {
  return useQuery({
    queryKey: notebookKeys.detail(id),
    queryFn: ({ signal }) => api(path(notebookPaths.design(id)), notebookResponseSchema, { signal }),
  });
}

export function useVersionsQuery(id: string) {
  return useQuery({
    queryKey: notebookKeys.versions(id),
    queryFn: ({ signal }) => api(path(notebookPaths.versions(id)), versionListResponseSchema, { signal }),
    select: (data) => data.versions,
  });
}

/** Versions never change once saved, so a fetched one is fresh for good. */
export function useVersionQuery(id: string, n: number | null) {
  return useQuery({
    queryKey: notebookKeys.version(id, n ?? 0),
    queryFn: ({ signal }) => api(path(notebookPaths.version(id, n ?? 0)), versionResponseSchema, { signal }),
    select: (data) => data.version,
    enabled: n !== null && n > 0,
    staleTime: Infinity,
  });
}

export function useCompareQuery(id: string, a: number, b: number) {
  return useQuery({
    queryKey: notebookKeys.compare(id, a, b),
    queryFn: ({ signal }) => api(path(notebookPaths.compare(id, a, b)), compareResponseSchema, { signal }),
    enabled: a > 0 && b > 0,
    staleTime: Infinity,
  });
}

export function useShareLinksQuery(id: string, enabled: boolean) {
  return useQuery({
    queryKey: notebookKeys.shareLinks(id),
    queryFn: ({ signal }) => api(path(notebookPaths.shareLinks(id)), shareLinkListResponseSchema, { signal }),
    select: (data) => data.links,
    enabled,
  });
}

export function useSharedVersionQuery(token: string) {
  return useQuery({
    queryKey: notebookKeys.shared(token),
    queryFn: ({ signal }) => api(path(notebookPaths.shared(token)), sharedVersionResponseSchema, { signal }),
    retry: false,
  });
}

export function useCreateDesignMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateDesignRequest) =>
      api(path(notebookPaths.teamDesigns(teamId)), notebookWithVersionResponseSchema, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notebookKeys.lists() }),
  });
}

export function useUpdateDesignMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: UpdateDesignRequest }) =>
      api(path(notebookPaths.design(id)), designResponseSchema, { method: 'PATCH', body }),
    onSuccess: (_data, { id }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: notebookKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: notebookKeys.detail(id) }),
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
  const to = path(notebookPaths.versions(id));
  try {
    return await api(to, saveVersionResponseSchema, { method: 'POST', body });
  } catch (error) {
    if (error instanceof ApiError && error.status === 409 && error.code === versionConflictCode) {
      // Parsed like every other answer, so a server that drifted fails here, not in the card.
      const details = versionConflictDetailsSchema.safeParse(error.details);
      if (!details.success) {
        throw new ApiError(409, 'bad_response', `The server's answer to ${to} did not match what this app expects.`);
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
      queryClient.setQueryData(notebookKeys.version(id, data.version.number), { version: data.version });
      // The screen moves to the new version at once, without a stale moment of "someone saved".
      queryClient.setQueryData(notebookKeys.detail(id), { design: data.design, version: data.version });
    },
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: notebookKeys.detail(id), exact: true }),
        queryClient.invalidateQueries({ queryKey: notebookKeys.versions(id) }),
        queryClient.invalidateQueries({ queryKey: notebookKeys.lists() }),
      ]),
  });
}

export function useCloneMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CloneRequest) => api(path(notebookPaths.clone(id)), notebookWithVersionResponseSchema, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notebookKeys.lists() }),
  });
}

export function useBaselineMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (version: number | null) => api(path(notebookPaths.baseline(id)), z.unknown(), { method: 'PUT', body: { version } }),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: notebookKeys.detail(id), exact: true }),
        queryClient.invalidateQueries({ queryKey: notebookKeys.lists() }),
      ]),
  });
}

export function useCreateShareLinkMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateShareLinkRequest) =>
      api(path(notebookPaths.shareLinks(id)), createShareLinkResponseSchema, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notebookKeys.shareLinks(id) }),
  });
}

export function useRevokeShareLinkMutation(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) => api(path(notebookPaths.shareLink(id, linkId)), z.unknown(), { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notebookKeys.shareLinks(id) }),
  });
}

/** The notebook file as the server writes it; parsed so a malformed export never reaches disk. */
export function fetchNotebookFile(id: string) {
  return api(path(notebookPaths.exportFile(id)), notebookFileSchema);
}

export function useImportMutation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: NotebookFileInput) => api(path(notebookPaths.importInto(teamId)), importResponseSchema, { method: 'POST', body: file }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notebookKeys.lists() }),
  });
}
