import type { ReactNode } from 'react';
import { Text as RNText, StyleSheet, type TextProps, type TextStyle } from 'react-native';
import { colors, fonts, type } from '../theme';

type Variant = 'body' | 'lead' | 'small' | 'caption' | 'number';
type Tone = 'default' | 'muted' | 'danger' | 'warning' | 'ok' | 'onPrimary';

type Props = TextProps & {
  children: ReactNode;
  variant?: Variant;
  tone?: Tone;
  weight?: 'regular' | 'semibold';
};

const toneColor: Record<Tone, string> = {
  default: colors.ink,
  muted: colors.inkMuted,
  danger: colors.danger,
  warning: colors.warning,
  ok: colors.ok,
  onPrimary: colors.onPrimary,
};

/** Body copy. `variant="number"` sets figures in the monospaced face so values line up. */
export function Text({ children, variant = 'body', tone = 'default', weight, style, ...rest }: Props) {
  const family =
    variant === 'number' ? fonts.mono : weight === 'semibold' ? fonts.semibold : fonts.regular;
  return (
    <RNText
      {...rest}
      style={[styles[variant], { color: toneColor[tone], fontFamily: family }, style]}
    >
      {children}
    </RNText>
  );
}

const styles = StyleSheet.create<Record<Variant, TextStyle>>({
  body: { ...type.body },
  lead: { ...type.lead },
  small: { ...type.small },
  caption: { ...type.caption, letterSpacing: 0.2 },
  number: { ...type.body, fontVariant: ['tabular-nums'] },
});
