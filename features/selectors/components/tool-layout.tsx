import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View, useWindowDimensions } from 'react-native';
import { Card, colors, radius, space, useLayout } from '@/features/ui';

type Props = {
  inputs: ReactNode;
  /** Why the results are not up to date (the refused fields), above them and never dimmed. */
  blocked: ReactNode;
  results: ReactNode;
  plots: ReactNode;
  /** Marks the results and plots while they are the last valid ones (an outline: dimming would fail text contrast). */
  stale: boolean;
  testID: string;
};

/**
 * Inputs, then results, then plots in one column on a phone and a tablet; on a wide screen the
 * inputs keep a window-high scrolling column of their own beside the results and plots, so a
 * change shows beside the field however long the list of inputs (a stack of several filters).
 */
export function ToolLayout({ inputs, blocked, results, plots, stale, testID }: Props) {
  const wide = useLayout() === 'wide';
  const { height } = useWindowDimensions();
  const out = (
    <View style={[styles.column, stale && styles.stale]}>
      {results}
      {plots}
    </View>
  );
  return (
    <View style={[styles.root, wide && styles.row]} testID={testID}>
      {wide ? (
        // The app bar and the page's own padding take about 100 px of the window.
        <ScrollView style={[styles.inputsWide, { maxHeight: Math.max(400, height - 100) }]} testID={`${testID}-inputs`}>
          <Card title="Inputs">{inputs}</Card>
        </ScrollView>
      ) : (
        <Card title="Inputs">{inputs}</Card>
      )}
      <View style={[styles.column, wide && styles.outWide]}>
        {blocked}
        {out}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.lg },
  row: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: space.lg },
  // ScrollView grows by default (flexGrow 1): held at its width, the results get the rest.
  inputsWide: { width: 400, flexGrow: 0, flexShrink: 0 },
  outWide: { flex: 1, minWidth: 0 },
  stale: {
    borderWidth: 2,
    borderStyle: 'dashed',
    borderColor: colors.danger,
    borderRadius: radius.lg,
    padding: space.xs,
  },
});
