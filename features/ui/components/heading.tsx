import type { ReactNode } from 'react';
import { Text, StyleSheet } from 'react-native';
import { colors, fonts, type } from '../theme';

type Props = { children: ReactNode; level?: 1 | 2 | 3; testID?: string };

/** A heading screen readers announce with its level (`role="heading"` + `aria-level` on web). */
export function Heading({ children, level = 1, testID }: Props) {
  return (
    <Text role="heading" aria-level={level} testID={testID} style={[styles.base, styles[`h${level}`]]}>
      {children}
    </Text>
  );
}

const styles = StyleSheet.create({
  base: { color: colors.ink, fontFamily: fonts.bold },
  h1: { ...type.headline },
  h2: { ...type.title, fontFamily: fonts.semibold },
  h3: { ...type.lead, fontFamily: fonts.semibold },
});
