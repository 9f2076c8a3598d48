import type { ViewStyle } from 'react-native';

// react-native-web leaves `snapToInterval` alone; CSS scroll snapping stops a swipe at a column.
// Web-only style keys, which React Native's types do not list.
export const stripSnap = {
  strip: { scrollSnapType: 'x mandatory' } as ViewStyle,
  item: { scrollSnapAlign: 'start' } as ViewStyle,
};
