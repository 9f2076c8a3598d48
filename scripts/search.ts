/**
 * Search for candidate designs from the command line, for lab scripts:
 *
 *   npm run --silent search -- <input.json | ->
 *
 * The input is the body of POST /api/search (`range`, optional `source` and `detector`,
 * `requirements`, optional `search` lists and weights). Prints the answer JSON on stdout; each
 * candidate's `design` solves with `npm run --silent solve` unchanged. Exit 2 with one
 * `path: message` line per bad field on stderr for bad flags, unreadable or invalid JSON, input
 * the schema rejects, or a search that cannot run (too many candidates, a value that makes no
 * design).
 */

import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { runSearch, searchRequestIssues } from '../features/search/index';
import { SEARCH_LIMITS, searchRequestSchema, type SearchAnswer } from '../shared/search';
import { fieldErrors, formatFieldErrors } from '../shared/validation';
import { parseInputArgs, parseInputJson, runJsonCommand, type InputArgs, type JsonOutcome } from './json-input';
import { runCommand } from './run-command';

// The same limits as POST /api/search (one schema and one check for both).
export const USAGE = `usage: npm run --silent search -- <input.json | ->
The input is POST /api/search's body: range, optional source and detector, requirements, and
optional search lists (grooveDensitiesPerMm, blazeWavelengthsNm, maxOrder, deviationAnglesDeg,
focalLengthsMm, gratingSizeMm, top, weights). At most ${SEARCH_LIMITS.maxCandidates} candidates (the product of the
lists' lengths), ${SEARCH_LIMITS.maxListLength} values a list, ${SEARCH_LIMITS.maxTop} returned.`;

export type SearchArgs = InputArgs;

/** Reads the command line (without `node` and the script); throws a `UsageError` naming what is wrong. */
export const parseSearchArgs = parseInputArgs;

export type SearchOutcome = JsonOutcome<SearchAnswer>;

/**
 * Parses the input JSON read from `args.input`, checks it with the HTTP API's schema and the
 * search's own limits, and searches. A refusal is the text printed before exiting 2.
 */
export function searchInput(text: string, args: SearchArgs): SearchOutcome {
  const read = parseInputJson(text, args.input);
  if (!read.ok) return read;
  const request = searchRequestSchema.safeParse(read.json);
  if (!request.success) return { ok: false, message: formatFieldErrors(fieldErrors(request.error)) };
  const issues = searchRequestIssues(request.data);
  if (Object.keys(issues).length > 0) return { ok: false, message: formatFieldErrors(issues) };
  return { ok: true, answer: runSearch(request.data) };
}

/** The command: 0 with the answer on stdout, 2 with the reason on stderr. */
export function main(argv: readonly string[] = process.argv.slice(2)): Promise<number> {
  return runJsonCommand(argv, USAGE, parseSearchArgs, searchInput);
}

// Run only as the script, so tests can import the functions above.
if (process.argv[1] !== undefined && realpathSync(process.argv[1]) === realpathSync(fileURLToPath(import.meta.url))) {
  runCommand(() => main());
}
