import { useCallback, useState } from 'react';
import type { LayoutChangeEvent } from 'react-native';

/** Width of a column, measured after layout, for the plots to fit. */
export function useWidth(initial: number) {
  const [width, setWidth] = useState(initial);
  const onLayout = useCallback((event: LayoutChangeEvent) => {
    const next = Math.round(event.nativeEvent.layout.width);
    setWidth((current) => (Math.abs(current - next) >= 1 ? next : current));
  }, []);
  return [width, onLayout] as const;
}
