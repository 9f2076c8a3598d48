import type { ViewStyle } from 'react-native';

/** Native snaps the strip with `snapToInterval`; nothing to add. */
export const stripSnap: { strip: ViewStyle; item: ViewStyle } = { strip: {}, item: {} };
