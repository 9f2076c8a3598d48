import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card, Heading, Screen, Text, space } from '@/features/ui';

type Props = { title: string; lead?: string; children: ReactNode; footer?: ReactNode };

/** The frame of every account screen: one narrow card, readable on a phone and a wide screen. */
export function AuthCard({ title, lead, children, footer }: Props) {
  return (
    <Screen>
      <View style={styles.column}>
        <Card>
          <Heading level={1}>{title}</Heading>
          {lead ? <Text tone="muted">{lead}</Text> : null}
          <View style={styles.body}>{children}</View>
        </Card>
        {footer ? <View style={styles.footer}>{footer}</View> : null}
      </View>
    </Screen>
  );
}

/** A message above the submit button for what no single field is to blame for. */
export function FormError({ message }: { message: string | null }) {
  if (!message) return null;
  return (
    <Text role="alert" tone="danger" weight="semibold" testID="form-error">
      {message}
    </Text>
  );
}

const styles = StyleSheet.create({
  column: { width: '100%', maxWidth: 460, alignSelf: 'center', gap: space.lg, paddingTop: space.lg },
  body: { gap: space.md },
  footer: { gap: space.sm, alignItems: 'center' },
});
