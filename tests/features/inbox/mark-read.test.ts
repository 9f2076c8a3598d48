import { describe, expect, it } from 'vitest';
import { listAfterMarkRead } from '@/features/inbox/queries';
import type { InboxItem } from '@/shared/reviews';

const item = (id: string, readAt: string | null): InboxItem => ({
  id,
  kind: 'mentioned',
  designId: 'd1',
  designTitle: 'Bench monochromator',
  version: 2,
  threadId: 't1',
  actor: null,
  excerpt: 'Is 60 µm right?',
  createdAt: '2026-11-30T10:00:00.000Z',
  readAt,
});

const now = '2026-12-02T15:00:00.000Z';
const earlier = '2026-12-01T09:00:00.000Z';

describe('the cached inbox lists after marking read', () => {
  const answer = { items: [item('a', null), item('b', earlier), item('c', null)], unread: 2 };

  it('marks every unread item read in the full list after "all", keeping earlier read times', () => {
    const after = listAfterMarkRead(answer, { all: true }, 0, now, false);
    expect(after.unread).toBe(0);
    expect(after.items.map((i) => [i.id, i.readAt])).toEqual([
      ['a', now],
      ['b', earlier],
      ['c', now],
    ]);
  });

  it('marks only the named items and empties them from the unread-only list', () => {
    const unreadOnly = { items: [item('a', null), item('c', null)], unread: 2 };
    expect(listAfterMarkRead(unreadOnly, { ids: ['a'] }, 1, now, true).items.map((i) => i.id)).toEqual(['c']);
    const full = listAfterMarkRead(answer, { ids: ['a'] }, 1, now, false);
    expect(full.items.map((i) => i.readAt)).toEqual([now, earlier, null]);
    expect(listAfterMarkRead(unreadOnly, { all: true }, 0, now, true).items).toEqual([]);
  });
});
