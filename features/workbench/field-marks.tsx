import { createContext, useContext, type ReactNode } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { pinnedResultLabels, pinnedResults } from '@/shared/reviews';
import { colors, fonts, printHidden, radius, space, type } from '@/features/ui';

/**
 * What the workbench needs to show review markers without knowing about reviews: how many open
 * threads are pinned to a design field (by its dotted path) or to a result (by its kind, see
 * `pinnedResults` in shared/reviews.ts), and what to do when a marker is tapped. The notebook's
 * Design tab provides it; the scratch workbench and share links provide nothing and show no marker.
 */
export type FieldMarks = {
  /** Open threads pinned to this field path, or to this result as `result:<kind>`. */
  countFor: (target: string) => number;
  /** A marker was tapped: open the review on that target's thread (or a new remark there). */
  open: (target: string) => void;
  /** A field to scroll to and highlight (a thread's pin label was tapped), with a nonce per request. */
  highlighted?: { path: string; nonce: number } | null;
};

const FieldMarksContext = createContext<FieldMarks | null>(null);

export function FieldMarksProvider({ value, children }: { value: FieldMarks; children: ReactNode }) {
  return <FieldMarksContext.Provider value={value}>{children}</FieldMarksContext.Provider>;
}

export function useFieldMarks(): FieldMarks | null {
  return useContext(FieldMarksContext);
}

/** The marker key of a result pin, so fields and results share one count function. */
export function resultTarget(result: string): string {
  return `result:${result}`;
}

/**
 * A small button with the open count of a field's or result's threads; nothing when none is open.
 * Its name says what it opens ("2 open remarks on Exit slit width") and starts with its visible words.
 */
export function ReviewMarker({ target, label, testID }: { target: string; label: string; testID?: string }) {
  const marks = useFieldMarks();
  const count = marks?.countFor(target) ?? 0;
  if (!marks || count === 0) return null;
  return (
    <Pressable
      {...printHidden}
      role="button"
      accessibilityLabel={`${count} open ${count === 1 ? 'remark' : 'remarks'} on ${label}`}
      onPress={() => marks.open(target)}
      testID={testID ?? `marker-${target}`}
      hitSlop={6}
      style={({ hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
        styles.marker,
        hovered && styles.markerHover,
        focused && styles.markerFocused,
      ]}
    >
      <Text style={styles.markerText}>{count} open</Text>
    </Pressable>
  );
}

/** The read-out's markers: one per result (any wavelength) with open threads pinned to it. */
export function ResultMarkers() {
  const marks = useFieldMarks();
  const marked = marks ? pinnedResults.filter((result) => marks.countFor(resultTarget(result)) > 0) : [];
  if (marked.length === 0) return null;
  return (
    <View role="group" aria-label="Open remarks on results" style={styles.results} testID="result-markers">
      <Text style={styles.resultsLabel}>Open remarks:</Text>
      {marked.map((result) => (
        <View key={result} style={styles.resultItem}>
          <Text style={styles.resultsLabel}>{pinnedResultLabels[result]}</Text>
          <ReviewMarker target={resultTarget(result)} label={pinnedResultLabels[result]} testID={`marker-result-${result}`} />
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  results: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  resultItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  resultsLabel: { ...type.small, fontFamily: fonts.regular, color: colors.inkMuted },
  marker: {
    minHeight: 24,
    minWidth: 24,
    paddingHorizontal: space.sm,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.accent,
    backgroundColor: colors.surface,
    justifyContent: 'center',
    alignItems: 'center',
  },
  markerHover: { backgroundColor: colors.surfaceSunken },
  markerFocused: { borderColor: colors.focus, borderWidth: 2 },
  markerText: { ...type.caption, fontFamily: fonts.semibold, color: colors.accent },
});
