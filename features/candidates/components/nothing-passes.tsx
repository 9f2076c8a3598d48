import { View } from 'react-native';
import { Text, space } from '@/features/ui';
import type { SearchAnswer } from '@/shared/search';
import { nothingPassesWords } from '../format';

/** When no candidate meets every requirement: which requirement excluded the most, and how far the nearest misses. */
export function NothingPasses({ answer }: { answer: SearchAnswer }) {
  const { headline, misses } = nothingPassesWords(answer);
  return (
    <View style={{ gap: space.xs }} testID="search-nothing">
      <Text>{headline}</Text>
      {misses.length > 0 ? (
        <>
          <Text variant="small" tone="muted">
            The nearest design:
          </Text>
          <View role="list">
            {misses.map((miss) => (
              <Text key={miss} role="listitem" variant="small">
                • {miss}
              </Text>
            ))}
          </View>
          <Text variant="small" tone="muted">
            Loosen the requirement that misses the most, or try more orders.
          </Text>
        </>
      ) : null}
    </View>
  );
}
