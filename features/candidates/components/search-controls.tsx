import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { RadioGroup, Text, colors, fonts, minTouch, space, type } from '@/features/ui';
import { SCORE_EXPLANATION } from '@/features/search';
import type { SearchControls as Controls } from '../search-request';

type Props = { value: Controls; onChange: (value: Controls) => void; disabled?: boolean };

const ORDER_OPTIONS = [
  { value: '1', label: '±1', accessibilityLabel: 'Orders ±1' },
  { value: '2', label: '±1…2', accessibilityLabel: 'Orders ±1 to ±2' },
  { value: '3', label: '±1…3', accessibilityLabel: 'Orders ±1 to ±3' },
] as const;

const TOP_OPTIONS = ['5', '10', '20'] as const;

const WEIGHT_PARTS = [
  { key: 'margin', label: 'Margin' },
  { key: 'efficiency', label: 'Efficiency' },
  { key: 'size', label: 'Size' },
  { key: 'overlap', label: 'Order overlap' },
] as const;

const WEIGHT_LEVELS = ['0', '1', '2', '3'] as const;

/** The limits of a search that change its answer: orders tried, how many are shown, and the score's weights. */
export function SearchControls({ value, onChange, disabled = false }: Props) {
  const [weightsOpen, setWeightsOpen] = useState(false);
  return (
    <View style={styles.box}>
      <View style={styles.row}>
        <RadioGroup
          label="Orders to try"
          showLabel
          look="segmented"
          size="compact"
          options={ORDER_OPTIONS}
          value={String(value.maxOrder) as '1' | '2' | '3'}
          onChange={(order) => onChange({ ...value, maxOrder: Number(order) as 1 | 2 | 3 })}
          disabled={disabled}
          testID="search-max-order"
        />
        <RadioGroup
          label="Designs shown"
          showLabel
          look="segmented"
          size="compact"
          options={TOP_OPTIONS.map((top) => ({ value: top, label: top, accessibilityLabel: `Show the best ${top}` }))}
          value={String(value.top) as (typeof TOP_OPTIONS)[number]}
          onChange={(top) => onChange({ ...value, top: Number(top) })}
          disabled={disabled}
          testID="search-top"
        />
      </View>
      <Pressable
        role="button"
        aria-expanded={weightsOpen}
        accessibilityLabel="How designs are ranked"
        onPress={() => setWeightsOpen((open) => !open)}
        style={({ focused }: { pressed: boolean; focused?: boolean }) => [styles.disclosure, focused && styles.focused]}
        testID="search-weights-toggle"
      >
        <Text variant="small" weight="semibold" style={styles.link}>
          How designs are ranked {weightsOpen ? '▴' : '▾'}
        </Text>
      </Pressable>
      {weightsOpen ? (
        <View style={styles.weights} testID="search-weights">
          <Text variant="small" tone="muted" testID="search-score-explanation">
            {SCORE_EXPLANATION}
          </Text>
          {WEIGHT_PARTS.map((part) => (
            <RadioGroup
              key={part.key}
              label={`${part.label} weight`}
              showLabel
              look="segmented"
              size="compact"
              options={WEIGHT_LEVELS.map((level) => ({
                value: level,
                label: level === '0' ? 'Off' : level,
                accessibilityLabel: `${part.label} weight ${level === '0' ? 'off' : level}`,
              }))}
              value={String(value.weights[part.key]) as (typeof WEIGHT_LEVELS)[number]}
              onChange={(level) => onChange({ ...value, weights: { ...value.weights, [part.key]: Number(level) } })}
              disabled={disabled}
              testID={`search-weight-${part.key}`}
            />
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  weights: { gap: space.sm },
  disclosure: { minHeight: minTouch, justifyContent: 'center', alignSelf: 'flex-start', borderWidth: 2, borderColor: 'transparent', paddingHorizontal: space.xs },
  focused: { borderColor: colors.focus },
  link: { ...type.small, fontFamily: fonts.semibold, color: colors.primary },
});
