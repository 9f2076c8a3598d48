import { Link, useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { formatWhen } from '@/shared/format';
import { inboxKindLabels, type InboxItem } from '@/shared/reviews';
import { Button, Heading, Screen, SwitchRow, Text, colors, fonts, radius, space, type, useDocumentTitle } from '@/features/ui';
import { inboxItemPath, inboxItemSubject } from '../links';
import { useInboxQuery, useMarkReadMutation } from '../queries';

function InboxRow({ item, onOpen }: { item: InboxItem; onOpen: (item: InboxItem) => void }) {
  const unread = item.readAt === null;
  return (
    <View role="listitem">
      <Pressable
        role="link"
        onPress={() => onOpen(item)}
        testID={`inbox-item-${item.id}`}
        style={({ hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
          styles.item,
          unread && styles.itemUnread,
          hovered && styles.itemHovered,
          focused && styles.itemFocused,
        ]}
      >
        <View style={styles.itemHead}>
          {unread ? (
            <Text style={styles.unreadTag} testID="inbox-item-unread">
              Unread
            </Text>
          ) : null}
          <Text weight="semibold" style={styles.kind}>
            {inboxKindLabels[item.kind]}
          </Text>
          <Text variant="small" tone="muted">
            {formatWhen(item.createdAt)}
          </Text>
        </View>
        <Text weight={unread ? 'semibold' : 'regular'}>{inboxItemSubject(item)}</Text>
        <Text variant="small" tone="muted" numberOfLines={3}>
          <Text variant="small" weight="semibold" tone="muted">
            {item.actor?.displayName ?? 'A former member'}
          </Text>
          {item.excerpt ? `: ${item.excerpt}` : null}
        </Text>
      </Pressable>
    </View>
  );
}

/** What waits for the signed-in person: review requests, mentions, threads and decisions, newest first. */
export function InboxScreen() {
  useDocumentTitle('Inbox');
  const router = useRouter();
  const [onlyUnread, setOnlyUnread] = useState(false);
  const inbox = useInboxQuery(onlyUnread);
  const markRead = useMarkReadMutation();
  const items = inbox.data?.items;
  const unread = inbox.data?.unread ?? 0;

  const open = (item: InboxItem) => {
    // The mutation outlives this screen; the badge follows its answer.
    if (item.readAt === null) markRead.mutate({ ids: [item.id] });
    router.push(inboxItemPath(item) as Href);
  };

  return (
    <Screen>
      <View style={styles.title}>
        <Heading level={1} testID="inbox-heading">
          Inbox
        </Heading>
        <Text tone="muted">
          Review requests for you, remarks that mention you, new threads and remarks on your designs, and decisions on
          your versions.
        </Text>
      </View>

      <View style={styles.tools}>
        <View style={styles.toggle}>
          <SwitchRow label="Only unread" value={onlyUnread} onChange={setOnlyUnread} testID="inbox-only-unread" />
        </View>
        {inbox.data ? (
          <Text variant="small" tone="muted" testID="inbox-unread-count">
            {unread === 0 ? 'Nothing unread' : `${unread} unread`}
          </Text>
        ) : null}
        <Button
          kind="secondary"
          label={markRead.isPending ? 'Marking…' : 'Mark all read'}
          onPress={() => markRead.mutate({ all: true })}
          disabled={unread === 0 || markRead.isPending}
          testID="inbox-mark-all-read"
        />
      </View>

      {markRead.isError ? (
        <Text tone="danger" role="alert">
          Could not mark as read: {markRead.error.message}
        </Text>
      ) : null}
      {inbox.isPending ? <Text tone="muted">Loading your inbox…</Text> : null}
      {inbox.isError ? (
        <View style={styles.error} role="alert">
          <Text tone="danger">Your inbox could not be loaded: {inbox.error.message}</Text>
          <View style={styles.row}>
            <Button kind="secondary" label="Try again" onPress={() => void inbox.refetch()} />
          </View>
        </View>
      ) : null}

      {items?.length === 0 ? (
        <View style={styles.empty} testID="inbox-empty">
          {onlyUnread ? (
            <Text>Nothing unread: you have read everything here. Turn off “Only unread” to see it all.</Text>
          ) : (
            <Text>
              Nothing waits for you yet. When someone asks you to review a version, mentions you in a remark, starts a
              thread or replies on your designs, or records a decision on your version, it shows up here.
            </Text>
          )}
        </View>
      ) : null}

      {items && items.length > 0 ? (
        <View role="list" style={styles.list} testID="inbox-list">
          {items.map((item) => (
            <InboxRow key={item.id} item={item} onOpen={open} />
          ))}
        </View>
      ) : null}

      <View style={styles.row}>
        <Link href={'/settings' as Href} asChild>
          <Pressable role="link" testID="inbox-settings-link" style={styles.settingsLink}>
            <Text weight="semibold" style={styles.settingsText}>
              Review e-mail settings
            </Text>
          </Pressable>
        </Link>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  title: { gap: space.xs },
  tools: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  toggle: { minWidth: 180 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  error: { gap: space.sm },
  empty: {
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.lg,
  },
  list: { gap: space.sm },
  item: {
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    borderLeftWidth: 4,
    paddingVertical: space.md,
    paddingHorizontal: space.lg,
    gap: space.xs,
  },
  itemUnread: { borderLeftColor: colors.accent, backgroundColor: colors.surface },
  itemHovered: { backgroundColor: colors.surfaceSunken },
  itemFocused: { borderColor: colors.focus },
  itemHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: space.sm, rowGap: space.xxs },
  kind: { flexShrink: 1 },
  unreadTag: {
    ...type.caption,
    fontFamily: fonts.bold,
    color: colors.onPrimary,
    backgroundColor: colors.accent,
    borderRadius: radius.sm,
    paddingHorizontal: space.xs,
    overflow: 'hidden',
  },
  // One flat style object: Link's slot merges plain objects only.
  settingsLink: { paddingVertical: space.sm, borderRadius: radius.md },
  settingsText: { color: colors.primary, textDecorationLine: 'underline' },
});
