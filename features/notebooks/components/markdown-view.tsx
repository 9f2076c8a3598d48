import { useMemo, type ReactNode } from 'react';
import { Text as RNText, StyleSheet, View } from 'react-native';
import { Text, colors, fonts, radius, space, type } from '@/features/ui';
import { parseMarkdown, type Inline } from '../markdown';
import { MarkdownLink } from './markdown-link';

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
      case 'link':
        return (
          <MarkdownLink key={key} href={span.href} style={styles.link}>
            {renderInline(span.children, key)}
          </MarkdownLink>
        );
      case 'mention':
        return (
          <RNText key={key} aria-label={`mention of ${span.name}`} style={styles.mention}>
            @{span.name}
          </RNText>
        );
    }
  });
}

type Props = {
  source: string;
  testID?: string;
  /** Display names whose `@Name` is drawn as a mention (a remark's mentioned people). */
  mentions?: readonly string[];
  /** What an empty source shows. */
  emptyText?: string;
};

/**
 * Version notes and remarks, read by markdown-it (see `markdown.ts`) and drawn with `Text` only:
 * HTML is shown as its characters, and only http:, https: and mailto: links are links, which
 * open outside (a new tab on the web).
 */
export function MarkdownView({ source, testID, mentions, emptyText = 'No notes for this version.' }: Props) {
  // Keyed by the names, not the array, which callers build afresh on every render.
  const mentionKey = JSON.stringify(mentions ?? []);
  const blocks = useMemo(() => parseMarkdown(source, { mentions: JSON.parse(mentionKey) as string[] }), [source, mentionKey]);
  if (blocks.length === 0) {
    return (
      <Text tone="muted" testID={testID}>
        {emptyText}
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
  // Underlined as well as coloured, so a link is told from text without colour (WCAG 1.4.1).
  link: { color: colors.primary, textDecorationLine: 'underline' },
  mention: { fontFamily: fonts.semibold, color: colors.primary },
  inlineCode: { fontFamily: fonts.mono, backgroundColor: colors.surfaceSunken, borderRadius: radius.sm, paddingHorizontal: 3 },
  codeBlock: { backgroundColor: colors.surfaceSunken, borderRadius: radius.md, padding: space.md },
  codeText: { ...type.small },
  list: { gap: space.xs },
  item: { flexDirection: 'row', gap: space.sm },
  marker: { minWidth: 20, textAlign: 'right' },
  itemText: { flex: 1, minWidth: 0 },
  rule: { height: StyleSheet.hairlineWidth, backgroundColor: colors.line },
});
