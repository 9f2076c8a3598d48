import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View, type ViewStyle } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { colors, maxContentWidth, space } from '../theme';

type Props = {
  children: ReactNode;
  /** Let the content use the whole window width (workbench on wide screens). */
  wide?: boolean;
  scroll?: boolean;
  style?: ViewStyle;
};

/** Page container: paper background, safe-area padding, content centred to a readable width. */
export function Screen({ children, wide = false, scroll = true, style }: Props) {
  const insets = useSafeAreaInsets();
  const inner = (
    <View style={[styles.inner, !wide && styles.narrow, style]}>{children}</View>
  );
  const padding = {
    paddingTop: insets.top + space.lg,
    paddingBottom: insets.bottom + space.xxl,
    paddingLeft: insets.left + space.lg,
    paddingRight: insets.right + space.lg,
  };
  if (!scroll) return <View style={[styles.root, padding]}>{inner}</View>;
  return (
    <ScrollView style={styles.root} contentContainerStyle={padding}>
      {inner}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.paper },
  inner: { width: '100%', alignSelf: 'center', gap: space.lg },
  narrow: { maxWidth: maxContentWidth },
});
