import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card, Text, colors, radius, space } from '@/features/ui';
import type { Design } from '@/shared/design';
import { cautionsFor } from '../cautions';

type Props = { design: Design };

/**
 * The safety cautions that apply to the design being worked on, the same ones the design sheet
 * prints (see `cautionsFor`): each its title (a level-3 heading under the card's level-2 title),
 * what to take care of, why it applies here, and the line handing the decision to the site.
 * Text is ink or muted ink on white: 15.1:1 and 6.3:1, above WCAG 2.2's 4.5:1 (1.4.3).
 */
export const CautionsCard = memo(function CautionsCard({ design }: Props) {
  const cautions = useMemo(() => cautionsFor(design), [design]);
  return (
    <Card title="Safety cautions" testID="cautions-card">
      {cautions.length === 0 ? (
        <Text tone="muted">No cautions apply to this design.</Text>
      ) : (
        <View style={styles.list}>
          {cautions.map((caution) => (
            <View key={caution.id} style={styles.item} testID={`caution-${caution.id}`}>
              <Text role="heading" aria-level={3} weight="semibold">
                {caution.title}
              </Text>
              <Text variant="small">{caution.text}</Text>
              <Text variant="small" weight="semibold">
                {caution.why}
              </Text>
              <Text variant="caption" tone="muted">
                {caution.closing}
              </Text>
            </View>
          ))}
        </View>
      )}
    </Card>
  );
});

const styles = StyleSheet.create({
  list: { gap: space.md },
  item: {
    gap: space.xs,
    borderLeftWidth: 3,
    borderLeftColor: colors.line,
    borderRadius: radius.sm,
    paddingLeft: space.md,
  },
});
