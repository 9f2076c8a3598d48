import { StyleSheet, View } from 'react-native';
import { reviewStateLabels, type ReviewState } from '@/shared/reviews';
import { Text, colors, radius, space } from '@/features/ui';

// Colour only backs up the words: every badge says its state, so no reader depends on the hue.
const look: Record<ReviewState, { backgroundColor: string; borderColor: string; color: string }> = {
  unreviewed: { backgroundColor: colors.surface, borderColor: colors.line, color: colors.inkMuted },
  requested: { backgroundColor: colors.warningSoft, borderColor: colors.warningSoft, color: colors.warning },
  'signed-off': { backgroundColor: colors.okSoft, borderColor: colors.okSoft, color: colors.ok },
  'signed-off-with-remarks': { backgroundColor: colors.okSoft, borderColor: colors.ok, color: colors.ok },
  revise: { backgroundColor: colors.dangerSoft, borderColor: colors.dangerSoft, color: colors.danger },
};

type Props = {
  state: ReviewState;
  /** Smaller type, for a table column where the longest state must fit on one line. */
  compact?: boolean;
  testID?: string;
};

/** A version's review state in words ("Signed off with remarks"), tinted by what it means. */
export function ReviewStateBadge({ state, compact = false, testID }: Props) {
  const { backgroundColor, borderColor, color } = look[state];
  return (
    <View style={[styles.badge, { backgroundColor, borderColor }]} testID={testID}>
      <Text variant={compact ? 'caption' : 'small'} weight="semibold" style={{ color }}>
        {reviewStateLabels[state]}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    alignSelf: 'flex-start',
    borderRadius: radius.sm,
    borderWidth: 1,
    paddingHorizontal: space.xs,
    paddingVertical: space.xxs,
  },
});
