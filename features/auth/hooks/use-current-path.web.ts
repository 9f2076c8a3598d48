import { usePathname } from 'expo-router';

/**
 * The address to come back to after signing in. On the web the browser's own location is the
 * truth: inside a route group's layout the router can still report the group's root on first render.
 */
export function useCurrentPath(): string {
  const pathname = usePathname();
  if (typeof window === 'undefined') return pathname;
  return `${window.location.pathname}${window.location.search}`;
}
