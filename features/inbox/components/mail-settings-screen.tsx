import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { mailSettingsLabels, type MailSettings } from '@/shared/reviews';
import { Button, Card, Heading, Screen, SwitchRow, Text, colors, radius, space, useDocumentTitle } from '@/features/ui';
import { useMailSettingsQuery, useUpdateMailSettingsMutation } from '../queries';


const kinds = Object.keys(mailSettingsLabels) as (keyof MailSettings)[];

/** "Saving…", "Saved", or why not: read out as it changes (role=status). */
function saveStatus(update: ReturnType<typeof useUpdateMailSettingsMutation>): { text: string; tone: 'muted' | 'ok' | 'danger' } {
  if (update.isPending) return { text: 'Saving…', tone: 'muted' };
  if (update.isError) return { text: `Not saved: ${update.error.message}`, tone: 'danger' };
  if (update.isSuccess) return { text: 'Saved', tone: 'ok' };
  return { text: '', tone: 'muted' };
}

/** The signed-in person's settings: for now, which review e-mails they get. Each switch saves at once. */
export function MailSettingsScreen() {
  useDocumentTitle('Settings');
  const settings = useMailSettingsQuery();
  const update = useUpdateMailSettingsMutation();
  // While a change is on its way the switch shows what was asked for, not the old answer; a second
  // change meanwhile builds on the first (switches stay enabled, so the keyboard focus stays put).
  const shown = update.isPending && update.variables ? update.variables : settings.data;
  const status = saveStatus(update);

  const change = (kind: keyof MailSettings, on: boolean) => {
    if (!shown) return;
    update.mutate({ ...shown, [kind]: on });
  };

  return (
    <Screen>
      <Heading level={1} testID="settings-heading">
        Settings
      </Heading>
      <Card title="Review e-mails">
        <Text tone="muted">
          Choose which review events also reach you by e-mail. Your inbox keeps every event whatever you choose here.
        </Text>
        {settings.isPending ? <Text tone="muted">Loading your settings…</Text> : null}
        {settings.isError ? (
          <View style={styles.error} role="alert">
            <Text tone="danger">Your settings could not be loaded: {settings.error.message}</Text>
            <View style={styles.row}>
              <Button kind="secondary" label="Try again" onPress={() => void settings.refetch()} />
            </View>
          </View>
        ) : null}
        {shown ? (
          <View style={styles.switches}>
            {kinds.map((kind) => (
              <SwitchRow
                key={kind}
                label={mailSettingsLabels[kind]}
                value={shown[kind]}
                onChange={(on) => change(kind, on)}
                testID={`mail-setting-${kind}`}
              />
            ))}
          </View>
        ) : null}
        <Text role="status" variant="small" tone={status.tone} weight="semibold" testID="mail-settings-status">
          {status.text}
        </Text>
      </Card>
      <View style={styles.row}>
        <Link href={'/inbox' as Href} asChild>
          <Pressable role="link" testID="settings-inbox-link" style={styles.link}>
            <Text weight="semibold" style={styles.linkText}>
              Open your inbox
            </Text>
          </Pressable>
        </Link>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  switches: { gap: space.xs },
  error: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  // One flat style object: Link's slot merges plain objects only.
  link: { paddingVertical: space.sm, borderRadius: radius.md },
  linkText: { color: colors.primary, textDecorationLine: 'underline' },
});
