import type { ReactNode } from 'react';
import { StyleSheet, View, type ViewStyle } from 'react-native';
import { colors, radius, space } from '../theme';
import { Heading } from './heading';

type Props = { children: ReactNode; title?: string; style?: ViewStyle; testID?: string };

/** A white sheet on the paper, with an optional level-2 title. */
export function Card({ children, title, style, testID }: Props) {
  return (
    <View style={[styles.card, style]} testID={testID}>
      {title ? <Heading level={2}>{title}</Heading> : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.lg,
    gap: space.md,
  },
});
