export { createMainThreadRunner as createSearchRunner } from './main-thread-runner';
export type { SearchHandle, SearchRunner } from './main-thread-runner';
