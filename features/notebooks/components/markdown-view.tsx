import { useMemo, type ReactNode } from 'react';
import { Text as RNText, StyleSheet, View } from 'react-native';
import { Text, colors, fonts, radius, space, type } from '@/features/ui';
import { parseMarkdown, type Inline } from '../markdown';

function renderInline(spans: readonly Inline[], keyPrefix: string): ReactNode[] {
  return spans.map((span, index) => {
    const key = `${keyPrefix}-${index}`;
    switch (span.kind) {
      case 'text':
        return span.text;
      case 'code':
        return (
          <RNText key={key} style={styles.inlineCode}>
            {span.text}
          </RNText>
        );
      case 'strong':
        return (
          <RNText key={key} style={styles.strong}>
            {renderInline(span.children, key)}
          </RNText>
        );
      case 'em':
        return (
          <RNText key={key} style={styles.em}>
            {renderInline(span.children, key)}
          </RNText>
        );
    }
  });
}

/** Version notes, read by markdown-it (see `markdown.ts`) and drawn with `Text` only: no HTML ever. */
export function MarkdownView({ source, testID }: { source: string; testID?: string }) {
  const blocks = useMemo(() => parseMarkdown(source), [source]);
  if (blocks.length === 0) {
    return (
      <Text tone="muted" testID={testID}>
        No notes for this version.
      </Text>
    );
  }
  return (
    <View style={styles.root} testID={testID}>
      {blocks.map((block, index) => {
        const key = `b${index}`;
        switch (block.kind) {
          case 'heading':
            return (
              <Text key={key} role="heading" aria-level={block.level + 2} weight="semibold" style={block.level === 1 ? styles.h1 : styles.h2}>
                {renderInline(block.children, key)}
              </Text>
            );
          case 'paragraph':
            return <Text key={key}>{renderInline(block.children, key)}</Text>;
          case 'code':
            return (
              <View key={key} style={styles.codeBlock}>
                <Text variant="number" style={styles.codeText} selectable>
                  {block.text}
                </Text>
              </View>
            );
          case 'list':
            return (
              <View key={key} role="list" style={styles.list}>
                {block.items.map((item, itemIndex) => (
                  <View key={`${key}-${itemIndex}`} role="listitem" style={styles.item}>
                    <Text tone="muted" style={styles.marker}>
                      {block.ordered ? `${block.start + itemIndex}.` : '•'}
                    </Text>
                    <Text style={styles.itemText}>{renderInline(item, `${key}-${itemIndex}`)}</Text>
                  </View>
                ))}
              </View>
            );
          case 'rule':
            return <View key={key} role="separator" style={styles.rule} />;
        }
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.sm },
  h1: { ...type.lead },
  h2: { ...type.body, fontFamily: fonts.semibold },
  // Nested spans are raw React Native Text so they inherit the paragraph's size and colour.
  strong: { fontFamily: fonts.semibold },
  em: { fontStyle: 'italic' },
  inlineCode: { fontFamily: fonts.mono, backgroundColor: colors.surfaceSunken, borderRadius: radius.sm, paddingHorizontal: 3 },
  codeBlock: { backgroundColor: colors.surfaceSunken, borderRadius: radius.md, padding: space.md },
  codeText: { ...type.small },
  list: { gap: space.xs },
  item: { flexDirection: 'row', gap: space.sm },
  marker: { minWidth: 20, textAlign: 'right' },
  itemText: { flex: 1, minWidth: 0 },
  rule: { height: StyleSheet.hairlineWidth, backgroundColor: colors.line },
});
