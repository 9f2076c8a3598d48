export { api, ApiError } from './client';
export { createQueryClient, staleTime } from './query-client';
