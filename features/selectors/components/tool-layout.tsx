import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card, space, useLayout } from '@/features/ui';

type Props = {
  inputs: ReactNode;
  /** Why the results are not up to date (the refused fields), above them and never dimmed. */
  blocked: ReactNode;
  results: ReactNode;
  plots: ReactNode;
  /** Dims the results and plots while they are the last valid ones. */
  stale: boolean;
  testID: string;
};

/**
 * Inputs, then results, then plots in one column on a phone and a tablet; on a wide screen the
 * inputs keep a column of their own beside the results and plots, so a change shows beside it.
 */
export function ToolLayout({ inputs, blocked, results, plots, stale, testID }: Props) {
  const wide = useLayout() === 'wide';
  const out = (
    <View style={[styles.column, stale && styles.stale]}>
      {results}
      {plots}
    </View>
  );
  return (
    <View style={[styles.root, wide && styles.row]} testID={testID}>
      <View style={wide ? styles.inputsWide : undefined}>
        <Card title="Inputs">{inputs}</Card>
      </View>
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
  inputsWide: { width: 400, flexShrink: 0 },
  outWide: { flex: 1, minWidth: 0 },
  stale: { opacity: 0.55 },
});
