import type { ReactNode } from 'react';
import { Text as RNText, type StyleProp, type TextProps, type TextStyle } from 'react-native';

type Props = { href: string; style?: StyleProp<TextStyle>; children: ReactNode };

/**
 * Web: a real anchor (react-native-web draws a `Text` with `href` as `<a>`) that opens in a new
 * tab and hands the opened page neither this window (`noopener`) nor this address (`noreferrer`).
 * `href` is always an http:, https: or mailto: URL (`openableHref` in markdown.ts).
 */
export function MarkdownLink({ href, style, children }: Props) {
  // `href` and `hrefAttrs` are react-native-web's Text props; React Native's types do not list them.
  const anchor = { href, hrefAttrs: { target: '_blank', rel: 'noopener noreferrer' } } as TextProps;
  return (
    <RNText {...anchor} style={style}>
      {children}
    </RNText>
  );
}
