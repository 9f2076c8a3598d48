import type { ReactNode } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, minTouch, radius, space, type } from '@/features/ui';

type Props = {
  title: string;
  /** One line shown in the header while collapsed, e.g. "1200/mm · order 1". */
  summary?: string;
  open: boolean;
  collapsible: boolean;
  onToggle: () => void;
  children: ReactNode;
  testID?: string;
};

/** A group of fields; on a phone its header folds it away to keep the results in reach. */
export function EditorSection({ title, summary, open, collapsible, onToggle, children, testID }: Props) {
  const header = (
    <View style={styles.headerText}>
      <Text role="heading" aria-level={3} style={styles.title}>
        {title}
      </Text>
    </View>
  );
  // Under the header, not inside its button: a button's name must hold all its visible text
  // (WCAG 2.5.3), and "Light source not set: show fields" would read worse than the two apart.
  const folded =
    collapsible && !open && summary ? (
      <Text style={styles.summary} numberOfLines={1}>
        {summary}
      </Text>
    ) : null;
  return (
    <View style={styles.section} testID={testID}>
      {collapsible ? (
        <Pressable
          role="button"
          aria-expanded={open}
          aria-label={`${title}: ${open ? 'hide' : 'show'} fields`}
          onPress={onToggle}
          style={styles.header}
        >
          {header}
          <Text style={styles.chevron}>{open ? '▴' : '▾'}</Text>
        </Pressable>
      ) : (
        <View style={styles.header}>{header}</View>
      )}
      {folded}
      {open || !collapsible ? <View style={styles.body}>{children}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  section: {
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    overflow: 'hidden',
  },
  header: {
    minHeight: minTouch,
    flexDirection: 'row',
    alignItems: 'center',
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    gap: space.sm,
  },
  headerText: { flex: 1, minWidth: 0 },
  title: { ...type.lead, fontFamily: fonts.semibold, color: colors.ink },
  summary: {
    ...type.caption,
    fontFamily: fonts.mono,
    color: colors.inkMuted,
    paddingHorizontal: space.lg,
    marginTop: -space.sm,
    paddingBottom: space.sm,
  },
  chevron: { ...type.lead, color: colors.inkMuted },
  body: { paddingHorizontal: space.lg, paddingBottom: space.lg, gap: space.md },
});
