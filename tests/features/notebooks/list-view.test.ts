import { describe, expect, it } from 'vitest';
import {
  changeListView,
  listQuery,
  listViewChangeParams,
  listViewParams,
  parseListView,
  type ListView,
  type SearchParams,
} from '../../../features/notebooks/list-view';

const plain: ListView = { sort: 'updated', archived: 'exclude', page: 1 };

describe('the design list view in the URL', () => {
  it('reads an empty URL as the plain list, ignoring the team id beside it', () => {
    expect(parseListView({})).toEqual(plain);
    expect(parseListView({ teamId: 'team-1' })).toEqual(plain);
  });

  it('reads every param of a linked view, with the list query’s trimming and lower-casing', () => {
    expect(
      parseListView({ q: '  sodium ', tag: 'UV', sort: 'title', dir: 'desc', archived: 'only', page: '3' }),
    ).toEqual({ q: 'sodium', tag: 'uv', sort: 'title', dir: 'desc', archived: 'only', page: 3 });
  });

  it.each([
    { params: { q: 'x'.repeat(121) }, field: 'q', value: undefined },
    { params: { q: '   ' }, field: 'q', value: undefined },
    { params: { tag: '' }, field: 'tag', value: undefined },
    { params: { tag: 't'.repeat(33) }, field: 'tag', value: undefined },
    // Not a review state of ours (an old link, or another tool's word).
    { params: { review: 'approved' }, field: 'review', value: undefined },
    { params: { review: '' }, field: 'review', value: undefined },
    { params: { sort: 'constructor' }, field: 'sort', value: 'updated' },
    { params: { dir: 'sideways' }, field: 'dir', value: undefined },
    // The server would show both; the screen offers live or archived only.
    { params: { archived: 'include' }, field: 'archived', value: 'exclude' },
    { params: { page: 'abc' }, field: 'page', value: 1 },
    { params: { page: '0' }, field: 'page', value: 1 },
    { params: { page: '-2' }, field: 'page', value: 1 },
    { params: { page: '2.5' }, field: 'page', value: 1 },
    { params: { page: '99999999999' }, field: 'page', value: 1 },
    { params: { page: '' }, field: 'page', value: 1 },
  ] satisfies { params: SearchParams; field: keyof ListView; value: unknown }[])(
    'falls back to the default for $field in $params',
    ({ params, field, value }) => {
      expect(parseListView(params)[field]).toEqual(value);
    },
  );

  it('keeps the good params of a URL when another one is malformed', () => {
    const view = parseListView({ q: 'lamp', sort: '<script>', page: '2' });
    expect(view).toEqual({ ...plain, q: 'lamp', page: 2 });
  });

  it('takes the first of a repeated param', () => {
    expect(parseListView({ sort: ['owner', 'title'], archived: ['only'] })).toEqual({
      ...plain,
      sort: 'owner',
      archived: 'only',
    });
  });

  it('starts again at page 1 on any change but a page turn, and a new sort takes its own order', () => {
    const view: ListView = { ...plain, sort: 'title', dir: 'desc', page: 4 };
    expect(changeListView(view, { tag: 'uv' })).toEqual({ ...view, tag: 'uv', page: 1 });
    expect(changeListView(view, { sort: 'owner' })).toEqual({
      ...view,
      sort: 'owner',
      dir: undefined,
      page: 1,
    });
    expect(changeListView(view, { page: 5 })).toEqual({ ...view, page: 5 });
  });

  it('writes defaults as absent params, so the plain list has a plain URL', () => {
    expect(Object.values(listViewParams(plain)).every((value) => value === undefined)).toBe(true);
    const view: ListView = { sort: 'owner', dir: 'asc', archived: 'only', page: 2, q: 'hg', tag: 'uv' };
    expect(listViewParams(view)).toEqual({
      q: 'hg',
      tag: 'uv',
      sort: 'owner',
      dir: 'asc',
      archived: 'only',
      page: '2',
    });
  });

  it('writes only what a change touches, so a late search cannot undo a newer choice', () => {
    const view: ListView = { ...plain, sort: 'title', page: 3 };
    expect(listViewChangeParams(view, { q: 'neon' })).toEqual({ q: 'neon', page: undefined });
    expect(listViewChangeParams(view, { sort: 'owner' })).toEqual({
      sort: 'owner',
      dir: undefined,
      page: undefined,
    });
    expect(listViewChangeParams(view, { page: 4 })).toEqual({ page: '4' });
  });

  it('round-trips a view through its params', () => {
    const view: ListView = { q: 'hg lamp', tag: 'uv', sort: 'owner', dir: 'desc', archived: 'only', page: 7 };
    expect(parseListView(listViewParams(view))).toEqual(view);
  });

  it('keeps the review-state filter in the URL and sends it as review, back at page 1 when it changes', () => {
    const view = parseListView({ review: 'signed-off-with-remarks', page: '3' });
    expect(view).toEqual({ ...plain, review: 'signed-off-with-remarks', page: 3 });
    expect(listViewParams(view).review).toBe('signed-off-with-remarks');
    expect(listQuery(view, 20).review).toBe('signed-off-with-remarks');
    expect(listViewChangeParams(view, { review: 'revise' })).toEqual({ review: 'revise', page: undefined });
    expect(listViewChangeParams(view, { review: undefined })).toEqual({ review: undefined, page: undefined });
  });

  it('asks the server for the view’s page with the screen’s page size', () => {
    expect(listQuery({ ...plain, q: 'hg' }, 20)).toEqual({
      q: 'hg',
      tag: undefined,
      sort: 'updated',
      dir: undefined,
      page: 1,
      pageSize: 20,
      archived: 'exclude',
    });
  });
});
