import { useLocalSearchParams, useRouter } from 'expo-router';
import { useMemo } from 'react';
import { listViewChangeParams, parseListView, type ListView } from '../list-view';

/** The design list's view, read from the URL's search params, and a change that writes back there. */
export function useListView(): [ListView, (change: Partial<ListView>) => void] {
  const params = useLocalSearchParams();
  const router = useRouter();
  const view = useMemo(() => parseListView(params), [params]);
  const change = (next: Partial<ListView>) => router.setParams(listViewChangeParams(view, next));
  return [view, change];
}
