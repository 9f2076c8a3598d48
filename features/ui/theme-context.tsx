import { useWindowDimensions } from 'react-native';
import { layoutForWidth, type Layout } from './theme';

/** The layout for the current window width; re-renders when the window crosses a breakpoint. */
export function useLayout(): Layout {
  return layoutForWidth(useWindowDimensions().width);
}
