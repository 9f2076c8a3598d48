import { Link, type Href } from 'expo-router';
import { StyleSheet } from 'react-native';
import { colors, fonts, type } from '@/features/ui';

/** An in-app link set in the text face, underlined so it reads as a link without colour alone. */
export function TextLink({ href, label, testID }: { href: Href; label: string; testID?: string }) {
  return (
    <Link href={href} style={styles.link} testID={testID}>
      {label}
    </Link>
  );
}

const styles = StyleSheet.create({
  link: { ...type.body, fontFamily: fonts.semibold, color: colors.primary, textDecorationLine: 'underline' },
});
