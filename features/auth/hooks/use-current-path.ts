import { useState } from 'react';
import { useGlobalSearchParams, usePathname, useSegments } from 'expo-router';

/**
 * The address to come back to after signing in: path and query, as the router knows them.
 *
 * While a guarded group shows a placeholder instead of its screens (the session is still being
 * checked), the router forgets the nested route and reports the bare group — and then rewrites the
 * address to the group's first route. The last real address is kept for that moment.
 */
export function useCurrentPath(): string {
  const pathname = usePathname();
  const search = useGlobalSearchParams();
  const segments: string[] = useSegments();
  // Route segments such as [teamId] are already in the path; the rest is the real query.
  const inPath = new Set(segments.flatMap((segment) => /^\[\.{0,3}(.+)\]$/.exec(segment)?.[1] ?? []));
  const query = new URLSearchParams(
    Object.entries(search).flatMap(([key, value]) =>
      typeof value === 'string' && !inPath.has(key) ? [[key, value]] : [],
    ),
  ).toString();
  const path = query ? `${pathname}?${query}` : pathname;
  const bareGroup = segments.length === 1 && /^\(.+\)$/.test(segments[0] ?? '');
  const [remembered, setRemembered] = useState(path);
  if (!bareGroup && path !== remembered) setRemembered(path);
  return bareGroup ? remembered : path;
}
