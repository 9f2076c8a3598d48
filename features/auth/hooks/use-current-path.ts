import { useGlobalSearchParams, usePathname, useSegments } from 'expo-router';

/** The address to come back to after signing in: path and query, as the router knows them. */
export function useCurrentPath(): string {
  const pathname = usePathname();
  const search = useGlobalSearchParams();
  const segments: string[] = useSegments();
  // Route segments such as [teamId] are already in the path; the rest is the real query.
  const inPath = new Set(segments.flatMap((segment) => /^\[\.{0,3}(.+)\]$/.exec(segment)?.[1] ?? []));
  const query = new URLSearchParams(
    Object.entries(search).flatMap(([key, value]) => (typeof value === 'string' && !inPath.has(key) ? [[key, value]] : [])),
  ).toString();
  return query ? `${pathname}?${query}` : pathname;
}
