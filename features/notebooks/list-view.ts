import { z } from 'zod';
import { listDesignsQuerySchema, type ListDesignsQuery } from '@/shared/notebooks';

/**
 * The design list's view (search, tag, review state, sort, order, live or archived, page), kept in the URL's
 * search params so a view can be linked and survives a reload. Each param is read with the list
 * query's own schema; one that does not parse (a typo, a hostile link) falls back to its default
 * on its own, and the rest of the view still applies.
 */

const fields = listDesignsQuerySchema.shape;

/** Expo Router hands a repeated param over as a list: the first one counts. */
const firstOf = (value: unknown) => (Array.isArray(value) ? value[0] : value);
const param = <T extends z.ZodType>(schema: T) => z.preprocess(firstOf, schema);

/** The screen offers live or archived designs, not both at once. */
const archivedChoice = fields.archived.unwrap().extract(['exclude', 'only']);

export const listViewSchema = z.object({
  /** The settled search text; empty means no search. */
  q: param(fields.q.transform((q) => q || undefined))
    .catch(undefined)
    .optional(),
  tag: param(fields.tag).catch(undefined),
  /** The latest version's review state; undefined means every state. */
  review: param(fields.review).catch(undefined),
  sort: param(fields.sort).catch('updated'),
  /** Undefined: the sort's own default order (newest first for updated, A → Z otherwise). */
  dir: param(fields.dir).catch(undefined),
  archived: param(archivedChoice.default('exclude')).catch('exclude'),
  page: param(fields.page).catch(1),
});
export type ListView = z.output<typeof listViewSchema>;

export type SearchParams = Record<string, string | string[] | undefined>;

/** The view in `params`; never throws, whatever the URL holds. Other params (the team id) are ignored. */
export function parseListView(params: SearchParams): ListView {
  return listViewSchema.parse(params);
}

/**
 * The view after `change`. Any change of filter or order starts again at page 1, and a new sort
 * takes its own default order.
 */
export function changeListView(view: ListView, change: Partial<ListView>): ListView {
  const next = { ...view, ...change };
  if (!('page' in change)) next.page = 1;
  if ('sort' in change && !('dir' in change)) next.dir = undefined;
  return next;
}

/** The search params for `view`; a default is left out (undefined), so the plain list has a plain URL. */
export function listViewParams(view: ListView): Record<keyof ListView, string | undefined> {
  return {
    q: view.q,
    tag: view.tag,
    review: view.review,
    sort: view.sort === 'updated' ? undefined : view.sort,
    dir: view.dir,
    archived: view.archived === 'exclude' ? undefined : view.archived,
    page: view.page === 1 ? undefined : String(view.page),
  };
}

/**
 * Only the params `change` touches (with the page and, for a new sort, the order it resets), so a
 * change written a moment late, such as the settled search text, cannot undo a newer one.
 */
export function listViewChangeParams(
  view: ListView,
  change: Partial<ListView>,
): Partial<Record<keyof ListView, string | undefined>> {
  const all = listViewParams(changeListView(view, change));
  const keys = new Set<keyof ListView>(['page', ...(Object.keys(change) as (keyof ListView)[])]);
  if ('sort' in change) keys.add('dir');
  return Object.fromEntries([...keys].map((key) => [key, all[key]]));
}

/** The request for one page of the list. */
export function listQuery(view: ListView, pageSize: number): ListDesignsQuery {
  const { q, tag, review, sort, dir, page, archived } = view;
  return { q, tag, review, sort, dir, page, pageSize, archived };
}
