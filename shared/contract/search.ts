import { SEARCH_LIMITS, searchAnswerSchema, searchRequestSchema } from '../search';
import { route } from './route';

/** The candidate search for scripts and other tools: the same engine the workbench runs in a worker. */
export const search = {
  run: route({
    tag: 'Solver',
    method: 'POST',
    path: '/search',
    summary: 'Search stock gratings, orders, deviations and focal lengths for designs that meet the requirements, ranked',
    description:
      'No sign-in and no Origin header needed. The input holds `range`, optional `source` and `detector`, ' +
      '`requirements` and optional `search` lists and weights; each returned `design` solves with POST /api/solve unchanged. ' +
      `At most ${SEARCH_LIMITS.maxCandidates} candidates (the product of the lists' lengths; more is a 400 naming \`search\`), ` +
      `${SEARCH_LIMITS.maxListLength} values a list and ${SEARCH_LIMITS.maxTop} returned. ` +
      '20 searches a minute per address, then 429 `rate_limited`.',
    access: { kind: 'anyone' },
    originExempt: true,
    body: searchRequestSchema,
    output: searchAnswerSchema,
  }),
};
