import { describe, expect, it } from 'vitest';
import { safeNextPath } from '../../../features/auth/next-path';

describe('safeNextPath: where sign-in sends people afterwards', () => {
  it.each([
    { next: '/teams/abc/members', expected: '/teams/abc/members' },
    { next: '/invitations/tok?x=1', expected: '/invitations/tok?x=1' },
    { next: ['/workbench', '/other'], expected: '/workbench' },
  ] satisfies { next: unknown; expected: string }[])('follows an in-app path: $next', ({ next, expected }) => {
    expect(safeNextPath(next)).toBe(expected);
  });

  it.each([
    { next: 'https://evil.example.net/', why: 'another site' },
    { next: '//evil.example.net/path', why: 'a protocol-relative address' },
    { next: '/\\evil.example.net', why: 'a backslash trick browsers read as //' },
    { next: 'teams', why: 'a relative path' },
    { next: undefined, why: 'nothing' },
  ] satisfies { next: unknown; why: string }[])('falls back to /teams for $why', ({ next }) => {
    expect(safeNextPath(next)).toBe('/teams');
  });
});
