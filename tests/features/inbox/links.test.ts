import { describe, expect, it } from 'vitest';
import { inboxBadgeText, inboxItemPath, inboxItemSubject, inboxLinkName } from '../../../features/inbox/links';

describe('where an inbox item leads', () => {
  it.each([
    { threadId: 'th_41', expected: '/notebooks/nb_7/v/2?thread=th_41' },
    { threadId: null, expected: '/notebooks/nb_7/v/2?review=1' },
    { threadId: 'a b&c', expected: '/notebooks/nb_7/v/2?thread=a%20b%26c' },
  ] satisfies { threadId: string | null; expected: string }[])('thread $threadId opens $expected', ({ threadId, expected }) => {
    expect(inboxItemPath({ designId: 'nb_7', version: 2, threadId })).toBe(expected);
  });

  it('names the design in quotes with its version', () => {
    expect(inboxItemSubject({ designTitle: 'Teaching monochromator', version: 2 })).toBe('“Teaching monochromator” v2');
  });
});

describe('the header link to the inbox', () => {
  it.each([
    { unread: undefined, name: 'Inbox' },
    { unread: 0, name: 'Inbox, nothing unread' },
    { unread: 1, name: 'Inbox, 1 unread' },
    { unread: 99, name: 'Inbox, 99 unread' },
    { unread: 250, name: 'Inbox, 99+ unread' },
  ] satisfies { unread: number | undefined; name: string }[])('with $unread unread is named “$name”', ({ unread, name }) => {
    expect(inboxLinkName(unread)).toBe(name);
  });

  it('caps the badge at 99+ so the phone header keeps its room', () => {
    expect([3, 99, 100, 4000].map(inboxBadgeText)).toEqual(['3', '99', '99+', '99+']);
  });

  it('names the link with its visible words in order (WCAG 2.5.3)', () => {
    for (const unread of [1, 42, 100]) {
      const visible = `Inbox ${inboxBadgeText(unread)}`;
      expect(inboxLinkName(unread).replace(',', '')).toContain(visible);
    }
  });
});
