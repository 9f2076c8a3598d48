import type { ReactNode } from 'react';
import { Linking, Text as RNText, type StyleProp, type TextStyle } from 'react-native';

type Props = { href: string; style?: StyleProp<TextStyle>; children: ReactNode };

/** Native: the address opens outside the app, in the browser or mail app that handles it. */
export function MarkdownLink({ href, style, children }: Props) {
  return (
    <RNText
      role="link"
      accessibilityHint="Opens outside the app"
      style={style}
      onPress={() => {
        Linking.openURL(href).catch(() => undefined);
      }}
    >
      {children}
    </RNText>
  );
}
