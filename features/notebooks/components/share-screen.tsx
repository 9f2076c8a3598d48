import { useLocalSearchParams } from 'expo-router';
import { useCallback } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/features/api';
import { SheetButton } from '@/features/sheets';
import { Card, Heading, Screen, Text, colors, space, useDocumentTitle } from '@/features/ui';
import { draftFromDesign, Workbench } from '@/features/workbench';
import { formatDay, formatWhen } from '../format';
import { useSharedVersionQuery } from '../queries';
import { MarkdownView } from './markdown-view';

const ignore = () => undefined;

/**
 * `/share/:token`, outside the signed-in group: one version read-only, its notes and plots. The
 * answer holds nothing else (no members, comments or other designs), so nothing else can show.
 */
export function ShareScreen() {
  const { token = '' } = useLocalSearchParams<{ token: string }>();
  const shared = useSharedVersionQuery(token);
  const data = shared.data;
  // The workbench mounts only once the version is here, and reads this once.
  const params = data?.version.params;
  const initial = useCallback(() => draftFromDesign(params as NonNullable<typeof params>), [params]);
  useDocumentTitle(data ? `${data.title} v${data.version.number} (shared)` : shared.isError ? 'Shared design not found' : 'Shared design');

  if (shared.isError) {
    const gone = shared.error instanceof ApiError && (shared.error.status === 404 || shared.error.status === 400);
    return (
      <Screen>
        <Heading level={1}>{gone ? 'This link does not work' : 'The design could not be loaded'}</Heading>
        <Text tone="muted" testID="share-error">
          {gone ? 'It may have expired or been revoked. Ask the design’s owner for a new one.' : shared.error.message}
        </Text>
      </Screen>
    );
  }
  if (!data) {
    return (
      <Screen>
        <Text tone="muted">Loading the shared design…</Text>
      </Screen>
    );
  }
  const { version } = data;
  return (
    <Workbench
      key={`${token}:${version.number}`}
      initial={initial}
      onDraftChange={ignore}
      readOnly
      header={
        <View style={styles.header}>
          <Text variant="caption" tone="muted" weight="semibold">
            SHARED DESIGN · READ-ONLY
          </Text>
          <Heading level={1} testID="shared-title">
            {data.title}
          </Heading>
          <View style={styles.versionLine}>
            <Text weight="semibold">
              v{version.number}
              {data.pinned ? '' : ' (the latest version)'}
            </Text>
            <Text variant="small" tone="muted">
              “{version.message}” · {formatWhen(version.createdAt)}
            </Text>
            {data.expiresAt ? (
              <Text variant="small" tone="muted">
                This link works until {formatDay(data.expiresAt)}.
              </Text>
            ) : null}
          </View>
          <SheetButton target={{ kind: 'shared', token, version: version.number, title: data.title }} />
          <Card title="Notes" testID="notes-card">
            <MarkdownView source={version.notes} testID="notes" />
          </Card>
        </View>
      }
    />
  );
}

const styles = StyleSheet.create({
  header: { gap: space.md },
  versionLine: { gap: space.xxs, borderLeftWidth: 3, borderLeftColor: colors.accent, paddingLeft: space.sm },
});
