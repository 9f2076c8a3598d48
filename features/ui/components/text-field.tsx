import { forwardRef, useId, type ReactNode } from 'react';
import { StyleSheet, Text, TextInput, View, type TextInputProps } from 'react-native';
import { colors, fonts, minTouch, radius, space, type } from '../theme';

type Props = Omit<TextInputProps, 'style'> & {
  label: string;
  /** Plain-words reason the value is refused; shown under the field and announced. */
  error?: string | null;
  /** What the value means once understood, e.g. "= 500 mm". */
  hint?: string | null;
  /** Unit shown after the box when the user may leave it out. */
  unit?: string;
  numeric?: boolean;
  /** Controls beside the box, such as stepper buttons. */
  before?: ReactNode;
  after?: ReactNode;
  /** Draws attention to the field (e.g. after tapping a warning about it). */
  highlighted?: boolean;
};

/** A labelled input whose label, hint and error are tied to it for screen readers. */
export const TextField = forwardRef<TextInput, Props>(function TextField(
  { label, error, hint, unit, numeric = false, testID, before, after, highlighted = false, ...input },
  ref,
) {
  const id = useId();
  const messageId = `${id}-message`;
  const message = error ?? hint;
  return (
    <View style={styles.root}>
      <Text nativeID={`${id}-label`} style={styles.label}>
        {label}
      </Text>
      <View style={styles.row}>
        {before}
        <View style={[styles.box, highlighted && styles.boxHighlighted, error ? styles.boxError : null]}>
          <TextInput
            {...input}
            ref={ref}
            testID={testID}
            aria-labelledby={`${id}-label`}
            aria-describedby={message ? messageId : undefined}
            aria-invalid={error ? true : undefined}
            accessibilityLabel={label}
            style={[styles.input, numeric && styles.numeric]}
            placeholderTextColor={colors.inkFaint}
          />
          {unit ? <Text style={styles.unit}>{unit}</Text> : null}
        </View>
        {after}
      </View>
      {message ? (
        <Text
          nativeID={messageId}
          role={error ? 'alert' : undefined}
          style={[styles.message, error ? styles.error : styles.hint]}
        >
          {message}
        </Text>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  root: { gap: space.xs },
  label: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  box: {
    flex: 1,
    minHeight: minTouch,
    flexDirection: 'row',
    alignItems: 'center',
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
    paddingHorizontal: space.md,
  },
  boxHighlighted: { borderColor: colors.accent, borderWidth: 2, backgroundColor: '#FFF8F1' },
  boxError: { borderColor: colors.danger, borderWidth: 2 },
  input: {
    flex: 1,
    minWidth: 0,
    ...type.body,
    fontFamily: fonts.regular,
    color: colors.ink,
    paddingVertical: space.sm,
  },
  numeric: { fontFamily: fonts.mono },
  unit: { ...type.small, fontFamily: fonts.mono, color: colors.inkMuted, marginLeft: space.sm },
  message: { ...type.caption },
  hint: { color: colors.inkMuted, fontFamily: fonts.regular },
  error: { color: colors.danger, fontFamily: fonts.semibold },
});
