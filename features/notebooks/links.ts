/** The address a share link opens, absolute so it can be pasted anywhere. */
export function absoluteUrl(path: string): string {
  return typeof window === 'undefined' ? path : `${window.location.origin}${path}`;
}
