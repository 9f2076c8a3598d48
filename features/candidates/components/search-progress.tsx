import { StyleSheet, View } from 'react-native';
import { Text, colors, radius, space } from '@/features/ui';
import { progressWords } from '../format';

type Props = { done: number; total: number | null };

/** How far the running search is: a bar with its count ("3200 of 13 440 designs"). */
export function SearchProgress({ done, total }: Props) {
  const words = total === null ? 'Preparing the search…' : progressWords(done, total);
  const fraction = total ? Math.min(1, done / total) : 0;
  return (
    <View style={styles.box}>
      <View
        role="progressbar"
        aria-label="Search progress"
        // Indeterminate (no value) until the search has counted its candidates.
        aria-valuemin={0}
        aria-valuemax={total ?? undefined}
        aria-valuenow={total === null ? undefined : done}
        aria-valuetext={words}
        style={styles.track}
        testID="search-progress"
      >
        <View style={[styles.fill, { width: `${fraction * 100}%` }]} />
      </View>
      <Text variant="small" tone="muted">
        {words}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs },
  track: { height: 10, borderRadius: radius.sm, backgroundColor: colors.surfaceSunken, overflow: 'hidden' },
  fill: { height: '100%', backgroundColor: colors.primary },
});
