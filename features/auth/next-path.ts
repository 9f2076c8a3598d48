/**
 * Where to go after signing in. Only paths inside this app are followed: `//evil.example` and
 * `https://…` would turn the sign-in page into an open redirect.
 */
export function safeNextPath(next: unknown, fallback = '/teams'): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (typeof value !== 'string' || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  return value;
}
