import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { Notebook, Version } from '@/shared/notebooks';
import { ApiError } from '@/features/api';
import { useSessionQuery } from '@/features/auth';
import { Heading, RadioGroup, Screen, Text, colors, space } from '@/features/ui';
import { useNotebookQuery, useVersionQuery } from '../queries';
import { DesignTab } from './design-tab';
import { HistoryTab } from './history-tab';
import { SharingTab } from './sharing-tab';

type Tab = 'design' | 'history' | 'sharing';
const tabs: { id: Tab; label: string }[] = [
  { id: 'design', label: 'Design' },
  { id: 'history', label: 'History' },
  { id: 'sharing', label: 'Clone & share' },
];

/** `/notebooks/:id` (the latest version) and `/notebooks/:id/v/:n`. */
export function NotebookScreen() {
  const { notebookId = '', n } = useLocalSearchParams<{ notebookId: string; n?: string }>();
  const session = useSessionQuery();
  const notebook = useNotebookQuery(notebookId);
  const userId = session.data?.user?.id ?? '';

  if (notebook.isError) {
    const gone = notebook.error instanceof ApiError && notebook.error.status === 404;
    return (
      <Screen>
        <Heading level={1}>{gone ? 'No such design' : 'The design could not be loaded'}</Heading>
        <Text tone="muted">{gone ? 'It does not exist, or it belongs to a team you are not in.' : notebook.error.message}</Text>
      </Screen>
    );
  }
  if (!notebook.data || !userId) {
    return (
      <Screen>
        <Text tone="muted">Loading the design…</Text>
      </Screen>
    );
  }
  const requested = n === undefined ? notebook.data.version.number : Number(n);
  return <NotebookView design={notebook.data.design} latest={notebook.data.version} requested={requested} userId={userId} />;
}

function NotebookView({ design, latest, requested, userId }: { design: Notebook; latest: Version; requested: number; userId: string }) {
  const router = useRouter();
  const insets = useSafeAreaInsets();
  const [tab, setTab] = useState<Tab>('design');
  const [epoch, setEpoch] = useState(0);
  const [rebaseNote, setRebaseNote] = useState<string | null>(null);
  const validRequest = Number.isInteger(requested) && requested >= 1 && requested <= latest.number;
  const older = useVersionQuery(design.id, validRequest && requested !== latest.number ? requested : null);
  const version = requested === latest.number ? latest : (older.data ?? null);

  const restart = (note?: string) => {
    setRebaseNote(note ?? null);
    setEpoch((e) => e + 1);
  };

  const top = (
    <View style={[styles.top, { paddingTop: insets.top + space.sm }]}>
      <Pressable role="link" onPress={() => router.push(`/teams/${design.teamId}/notebooks` as Href)} style={styles.back} testID="to-design-list">
        <Text variant="small" weight="semibold" style={styles.backText}>
          ← Team designs
        </Text>
      </Pressable>
      <View style={styles.titleRow}>
        <Heading level={1} testID="notebook-title">
          {design.title}
        </Heading>
        {design.archived ? (
          <Text variant="small" tone="warning" weight="semibold">
            Archived
          </Text>
        ) : null}
      </View>
      {design.clonedFrom ? (
        <Text variant="small" tone="muted" testID="provenance">
          from{' '}
          {design.clonedFrom.designId ? (
            <Text
              variant="small"
              weight="semibold"
              role="link"
              style={styles.inlineLink}
              onPress={() => router.push(`/notebooks/${design.clonedFrom?.designId}/v/${design.clonedFrom?.version}` as Href)}
            >
              {design.clonedFrom.title} v{design.clonedFrom.version}
            </Text>
          ) : (
            `${design.clonedFrom.title} v${design.clonedFrom.version}`
          )}
        </Text>
      ) : null}
      <RadioGroup
        label="Notebook sections"
        options={tabs.map((item) => ({ value: item.id, label: item.id === 'history' ? `${item.label} (${latest.number})` : item.label }))}
        value={tab}
        onChange={setTab}
        size="compact"
        optionTestID={(id) => `tab-${id}`}
        style={styles.tabs}
      />
    </View>
  );

  let body;
  if (!validRequest || older.isError) {
    body = (
      <Screen>
        <Heading level={2}>No version {String(requested)}</Heading>
        <Text tone="muted">This design has versions 1 to {latest.number}.</Text>
      </Screen>
    );
  } else if (!version) {
    body = (
      <Screen>
        <Text tone="muted">Loading v{requested}…</Text>
      </Screen>
    );
  } else if (tab === 'design') {
    body = (
      <DesignTab
        key={`${version.number}:${epoch}`}
        design={design}
        version={version}
        latest={latest}
        userId={userId}
        onRestart={restart}
        rebaseNote={rebaseNote}
      />
    );
  } else if (tab === 'history') {
    body = <HistoryTab design={design} current={version.number} />;
  } else {
    body = <SharingTab design={design} version={version} />;
  }

  return (
    <View style={styles.root}>
      {top}
      <View style={styles.body}>{body}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.paper },
  body: { flex: 1 },
  top: {
    paddingHorizontal: space.lg,
    paddingBottom: space.sm,
    gap: space.xs,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
    backgroundColor: colors.surface,
  },
  back: { alignSelf: 'flex-start', minHeight: 28, justifyContent: 'center' },
  backText: { color: colors.primary },
  titleRow: { flexDirection: 'row', alignItems: 'baseline', flexWrap: 'wrap', columnGap: space.md },
  inlineLink: { color: colors.primary, textDecorationLine: 'underline' },
  tabs: { paddingTop: space.xs },
});
