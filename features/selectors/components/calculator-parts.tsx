import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Text, colors, fonts, radius, space, type } from '@/features/ui';
import type { SelectorWarning } from '@/shared/selectors';
import type { FieldErrors } from '../form-check';
import type { UvNote } from '../uv-note';

/** Label and value pairs, values in the monospaced face so they line up. */
export function FigureList({ figures, testID }: { figures: readonly { label: string; value: string; id: string }[]; testID: string }) {
  return (
    <View style={styles.figures} testID={testID}>
      {figures.map((figure) => (
        <View key={figure.id} style={styles.figure}>
          <Text variant="small" tone="muted" style={styles.figureLabel}>
            {figure.label}
          </Text>
          <Text variant="number" testID={`${testID}-${figure.id}`} style={styles.figureValue}>
            {figure.value}
          </Text>
        </View>
      ))}
    </View>
  );
}

/** Which fields keep the results from updating, while the last good ones stay on screen. */
export function BlockedNote({ errors, hasResults, testID }: { errors: FieldErrors; hasResults: boolean; testID: string }) {
  const messages = Object.values(errors);
  const shown = messages.slice(0, 3).join('; ');
  const more = messages.length > 3 ? ` and ${messages.length - 3} more` : '';
  return (
    <View role="alert" style={styles.blocked} testID={testID}>
      <Text variant="small" weight="semibold" style={styles.blockedText}>
        {hasResults ? 'Showing the last valid results. ' : ''}Fix {messages.length === 1 ? 'this field' : 'these fields'}
        {hasResults ? ' to update them' : ' to see results'}: {shown}
        {more}.
      </Text>
    </View>
  );
}

/** The answer's warnings in plain words, each with its fix. */
export function WarningNotes({ warnings, testID }: { warnings: readonly SelectorWarning[]; testID: string }) {
  if (warnings.length === 0) return null;
  return (
    <View style={styles.list} testID={testID}>
      {warnings.map((warning) => (
        <View key={warning.code} style={[styles.note, styles.warning]} testID={`${testID}-${warning.code}`}>
          <Text variant="small">{warning.message}</Text>
        </View>
      ))}
    </View>
  );
}

/** A plain note (the material's data range, the bandpass fields). */
export function Note({ children, testID }: { children: ReactNode; testID: string }) {
  return (
    <View style={[styles.note, styles.warning]} testID={testID}>
      <Text variant="small">{children}</Text>
    </View>
  );
}

/** The short ultraviolet caution, ending with the line that hands the decision to the site. */
export function UvNoteView({ note, testID }: { note: UvNote | null; testID: string }) {
  if (!note) return null;
  return (
    <View style={[styles.note, styles.caution]} testID={testID}>
      <Text role="heading" aria-level={3} weight="semibold">
        {note.title}
      </Text>
      <Text variant="small">{note.text}</Text>
      <Text variant="caption" tone="muted">
        {note.closing}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  figure: { minWidth: 140, flexGrow: 1, flexBasis: 140, gap: space.xxs },
  figureLabel: { fontFamily: fonts.semibold },
  figureValue: { ...type.lead, fontFamily: fonts.mono },
  blocked: {
    backgroundColor: colors.dangerSoft,
    borderLeftWidth: 4,
    borderLeftColor: colors.danger,
    borderRadius: radius.sm,
    padding: space.md,
  },
  blockedText: { color: colors.danger },
  list: { gap: space.sm },
  note: { borderLeftWidth: 4, borderRadius: radius.sm, padding: space.md, gap: space.xs },
  warning: { backgroundColor: colors.warningSoft, borderLeftColor: colors.warning },
  caution: { backgroundColor: colors.surface, borderLeftColor: colors.line, borderWidth: 1, borderColor: colors.line },
});
