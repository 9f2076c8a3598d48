import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { Notebook, Version } from '@/shared/notebooks';
import { ApiError } from '@/features/api';
import { useSessionQuery } from '@/features/auth';
import { Button, Heading, RadioGroup, Screen, Text, colors, space, useDocumentTitle, useLayout } from '@/features/ui';
import { useCloneMutation, useNotebookQuery, useVersionQuery } from '../queries';
import { DesignTab } from './design-tab';
import { HistoryTab } from './history-tab';
import { OriginNote } from './origin-note';
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

  // A background refetch that fails keeps the design on screen: only a first load that fails replaces it.
  if (notebook.isError && !notebook.data) {
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
  // On a phone the header scrolls away with the page: only the app bar and the read-out line stay.
  const layout = useLayout();
  const phone = layout === 'phone';
  const clone = useCloneMutation(design.id);
  const baseline = design.baselineVersion;
  const cloneSource = baseline ?? latest.number;
  const cloneLabel = baseline !== null ? `Clone baseline (v${baseline})` : `Clone latest (v${latest.number})`;
  const cloneNow = async () => {
    // The server's defaults: into the caller's personal workspace, under the same title.
    const made = await clone.mutateAsync({ version: cloneSource });
    router.push(`/notebooks/${made.design.id}` as Href);
  };
  const validRequest = Number.isInteger(requested) && requested >= 1 && requested <= latest.number;
  const older = useVersionQuery(design.id, validRequest && requested !== latest.number ? requested : null);
  const version = requested === latest.number ? latest : (older.data ?? null);
  useDocumentTitle(`${design.title} v${validRequest ? requested : latest.number}`);

  const restart = (note?: string) => {
    setRebaseNote(note ?? null);
    setEpoch((e) => e + 1);
  };

  const sections = (
    <RadioGroup
      label="Notebook sections"
      options={tabs.map((item) => ({ value: item.id, label: item.id === 'history' ? `${item.label} (${latest.number})` : item.label }))}
      value={tab}
      onChange={setTab}
      size="compact"
      optionTestID={(id) => `tab-${id}`}
      style={layout === 'wide' ? styles.tabsInRow : styles.tabs}
    />
  );
  const top = (
    <View style={phone ? styles.topInline : [styles.top, { paddingTop: insets.top + space.sm }]} testID="notebook-header">
      <View style={styles.titleRow}>
        <Pressable role="link" onPress={() => router.push(`/teams/${design.teamId}/notebooks` as Href)} style={styles.back} testID="to-design-list">
          <Text variant="small" weight="semibold" style={styles.backText}>
            ← Team designs
          </Text>
        </Pressable>
        <Heading level={1} testID="notebook-title">
          {design.title}
        </Heading>
        {design.archived ? (
          <Text variant="small" tone="warning" weight="semibold">
            Archived
          </Text>
        ) : null}
        {baseline !== null ? (
          <Pressable
            role="link"
            onPress={() => router.push(`/notebooks/${design.id}/v/${baseline}` as Href)}
            style={styles.baseline}
            testID="baseline-link"
          >
            <Text variant="small" weight="semibold" style={styles.baselineText}>
              Baseline: v{baseline}
            </Text>
          </Pressable>
        ) : null}
        <Button
          kind="secondary"
          label={clone.isPending ? 'Cloning…' : cloneLabel}
          onPress={() => void cloneNow().catch(() => undefined)}
          disabled={clone.isPending}
          testID="clone-default"
        />
        {layout === 'wide' ? sections : null}
      </View>
      {clone.isError ? (
        <Text role="alert" tone="danger" variant="small">
          {clone.error.message}
        </Text>
      ) : null}
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
      <OriginNote design={design} />
      {layout === 'wide' ? null : sections}
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
        top={phone ? top : undefined}
      />
    );
  } else if (tab === 'history') {
    body = <HistoryTab design={design} current={version.number} top={phone ? top : undefined} />;
  } else {
    body = <SharingTab design={design} version={version} top={phone ? top : undefined} />;
  }

  const topInBody = phone && version !== null && validRequest && !older.isError;
  return (
    <View style={styles.root}>
      {topInBody ? null : <View style={phone ? styles.topPhoneFixed : undefined}>{top}</View>}
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
  // Scrolls with the editor on a phone: no frame of its own, the page's padding around it.
  topInline: { gap: space.xs, paddingBottom: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  topPhoneFixed: { paddingHorizontal: space.lg, paddingTop: space.sm, backgroundColor: colors.surface },
  back: { minHeight: 32, justifyContent: 'center' },
  backText: { color: colors.primary },
  titleRow: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xs },
  baseline: {
    minHeight: 32,
    justifyContent: 'center',
    paddingHorizontal: space.sm,
    borderRadius: 4,
    backgroundColor: colors.accent,
  },
  baselineText: { color: colors.onPrimary, textDecorationLine: 'underline' },
  inlineLink: { color: colors.primary, textDecorationLine: 'underline' },
  tabs: { paddingTop: space.xs },
  // Wide screens have the room: one header line keeps the fixed part short.
  tabsInRow: { marginLeft: 'auto' },
});
