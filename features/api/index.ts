export { ApiError, call, fetchFile, groupKey, routeKey, urlFor, withParams, type DownloadedFile } from './client';
export { createQueryClient, staleTime } from './query-client';
