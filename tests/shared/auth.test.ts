import { describe, expect, it } from 'vitest';
import { passwordSchema, signUpRequestSchema } from '@/shared/auth';
import { fieldErrors } from '@/shared/validation';

function passwordError(password: string): string | undefined {
  const result = passwordSchema.safeParse(password);
  return result.success ? undefined : result.error.issues[0]?.message;
}

function signUpErrors(email: string, password: string) {
  const result = signUpRequestSchema.safeParse({ email, displayName: 'Ada', password });
  return result.success ? {} : fieldErrors(result.error);
}

// The rules follow NIST SP 800-63B §5.1.1.2 (from memory: refuse "repetitive" passwords and ones
// derived from the account's own details); the exact cases are ours.
describe('new passwords', () => {
  it.each([
    { password: '          ', why: 'must not be only spaces' },
    { password: ' '.repeat(40), why: 'must not be only spaces' },
    { password: '\t \t \t \t \t ', why: 'must not be only spaces' },
    { password: 'aaaaaaaaaa', why: 'must not be one character repeated' },
    { password: '1111111111111111', why: 'must not be one character repeated' },
    { password: '  xxxxxxxxxx  ', why: 'must not be one character repeated' },
    { password: '🔒🔒🔒🔒🔒🔒🔒🔒🔒🔒', why: 'must not be one character repeated' },
    { password: 'short', why: 'must be at least 10 characters' },
  ] satisfies { password: string; why: string }[])('refuses “$password”: $why', ({ password, why }) => {
    expect(passwordError(password)).toBe(why);
  });

  it.each(['long enough password', 'aaaaaaaaab', '  two words  ', 'ab'.repeat(5)])('accepts “%s”', (password) => {
    expect(passwordError(password)).toBeUndefined();
  });

  it.each([
    { email: 'ada@example.com', password: 'ada@example.com' },
    { email: 'ada@example.com', password: 'ADA@Example.COM' },
    { email: '  Ada@Example.com ', password: ' ada@example.com  ' },
  ])('refuses the account’s own e-mail “$password” as its password at sign-up', ({ email, password }) => {
    expect(signUpErrors(email, password)).toEqual({ password: 'must not be your e-mail address' });
  });

  it('accepts a password that only contains the e-mail address', () => {
    expect(signUpErrors('ada@example.com', 'ada@example.com and more')).toEqual({});
  });
});
