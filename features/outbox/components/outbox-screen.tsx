import { useRouter, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { formatWhen } from '@/shared/format';
import { ApiError } from '@/features/api';
import { Button, Card, Heading, Screen, Text, colors, fonts, radius, space, type, useDocumentTitle } from '@/features/ui';
import { appLinks } from '../links';
import { useOutboxQuery } from '../queries';

/** Development only: the e-mails Blazebook would have sent, so their links can be followed. */
export function OutboxScreen() {
  const outbox = useOutboxQuery();
  useDocumentTitle('Outbox');
  const router = useRouter();
  const off = outbox.error instanceof ApiError && outbox.error.status === 404;
  return (
    <Screen>
      <View style={styles.title}>
        <Heading level={1}>Outbox</Heading>
        <Text tone="muted">
          With no mail server set up (SMTP_URL), Blazebook keeps its e-mails here. This page exists in development only.
        </Text>
      </View>
      {off ? <Text>The outbox is switched off on this server (production mode).</Text> : null}
      {outbox.isError && !off ? <Text tone="danger">{outbox.error.message}</Text> : null}
      {outbox.data?.length === 0 ? <Text tone="muted">No e-mails yet.</Text> : null}
      {outbox.data?.map((message) => (
        <Card key={message.id} testID="outbox-message">
          <View style={styles.head}>
            <Heading level={2}>{message.subject}</Heading>
            <Text variant="small" tone="muted">
              To {message.to} · {formatWhen(message.createdAt)}
            </Text>
          </View>
          <Text style={styles.body} selectable>
            {message.text}
          </Text>
          <View style={styles.links}>
            {appLinks(message.text).map((link) => (
              <Button key={link.label} kind="secondary" label="Open the link" accessibilityLabel={`Open the link: ${link.path}`} onPress={() => router.push(link.path as Href)} testID="outbox-open-link" />
            ))}
          </View>
        </Card>
      ))}
    </Screen>
  );
}

const styles = StyleSheet.create({
  title: { gap: space.xs },
  head: { gap: space.xxs },
  body: {
    ...type.small,
    fontFamily: fonts.regular,
    backgroundColor: colors.surfaceSunken,
    borderRadius: radius.md,
    padding: space.md,
    // Long tokens in links must wrap, not push the card wider than a phone; words stay whole.
    overflowWrap: 'anywhere',
  } as object,
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
