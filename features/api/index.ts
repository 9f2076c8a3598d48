export { ApiError, call, groupKey, routeKey, urlFor, withParams } from './client';
export { createQueryClient, staleTime } from './query-client';
