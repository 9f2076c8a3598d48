import { describe, expect, it } from 'vitest';
import type { Carry, Pin } from '../../../shared/reviews';
import type { Member } from '../../../shared/teams';
import { carryLine, formatPinnedValue, resolvedLine } from '../../../features/reviews/carry';
import { keptMentions, mentionMatches, mentionQuery } from '../../../features/reviews/mentions';

const nbsp = '\u00A0';
const slit: Pin = { kind: 'field', path: 'slits.exitWidthUm' };

describe('how a carried thread reads on a later version', () => {
  it.each([
    [slit, { state: 'here' }, null],
    [slit, { state: 'still-applies', since: 2 }, 'Still applies (from v2)'],
    [slit, { state: 'field-changed', since: 3, was: 100, now: 60 }, `Field changed since v3 (was 100${nbsp}µm, now 60${nbsp}µm)`],
    [{ kind: 'field', path: 'layout.kind' }, { state: 'field-changed', since: 1, was: 'czerny-turner', now: 'littrow' }, 'Field changed since v1 (was Czerny–Turner, now Littrow)'],
    [{ kind: 'field', path: 'source.minNm' }, { state: 'field-changed', since: 1, was: null, now: 400 }, `Field changed since v1 (was not set, now 400${nbsp}nm)`],
    [{ kind: 'result', result: 'bandpass', wavelengthNm: 500 }, { state: 'design-changed', since: 2, paths: ['slits.exitWidthUm', 'grating.order', 'range.endNm'] }, 'Design changed since v2 (3 fields)'],
    [{ kind: 'version' }, { state: 'design-changed', since: 4, paths: ['grating.order'] }, 'Design changed since v4 (1 field)'],
  ] satisfies [Pin, Carry, string | null][])('%o with %o reads %s', (pin, carry, line) => {
    expect(carryLine({ pin, carry })).toBe(line);
  });

  it('writes a stored value in full with its unit, an integer without one', () => {
    expect(formatPinnedValue('slits.exitWidthUm', 12.345678)).toBe(`12.345678${nbsp}µm`);
    expect(formatPinnedValue('grating.order', 2)).toBe('2');
  });

  it('says who resolved a thread and on which day', () => {
    const line = resolvedLine({ resolvedBy: { id: 'u1', displayName: 'Tobiah Rennick' }, resolvedAt: '2026-12-02T11:00:00.000Z' });
    expect(line).toMatch(/^Resolved by Tobiah Rennick on 2 Dec 2026$/);
    expect(resolvedLine({ resolvedBy: null, resolvedAt: null })).toBe('Resolved by a former member');
  });
});

describe('@ completion in a remark', () => {
  const member = (userId: string, displayName: string): Member => ({
    userId,
    displayName,
    email: `${userId}@example.com`,
    role: 'reviewer',
    joinedAt: '2026-01-01T00:00:00.000Z',
  });
  const team = [member('m', 'Maren Okafor-Lind'), member('t', 'Tobiah Rennick'), member('j', 'Juno Castellane'), member('r', 'Rhea Tobin')];

  it('reads the @word being typed at the end only', () => {
    expect(mentionQuery('Please check @Tob')).toBe('Tob');
    expect(mentionQuery('@')).toBe('');
    expect(mentionQuery('mail me at a@b')).toBeNull();
    expect(mentionQuery('@Tob is done ')).toBeNull();
  });

  it('offers the members with a name word starting so, never the writer', () => {
    expect(mentionMatches(team, 'tob', 'm').map((m) => m.userId)).toEqual(['t', 'r']);
    expect(mentionMatches(team, 'tob', 't').map((m) => m.userId)).toEqual(['r']);
    expect(mentionMatches(team, 'okafor', 't').map((m) => m.userId)).toEqual(['m']);
    expect(mentionMatches(team, 'zz', 't')).toEqual([]);
  });

  it('keeps only the chosen people whose @Name is still in the text', () => {
    const chosen = new Map([
      ['t', 'Tobiah Rennick'],
      ['j', 'Juno Castellane'],
    ]);
    expect(keptMentions('Over to @Tobiah Rennick for the slit.', chosen)).toEqual(['t']);
    expect(keptMentions('No one now.', chosen)).toEqual([]);
  });
});
